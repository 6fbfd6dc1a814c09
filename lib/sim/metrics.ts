import type { DecodedBit } from "./decoder";
import { EDGE_BUMP_SHARE, JUDGEMENTS, bandCorners, type JudgementName, type SwitchingBand } from "./receiver";
import { extremes, firstReach, indexAt, valueAt, type Waveform } from "./waveform";

/**
 * Measurements of the far-end waveform. Windows are placed by the driver's timing shifted by
 * the line delay: the far end cannot answer an edge sooner.
 */

export type Extreme = { value: number; time: number };

/** A bit's voltage margins over one switching band (V): negative where some switching point in the band misreads it. */
export type BandMargins = {
  /** Peak of the high period above the highest rise level. */
  reach: number;
  /** Inside the pulse: the worst distance above the fall level of the switching points the pulse has already started at; null without a turn back. */
  hold: Extreme | null;
  /** The lowest fall level above the low period's lowest voltage. */
  fall: number;
  /** After the fall: the worst distance below the rise level of the switching points the pulse has already ended at; null without a turn back. */
  ringBack: Extreme | null;
  /** The smallest of the four. */
  voltageMargin: number;
};

export type BitLevels = {
  /** Highest far-end voltage while the bit is driven high (V). */
  highPeak: number;
  highPeakTime: number;
  /** Lowest far-end voltage while the bit is driven low (V). */
  lowTrough: number;
  lowTroughTime: number;
  margins: Record<JudgementName, BandMargins>;
};

export type RunMetrics = {
  /** Worst 10–90 % rise time of the far end, over the bits where it completes (s). */
  riseTime: number | null;
  /** Worst 90–10 % fall time of the far end (s). */
  fallTime: number | null;
  /** Highest excursion above the settled high level (V). */
  overshoot: number;
  /** Lowest excursion below 0 V (V). */
  undershoot: number;
  /** Worst time from the driver's rising edge until the far end stays within ±5 % of the settled level (s); null if it never settles within a high time. */
  settlingTime: number | null;
  /** Widest pulse of a 0 bit, read at the typical switching point (s). */
  zeroHighTime: number | null;
  /** Narrowest pulse of a 1 bit, read at the typical switching point (s). */
  oneHighTime: number | null;
  clampCurrentPeak: number;
  delay: number;
};

const SETTLING_BAND = 0.05;

/**
 * Inside a high period: for every switching point s of the band the pulse has started at (the
 * far end has risen through s + h/2), how far the far end stays above s − h/2. At a moment when
 * the running peak is M, the switching points started at reach up to min(highest, M − h/2), so the
 * worst fall level is min(highest − h/2, M − h). Turns back from the peak by less than the edge
 * bump (receiver.ts) are not counted. Fed the window's points in time order.
 */
class HoldScan {
  private peak = -Infinity;
  private worst = Infinity;
  private worstTime = 0;
  private readonly firstRise: number;
  private readonly lastRise: number;
  private readonly lastFall: number;

  constructor(
    band: SwitchingBand,
    private readonly bump: number,
  ) {
    this.firstRise = band.lowest + band.hysteresis / 2;
    this.lastRise = band.highest + band.hysteresis / 2;
    this.lastFall = band.highest - band.hysteresis / 2;
  }

  visit(t: number, v: number): void {
    if (v >= this.peak) {
      this.peak = v;
      return;
    }
    if (this.peak < this.firstRise) return;
    if (this.peak - v < this.bump) return;
    const margin = v - Math.min(this.lastFall, this.peak - (this.lastRise - this.lastFall));
    if (margin < this.worst) {
      this.worst = margin;
      this.worstTime = t;
    }
  }

  result(): Extreme | null {
    return this.worst === Infinity ? null : { value: this.worst, time: this.worstTime };
  }
}

/** The mirror of HoldScan for a low period: after the fall, how far the far end stays below the rise level of each switching point the pulse has ended at. */
class RingBackScan {
  private trough = Infinity;
  private worst = Infinity;
  private worstTime = 0;
  private readonly firstFall: number;
  private readonly lastFall: number;
  private readonly lastRise: number;

  constructor(
    band: SwitchingBand,
    private readonly bump: number,
  ) {
    this.firstFall = band.highest - band.hysteresis / 2;
    this.lastFall = band.lowest - band.hysteresis / 2;
    this.lastRise = band.lowest + band.hysteresis / 2;
  }

  visit(t: number, v: number): void {
    if (v <= this.trough) {
      this.trough = v;
      return;
    }
    if (this.trough > this.firstFall) return;
    if (v - this.trough < this.bump) return;
    const margin = Math.max(this.lastRise, this.trough + (this.lastRise - this.lastFall)) - v;
    if (margin < this.worst) {
      this.worst = margin;
      this.worstTime = t;
    }
  }

  result(): Extreme | null {
    return this.worst === Infinity ? null : { value: this.worst, time: this.worstTime };
  }
}

type Visitor = { visit(t: number, v: number): void };

/**
 * One pass over [from, to]: the extreme value (sign +1: highest, −1: lowest; endpoints
 * interpolated, the start winning ties, then the end), every visitor fed each point in order.
 */
function scanWindow(wave: Waveform, from: number, to: number, sign: number, visitors: Visitor[]): Extreme {
  const first = valueAt(wave, from);
  const last = valueAt(wave, to);
  let best = sign * first;
  let bestTime = from;
  if (sign * last > best) {
    best = sign * last;
    bestTime = to;
  }
  for (const visitor of visitors) visitor.visit(from, first);
  const { time, value, count } = wave;
  for (let i = indexAt(wave, from) + 1; i < count && time[i] < to; i += 1) {
    const v = value[i];
    if (sign * v > best) {
      best = sign * v;
      bestTime = time[i];
    }
    for (const visitor of visitors) visitor.visit(time[i], v);
  }
  for (const visitor of visitors) visitor.visit(to, last);
  return { value: sign * best, time: bestTime };
}

/**
 * The far end's levels over one bit, and its voltage margins over each switching band: how far
 * the wave clears the band on each edge, and how close the ringing after each edge comes to
 * undoing it at some switching point (see lib/sim/README.md, "Voltage margins").
 */
export function measureBitLevels(
  wave: Waveform,
  bit: DecodedBit,
  fall: number,
  delay: number,
  bands: Record<JudgementName, SwitchingBand>,
  supply: number,
): BitLevels {
  const fallArrives = fall + delay;
  const bump = EDGE_BUMP_SHARE * supply;
  const holds = JUDGEMENTS.map((name) => new HoldScan(bands[name], bump));
  const ringBacks = JUDGEMENTS.map((name) => new RingBackScan(bands[name], bump));
  const peak = scanWindow(wave, bit.slotStart, fallArrives, 1, holds);
  const trough = scanWindow(wave, fallArrives, bit.slotEnd, -1, ringBacks);
  const margins = {} as Record<JudgementName, BandMargins>;
  JUDGEMENTS.forEach((name, i) => {
    const corners = bandCorners(bands[name]);
    const hold = holds[i].result();
    const ringBack = ringBacks[i].result();
    const reach = peak.value - corners.highest.rise;
    const fallMargin = corners.lowest.fall - trough.value;
    margins[name] = {
      reach,
      hold,
      fall: fallMargin,
      ringBack,
      voltageMargin: Math.min(reach, hold?.value ?? Infinity, fallMargin, ringBack?.value ?? Infinity),
    };
  });
  return { highPeak: peak.value, highPeakTime: peak.time, lowTrough: trough.value, lowTroughTime: trough.time, margins };
}

type MeasureContext = {
  wave: Waveform;
  bits: DecodedBit[];
  falls: number[];
  delay: number;
  settledHigh: number;
  clampCurrentPeak: number;
};

function edgeTimes(context: MeasureContext) {
  const { wave, bits, falls, delay, settledHigh } = context;
  const tenth = 0.1 * settledHigh;
  const ninety = 0.9 * settledHigh;
  const rises: number[] = [];
  const fallTimes: number[] = [];
  const settlings: number[] = [];
  let settledEverywhere = true;
  const prefersOnes = bits.some((bit) => bit.sent === 1);
  for (let i = 0; i < bits.length; i += 1) {
    const bit = bits[i];
    const highEnd = falls[i] + delay;
    const t10 = firstReach(wave, tenth, true, bit.slotStart, highEnd);
    const t90 = t10 === null ? null : firstReach(wave, ninety, true, t10, highEnd);
    if (t10 !== null && t90 !== null) rises.push(t90 - t10);
    const f90 = firstReach(wave, ninety, false, highEnd, bit.slotEnd);
    const f10 = f90 === null ? null : firstReach(wave, tenth, false, f90, bit.slotEnd);
    if (f90 !== null && f10 !== null) fallTimes.push(f10 - f90);
    if (prefersOnes && bit.sent === 0) continue;
    const lastOutside = lastOutsideBand(wave, settledHigh, SETTLING_BAND * settledHigh, bit.slotStart, highEnd);
    if (lastOutside >= highEnd) settledEverywhere = false;
    else settlings.push(lastOutside - bit.start);
  }
  return {
    riseTime: maxOrNull(rises),
    fallTime: maxOrNull(fallTimes),
    settlingTime: settledEverywhere ? maxOrNull(settlings) : null,
  };
}

/** Last time in [from, to] that the wave is outside level ± band (`to` when still outside there). */
function lastOutsideBand(wave: Waveform, level: number, band: number, from: number, to: number): number {
  const outside = (v: number) => Math.abs(v - level) > band;
  if (outside(valueAt(wave, to))) return to;
  let i = indexAt(wave, to);
  let laterTime = to;
  let laterValue = valueAt(wave, to);
  for (; i >= 0 && wave.time[i] >= from; i -= 1) {
    const v = wave.value[i];
    if (outside(v)) {
      const edge = v > level ? level + band : level - band;
      return wave.time[i] + ((edge - v) / (laterValue - v)) * (laterTime - wave.time[i]);
    }
    laterTime = wave.time[i];
    laterValue = v;
  }
  return from;
}

const present = (values: (number | null)[]) => values.filter((value): value is number => value !== null);
const smallest = (values: number[]) => values.reduce((a, b) => Math.min(a, b), Infinity);
const largest = (values: number[]) => values.reduce((a, b) => Math.max(a, b), -Infinity);
const minOrNull = (values: (number | null)[]) => (present(values).length > 0 ? smallest(present(values)) : null);
const maxOrNull = (values: (number | null)[]) => (present(values).length > 0 ? largest(present(values)) : null);

export function measureRun(context: MeasureContext): RunMetrics {
  const { wave, bits, settledHigh } = context;
  const { min, max } = extremes(wave);
  const widthsOf = (sent: 0 | 1) => bits.filter((bit) => bit.sent === sent && bit.received !== "x").map((bit) => bit.width);
  return {
    ...edgeTimes(context),
    overshoot: Math.max(0, max - settledHigh),
    undershoot: Math.max(0, -min),
    zeroHighTime: maxOrNull(widthsOf(0)),
    oneHighTime: minOrNull(widthsOf(1)),
    clampCurrentPeak: context.clampCurrentPeak,
    delay: context.delay,
  };
}
