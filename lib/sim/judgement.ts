import { decodeWaveform, type Decoding, type ReceiverRule, type SlotTiming } from "./decoder";
import type { BitLevels } from "./metrics";
import { bandCorners, type Comparator, type JudgementName, type SwitchingBand } from "./receiver";
import type { Waveform } from "./waveform";

/**
 * One judgement of a run (receiver.ts): does every bit decode at every switching point of the
 * band? Each bit is read at the band's two extreme comparators, which bound its pulse widths, and
 * the voltage margins (metrics.ts) check that no switching point in between sees the far end turn
 * back through it.
 */

export type Corner = "highest" | "lowest";

export type Judgement = {
  name: JudgementName;
  pass: boolean;
  band: SwitchingBand;
  /** Worst bit's distance from a wrong reading in time (s), over the band and the bits holding one complete pulse at both extremes; null when none does. */
  timingMargin: number | null;
  /** Worst bit's distance from a wrong reading in voltage (V), over the band. */
  voltageMargin: number;
  /** Bits read wrongly at one of the band's extremes. */
  bitErrors: number;
};

/** A judgement with the readings behind it, for the verdict's reasons. */
export type JudgedBand = Judgement & {
  readings: Record<Corner, { comparator: Comparator; decoding: Decoding }>;
  bitTimingMargins: (number | null)[];
};

export type ReadingRule = Omit<ReceiverRule, "rise" | "fall">;

export type BandContext = {
  wave: Waveform;
  slots: SlotTiming[];
  bitPeriod: number;
  delay: number;
  rule: ReadingRule;
  levels: BitLevels[];
};

const readsAsSent = (decoding: Decoding, i: number) => decoding.bits[i].received === String(decoding.bits[i].sent);

export function judgeBand(name: JudgementName, band: SwitchingBand, context: BandContext): JudgedBand {
  const corners = bandCorners(band);
  const read = (comparator: Comparator) => ({
    comparator,
    decoding: decodeWaveform(context.wave, context.slots, context.bitPeriod, context.delay, { ...context.rule, ...comparator }),
  });
  const readings = { highest: read(corners.highest), lowest: read(corners.lowest) };
  const high = readings.highest.decoding;
  const low = readings.lowest.decoding;
  const bitTimingMargins = high.bits.map((bit, i) => {
    const a = bit.timingMargin;
    const b = low.bits[i].timingMargin;
    return a === null || b === null ? null : Math.min(a, b);
  });
  const bitErrors = high.bits.filter((_, i) => !readsAsSent(high, i) || !readsAsSent(low, i)).length;
  const present = bitTimingMargins.filter((margin): margin is number => margin !== null);
  const timingMargin = present.length > 0 ? present.reduce((a, b) => Math.min(a, b)) : null;
  const voltageMargin = context.levels.reduce((worst, level) => Math.min(worst, level.margins[name].voltageMargin), Infinity);
  const extra = high.extraPulses.length + low.extraPulses.length;
  return {
    name,
    pass: bitErrors === 0 && extra === 0 && voltageMargin >= 0 && timingMargin !== null && timingMargin >= 0,
    band,
    timingMargin,
    voltageMargin,
    bitErrors,
    readings,
    bitTimingMargins,
  };
}

/** The judgement without its readings: what a result carries. */
export function publicJudgement(judged: JudgedBand): Judgement {
  const { name, pass, band, timingMargin, voltageMargin, bitErrors } = judged;
  return { name, pass, band, timingMargin, voltageMargin, bitErrors };
}
