import type { DecodedBit } from "./decoder";
import { extremes, firstReach, indexAt, valueAt, type Waveform } from "./waveform";

/**
 * Measurements of the far-end waveform. Windows are placed by the driver's timing shifted by
 * the line delay: the far end cannot answer an edge sooner.
 */

export type BitLevels = {
  /** Highest far-end voltage while the bit is driven high (V). */
  highPeak: number;
  highPeakTime: number;
  /** Lowest far-end voltage while the bit is driven low (V). */
  lowTrough: number;
  lowTroughTime: number;
  /** Against the guaranteed thresholds: the deepest dip once the pulse has risen through the high threshold and turned down; null without one. */
  highDip: Extreme | null;
  /** Against the guaranteed thresholds: the highest ring-back once the far end has fallen through the low threshold and turned up; null without one. */
  ringBack: Extreme | null;
  /** The same two, with the periods starting at the mid-supply crossing. */
  midHighDip: Extreme | null;
  midRingBack: Extreme | null;
  /** This bit's margins against the guaranteed thresholds and against a single threshold at VDD/2 (V). */
  voltageMargin: number;
  midSupplyVoltageMargin: number;
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
  /** Worst bit's margin against the guaranteed thresholds (V); see BitLevels. */
  voltageMargin: number;
  /** Worst bit's margin against a single threshold at VDD/2 (V). */
  midSupplyVoltageMargin: number;
  bitErrors: number;
  clampCurrentPeak: number;
  delay: number;
};

export type Extreme = { value: number; time: number };

export type Thresholds = { high: number; low: number; mid: number; supply: number };

/**
 * An edge has ended, and ringing begun, once the far end turns back by more than this share of
 * the supply. The bumps a capacitive pin puts on each step of a staircase (tens of millivolts)
 * stay below it; ringing that matters to a threshold is far above it. A turn smaller than this
 * can overstate a margin by less than this much.
 */
const TURN_SHARE = 0.02;
const SETTLING_BAND = 0.05;

/**
 * The ringing after an edge: once the far end has crossed `level` (sign +1: upward, −1:
 * downward) and turned back by more than `turn`, its extreme on the way back (the lowest value
 * after a rise, the highest after a fall). Fed the window's points in time order.
 */
class RingingAfterEdge {
  private entered = false;
  private turned = false;
  private front: number;
  private worst = Infinity;
  private worstTime = 0;

  constructor(
    private readonly sign: number,
    level: number,
    private readonly turn: number,
  ) {
    this.front = sign * level;
  }

  /** The window's first value: already past the level means the edge crossed before the window. */
  begin(v: number): void {
    if (this.sign * v >= this.front) this.entered = true;
  }

  visit(t: number, v: number): void {
    const x = this.sign * v;
    if (!this.entered) {
      if (x < this.front) return;
      this.entered = true;
    }
    if (!this.turned) {
      if (x > this.front) this.front = x;
      else if (x < this.front - this.turn) this.turned = true;
    }
    if (this.turned && x < this.worst) {
      this.worst = x;
      this.worstTime = t;
    }
  }

  result(): Extreme | null {
    return this.turned ? { value: this.sign * this.worst, time: this.worstTime } : null;
  }
}

/**
 * One pass over [from, to]: the extreme value (sign +1: highest, −1: lowest; endpoints
 * interpolated, the start winning ties, then the end) and the ringing after two edges.
 */
function scanWindow(wave: Waveform, from: number, to: number, sign: number, edge: RingingAfterEdge, midEdge: RingingAfterEdge): Extreme {
  const first = valueAt(wave, from);
  const last = valueAt(wave, to);
  let best = sign * first;
  let bestTime = from;
  if (sign * last > best) {
    best = sign * last;
    bestTime = to;
  }
  edge.begin(first);
  midEdge.begin(first);
  const { time, value, count } = wave;
  for (let i = indexAt(wave, from) + 1; i < count && time[i] < to; i += 1) {
    const v = value[i];
    if (sign * v > best) {
      best = sign * v;
      bestTime = time[i];
    }
    edge.visit(time[i], v);
    midEdge.visit(time[i], v);
  }
  edge.visit(to, last);
  midEdge.visit(to, last);
  return { value: sign * best, time: bestTime };
}

/**
 * The far end's levels over one bit, and its voltage margins: how far the wave clears each
 * threshold it must cross, and how close the ringing after each edge comes to undoing it
 * (see lib/sim/README.md, "Voltage margins").
 */
export function measureBitLevels(wave: Waveform, bit: DecodedBit, fall: number, delay: number, thresholds: Thresholds): BitLevels {
  const { high, low, mid, supply } = thresholds;
  const fallArrives = fall + delay;
  const turn = TURN_SHARE * supply;
  const afterRise = new RingingAfterEdge(1, high, turn);
  const afterRiseMid = new RingingAfterEdge(1, mid, turn);
  const afterFall = new RingingAfterEdge(-1, low, turn);
  const afterFallMid = new RingingAfterEdge(-1, mid, turn);
  const peak = scanWindow(wave, bit.slotStart, fallArrives, 1, afterRise, afterRiseMid);
  const trough = scanWindow(wave, fallArrives, bit.slotEnd, -1, afterFall, afterFallMid);
  const highDip = afterRise.result();
  const ringBack = afterFall.result();
  const midHighDip = afterRiseMid.result();
  const midRingBack = afterFallMid.result();
  // Under hysteresis a dip ends the pulse only below the low threshold; the ring-back is held to the guaranteed low level (docs/simulator.md).
  const voltageMargin = Math.min(
    peak.value - high,
    highDip === null ? Infinity : highDip.value - low,
    low - (ringBack?.value ?? trough.value),
  );
  const midSupplyVoltageMargin = Math.min(
    peak.value - mid,
    midHighDip === null ? Infinity : midHighDip.value - mid,
    mid - (midRingBack?.value ?? trough.value),
  );
  return {
    highPeak: peak.value,
    highPeakTime: peak.time,
    lowTrough: trough.value,
    lowTroughTime: trough.time,
    highDip,
    ringBack,
    midHighDip,
    midRingBack,
    voltageMargin,
    midSupplyVoltageMargin,
  };
}

type MeasureContext = {
  wave: Waveform;
  bits: DecodedBit[];
  falls: number[];
  levels: BitLevels[];
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
  const { wave, bits, levels, settledHigh } = context;
  const { min, max } = extremes(wave);
  const widthsOf = (sent: 0 | 1) => bits.filter((bit) => bit.sent === sent && bit.received !== "x").map((bit) => bit.width);
  return {
    ...edgeTimes(context),
    overshoot: Math.max(0, max - settledHigh),
    undershoot: Math.max(0, -min),
    zeroHighTime: maxOrNull(widthsOf(0)),
    oneHighTime: minOrNull(widthsOf(1)),
    timingMargin: minOrNull(bits.map((bit) => bit.timingMargin)),
    voltageMargin: smallest(levels.map((level) => level.voltageMargin)),
    midSupplyVoltageMargin: smallest(levels.map((level) => level.midSupplyVoltageMargin)),
    bitErrors: bits.filter((bit) => bit.received !== String(bit.sent)).length,
    clampCurrentPeak: context.clampCurrentPeak,
    delay: context.delay,
  };
}
