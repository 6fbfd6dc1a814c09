import { cableCatalogue, characteristicImpedance, delayPerMetre, type PerMetre } from "./cables";
import { decodeWaveform } from "./decoder";
import type { DriveSchedule } from "./drive-source";
import { SimSolveBudgetError } from "./errors";
import { pinEquilibrium } from "./far-node";
import { planSolve, solveLine, type LineTotals, type SolveOutput, type SolveQuality } from "./line-solver";
import { judgeBand, publicJudgement, type Judgement } from "./judgement";
import { measureBitLevels, measureRun, type RunMetrics } from "./metrics";
import { bandCentre, clampCurrentLimit, switchingBands } from "./receiver";
import { parseSimInput, type ResolvedSimInput, type SimInput } from "./schema";
import { bitSlots, colourBits } from "./signal";
import { pinTermination, withTermination } from "./termination";
import { judgeVerdict, type Verdict } from "./verdict";
import { RunRecord } from "./run-record";
import { Trace } from "./trace";
import { expandNearEnd, expandTrace, sampleNearEnd, sampleTrace, waveformFromTrace, type Waveform } from "./waveform";

/** One bit's margins under one judgement: the worst over the judgement's switching band. */
export type BitMargins = {
  /** Distance from a wrong reading in time (s), negative when wrong; null when the slot holds no single complete pulse at one of the band's extremes. */
  timingMargin: number | null;
  /** Distance from a wrong reading in voltage (V); see lib/sim/README.md, "Voltage margins". */
  voltageMargin: number;
};

export type SimBit = {
  sent: 0 | 1;
  /** As read at the middle of the typical switching band. */
  received: "0" | "1" | "x";
  /** Pulse width at that switching point (s); null when the slot holds no single complete pulse. */
  width: number | null;
  /** The driver's rising edge of this bit (s). */
  start: number;
  guaranteed: BitMargins;
  typical: BitMargins;
};

export type SimLine = {
  z0: number;
  delay: number;
  perMetre: PerMetre;
  length: number;
  segments: number;
  timeStep: number;
  /** Bits copied on from earlier ones by bit replays (`bitReplayTolerance`) instead of solved; 0 without. */
  copiedBits: number;
};

export type SimResult = {
  time: number[];
  nearEnd: number[];
  farEnd: number[];
  full?: { time: Float64Array; nearEnd: Float64Array; farEnd: Float64Array };
  decoded: string;
  bits: SimBit[];
  metrics: RunMetrics;
  verdict: Verdict;
  line: SimLine;
};

export type SimulateOptions = {
  keepFullResolution?: boolean;
  /** "grade" (the default) is the accuracy every verdict and grade uses; "preview" takes coarser steps, for redrawing while a control is dragged. */
  quality?: SolveQuality;
  /**
   * Sends only the first n bits of the pattern, then the run's usual low ending. Nothing reaches
   * the far end before it was sent, so up to bit n the waveform is the full run's; a preview of a
   * long pattern while a control is dragged. Its verdict speaks only of those bits.
   */
  firstBits?: number;
  /**
   * The default output grid when the input sets no `output.sampleInterval`: a readable interval
   * no finer than `finestInterval`, giving at most `maxPoints` points. Defaults: 4,000 points, enough to draw.
   */
  grid?: { finestInterval: number; maxPoints: number };
  /**
   * Copies a bit on from an earlier one once the line's state at its start lies within this many
   * volts of the earlier one's (bit-replays.ts): a run that rings throughout then solves only the
   * bits whose state is new. 0 or absent: every bit solved.
   */
  bitReplayTolerance?: number;
};

/** What a run found, apart from its traces. */
export type RunAnalysis = Omit<SimResult, "time" | "nearEnd" | "farEnd" | "full">;

/** A run for drawing: its analysis, with its traces as typed arrays, unrounded. */
export type DrawnRun = RunAnalysis & {
  trace: { time: Float64Array; nearEnd: Float64Array; farEnd: Float64Array };
  /** Bits in the input's pattern (the run holds fewer when `firstBits` cut it short). */
  patternBits: number;
};

/** How finely a drawn run is sampled: `finestInterval` apart, or coarser so that a long run stays within `maxPoints`. */
export type DrawingOptions = Omit<SimulateOptions, "keepFullResolution" | "grid"> & { finestInterval: number; maxPoints: number };

const MAX_DRAWN_POINTS = 4000;

/**
 * Memory reused from run to run (the workbench re-simulates on every drag). Nothing in a
 * returned SimResult points into it, and a run is synchronous, so sharing it is safe.
 */
const scratch = { arrivals: new RunRecord(1 << 16), near: new Trace(), far: new Trace(1 << 16) };
let farScratch: Waveform | undefined;
const MAX_SAMPLED_POINTS = 1_000_000;

/** Rounds an interval up to 1, 2, 2.5 or 5 times a power of ten, so the drawn grid is readable. */
function niceInterval(raw: number): number {
  const decade = 10 ** Math.floor(Math.log10(raw));
  for (const step of [1, 2, 2.5, 5, 10]) {
    if (step * decade >= raw * (1 - 1e-9)) return step * decade;
  }
  return 10 * decade;
}

/** Times to the femtosecond and volts to the microvolt: enough, and the JSON stays short. */
function roundedArray(values: ArrayLike<number>, scale: number): number[] {
  const out = new Array<number>(values.length);
  for (let i = 0; i < values.length; i += 1) out[i] = Math.round(values[i] * scale) / scale;
  return out;
}

function lineOf(input: ResolvedSimInput): { perMetre: PerMetre; totals: LineTotals } {
  const perMetre = input.cable.kind ? cableCatalogue[input.cable.kind].perMetre : (input.cable.perMetre as PerMetre);
  const length = input.cable.length;
  return {
    perMetre,
    totals: {
      z0: characteristicImpedance(perMetre),
      delay: length * delayPerMetre(perMetre),
      resistance: perMetre.resistance * length,
      conductance: perMetre.conductance * length,
      capacitance: perMetre.capacitance * length,
    },
  };
}

function driveSchedule(input: ResolvedSimInput, slots: ReturnType<typeof bitSlots>): DriveSchedule {
  const edgeStarts = new Float64Array(slots.length * 2);
  const rising = new Uint8Array(slots.length * 2);
  slots.forEach((slot, i) => {
    edgeStarts[2 * i] = slot.start;
    rising[2 * i] = 1;
    edgeStarts[2 * i + 1] = slot.fall;
  });
  return { edgeStarts, rising, edgeTime: input.driver.edgeTime, highVoltage: input.driver.highVoltage };
}

type JudgedRun = {
  resolved: ResolvedSimInput;
  solved: SolveOutput;
  endTime: number;
  patternBits: number;
  analysis: RunAnalysis;
};

/** Solves the run and judges it: everything but the sampled traces. */
function solveAndJudge(input: SimInput | ResolvedSimInput, options: SimulateOptions): JudgedRun {
  const resolved = parseSimInput(input);
  const { driver, receiver, signal } = resolved;
  const { perMetre, totals } = lineOf(resolved);
  const pattern = signal.bits ?? colourBits(signal.colours ?? [], signal.byteOrder);
  const bits = options.firstBits === undefined ? pattern : pattern.slice(0, Math.max(1, Math.floor(options.firstBits)));
  const slots = bitSlots(bits, signal);
  const endTime = signal.leadIn + bits.length * signal.bitPeriod + Math.max(signal.latchGap ?? 0, totals.delay + signal.bitPeriod);

  const plan = planSolve(totals, driver.edgeTime, endTime, options.quality);
  plan.bitReplayTolerance = options.bitReplayTolerance ?? 0;
  const resistanceHigh = driver.outputResistance + resolved.seriesResistance;
  const resistanceLow = (driver.outputResistanceLow ?? driver.outputResistance) + resolved.seriesResistance;
  const termination = pinTermination(resolved.termination, receiver.supplyVoltage);
  const solved = solveLine(
    plan,
    totals,
    driveSchedule(resolved, slots),
    { high: resistanceHigh, low: resistanceLow },
    {
      capacitance: receiver.inputCapacitance,
      supply: receiver.supplyVoltage,
      clamps: receiver.clampDiodes,
      clampSeriesResistance: receiver.clampSeriesResistance,
      termination,
    },
    scratch,
  );
  const far = waveformFromTrace(solved.far, solved.dt, farScratch);
  farScratch = far;

  const bands = switchingBands(receiver);
  const rule = {
    deglitchTime: receiver.deglitchTime,
    minPulse: receiver.minPulse,
    minGap: receiver.minGap,
    decisionTime: receiver.decisionTime,
  };
  const decoding = decodeWaveform(far, slots, signal.bitPeriod, totals.delay, { ...rule, ...bandCentre(bands.typical) });
  const falls = slots.map((slot) => slot.fall);
  const levels = decoding.bits.map((bit, i) => measureBitLevels(far, bit, falls[i], totals.delay, bands, receiver.supplyVoltage));
  const bandContext = { wave: far, slots, bitPeriod: signal.bitPeriod, delay: totals.delay, rule, levels };
  const judgements = {
    guaranteed: judgeBand("guaranteed", bands.guaranteed, bandContext),
    typical: judgeBand("typical", bands.typical, bandContext),
  };
  const highFeed = withTermination(driver.highVoltage, 1 / Math.max(resistanceHigh + totals.resistance, 1e-3), termination);
  const settledHigh = pinEquilibrium(
    highFeed.source,
    highFeed.conductance,
    receiver.supplyVoltage,
    receiver.clampDiodes,
    receiver.clampSeriesResistance,
  );
  const metrics = measureRun({
    wave: far,
    bits: decoding.bits,
    falls,
    delay: totals.delay,
    settledHigh,
    clampCurrentPeak: solved.clampCurrentPeak,
  });
  const verdict = judgeVerdict(judgements, decoding, levels, metrics, {
    highVoltage: driver.highVoltage,
    sourceResistanceHigh: resistanceHigh,
    sourceResistanceLow: resistanceLow,
    z0: totals.z0,
    delay: totals.delay,
    cableCapacitance: totals.capacitance,
    inputCapacitance: receiver.inputCapacitance,
    supply: receiver.supplyVoltage,
    settledHigh,
    ...rule,
    latchGap: signal.latchGap,
    falls,
    clampCurrentPeakTime: solved.clampCurrentPeakTime,
    clampCurrentRating: receiver.clampCurrentRating,
    clampCurrentLimit: clampCurrentLimit(receiver.clampCurrentRating),
  });
  const marginsOf = (judgement: keyof typeof judgements, i: number) => ({
    timingMargin: judgements[judgement].bitTimingMargins[i],
    voltageMargin: levels[i].margins[judgement].voltageMargin,
  });

  const analysis: RunAnalysis = {
    decoded: decoding.bits.map((bit) => bit.received).join(""),
    bits: decoding.bits.map((bit, i) => ({
      sent: bit.sent,
      received: bit.received,
      width: bit.width,
      start: bit.start,
      guaranteed: marginsOf("guaranteed", i),
      typical: marginsOf("typical", i),
    })),
    metrics,
    verdict: { ...verdict, guaranteed: publicJudgement(judgements.guaranteed), typical: publicJudgement(judgements.typical) },
    line: {
      z0: totals.z0,
      delay: totals.delay,
      perMetre,
      length: resolved.cable.length,
      segments: plan.segments,
      timeStep: plan.dt,
      copiedBits: solved.copiedBits,
    },
  };
  return { resolved, solved, endTime, patternBits: pattern.length, analysis };
}

/** A run judged without its traces: what a sweep over many runs needs (sweep.ts). */
export function analyseRun(input: SimInput | ResolvedSimInput, options: Omit<SimulateOptions, "keepFullResolution" | "grid"> = {}): RunAnalysis {
  return solveAndJudge(input, options).analysis;
}

function pointCount(endTime: number, interval: number): number {
  const points = Math.floor(endTime / interval + 1e-9) + 1;
  if (points > MAX_SAMPLED_POINTS) {
    throw new SimSolveBudgetError(
      `output.sampleInterval of ${interval} s gives ${points.toLocaleString("en")} points over ${(endTime * 1e6).toPrecision(4)} µs, more than ${MAX_SAMPLED_POINTS.toLocaleString("en")}`,
    );
  }
  return points;
}

function uniformTimes(interval: number, points: number): Float64Array {
  const time = new Float64Array(points);
  for (let i = 0; i < points; i += 1) time[i] = i * interval;
  return time;
}

/** Simulates one run: waveforms, decoded bits, metrics and verdict. */
export function simulateRun(input: SimInput | ResolvedSimInput, options: SimulateOptions = {}): SimResult {
  const { resolved, solved, endTime, analysis } = solveAndJudge(input, options);
  const grid = options.grid ?? { finestInterval: 0, maxPoints: MAX_DRAWN_POINTS };
  const interval = resolved.output.sampleInterval ?? niceInterval(Math.max(grid.finestInterval, endTime / (grid.maxPoints - 1)));
  const points = pointCount(endTime, interval);
  const result: SimResult = {
    time: roundedArray(uniformTimes(interval, points), 1e15),
    nearEnd: roundedArray(sampleNearEnd(solved.near, solved.dt, solved.stepCount, interval, points), 1e6),
    farEnd: roundedArray(sampleTrace(solved.far, solved.dt, interval, points), 1e6),
    ...analysis,
  };
  if (options.keepFullResolution) {
    result.full = {
      time: Float64Array.from({ length: solved.stepCount }, (_, i) => i * solved.dt),
      nearEnd: expandNearEnd(solved.near, solved.stepCount),
      farEnd: expandTrace(solved.far, solved.stepCount),
    };
  }
  return result;
}

/**
 * Simulates one run for the browser's scope: the same solution and analysis as simulateRun, its
 * traces sampled straight into typed arrays (no rounding for JSON, no intermediate number arrays)
 * that a worker can hand over without copying.
 */
export function simulateForDrawing(input: SimInput | ResolvedSimInput, options: DrawingOptions): DrawnRun {
  const { solved, endTime, patternBits, analysis } = solveAndJudge(input, options);
  const interval = Math.max(options.finestInterval, endTime / options.maxPoints);
  const points = pointCount(endTime, interval);
  return {
    ...analysis,
    trace: {
      time: uniformTimes(interval, points),
      nearEnd: sampleNearEnd(solved.near, solved.dt, solved.stepCount, interval, points),
      farEnd: sampleTrace(solved.far, solved.dt, interval, points),
    },
    patternBits,
  };
}
