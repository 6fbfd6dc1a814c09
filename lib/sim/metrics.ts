import type { DecodedBit } from "./decoder";
import { extremes, firstReach, indexAt, maxOver, valueAt, type Waveform } from "./waveform";

/**
 * Measurements of the far-end waveform. Windows are placed by the driver's timing shifted by
 * the line delay: the far end cannot answer an edge sooner.
 */

export type BitLevels = {
  /** Highest far-end voltage while the bit is driven high (V). */
  highPeak: number;
  highPeakTime: number;
  /** Highest voltage the far end rings back to after falling, or where it still is at the next bit (V). */
  lowPeak: number;
  lowPeakTime: number;
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
  /** Widest pulse of a 0 bit at the thresholds (s). */
  zeroHighTime: number | null;
  /** Narrowest pulse of a 1 bit at the thresholds (s). */
  oneHighTime: number | null;
  timingMargin: number | null;
  voltageMargin: number;
  midSupplyVoltageMargin: number;
  bitErrors: number;
  clampCurrentPeak: number;
  delay: number;
};

/** A rise of more than this above the running minimum marks the start of ringing in a low period. */
const RING_START = 1e-3;
const SETTLING_BAND = 0.05;

export function measureBitLevels(wave: Waveform, bit: DecodedBit, fall: number, delay: number): BitLevels {
  const high = maxOver(wave, bit.slotStart, fall + delay);
  const lowFrom = fall + delay;
  const lowTo = bit.slotEnd;
  let runningMin = valueAt(wave, lowFrom);
  let ringing = false;
  let lowPeak = valueAt(wave, lowTo);
  let lowPeakTime = lowTo;
  for (let i = indexAt(wave, lowFrom) + 1; i < wave.count && wave.time[i] < lowTo; i += 1) {
    const v = wave.value[i];
    if (!ringing) {
      if (v < runningMin) runningMin = v;
      else if (v > runningMin + RING_START) ringing = true;
    }
    if (ringing && v > lowPeak) {
      lowPeak = v;
      lowPeakTime = wave.time[i];
    }
  }
  return { highPeak: high.value, highPeakTime: high.time, lowPeak, lowPeakTime };
}

type MeasureContext = {
  wave: Waveform;
  bits: DecodedBit[];
  falls: number[];
  levels: BitLevels[];
  delay: number;
  settledHigh: number;
  supply: number;
  highLevel: number;
  lowLevel: number;
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
  const { wave, bits, levels, settledHigh, supply, highLevel, lowLevel } = context;
  const { min, max } = extremes(wave);
  const mid = supply / 2;
  const widthsOf = (sent: 0 | 1) => bits.filter((bit) => bit.sent === sent && bit.received !== "x").map((bit) => bit.width);
  return {
    ...edgeTimes(context),
    overshoot: Math.max(0, max - settledHigh),
    undershoot: Math.max(0, -min),
    zeroHighTime: maxOrNull(widthsOf(0)),
    oneHighTime: minOrNull(widthsOf(1)),
    timingMargin: minOrNull(bits.map((bit) => bit.timingMargin)),
    voltageMargin: smallest(levels.map((level) => Math.min(level.highPeak - highLevel, lowLevel - level.lowPeak))),
    midSupplyVoltageMargin: smallest(levels.map((level) => Math.min(level.highPeak - mid, mid - level.lowPeak))),
    bitErrors: bits.filter((bit) => bit.received !== String(bit.sent)).length,
    clampCurrentPeak: context.clampCurrentPeak,
    delay: context.delay,
  };
}
