import { solveDistributed } from "./distributed-line";
import { DriveSource, type DriveSchedule } from "./drive-source";
import { SimSolveBudgetError } from "./errors";
import { FarNode } from "./far-node";
import { TracedNearEnd, type NearEnd } from "./near-end";
import { RunRecord } from "./run-record";
import type { PinTermination } from "./termination";
import { Trace } from "./trace";

/**
 * Transient solution of driver → series resistor → lossy line → pixel input by the method of
 * characteristics (Bergeron). The line is cut into N lossless segments of equal delay; each
 * segment end is a Thevenin source (Z0 behind twice the wave that arrived from the other end
 * one segment delay earlier). Conductor resistance and shunt conductance are lumped at the
 * segment ends (R/2N at each line end, R/N at each inner junction). The step divides the
 * segment delay exactly, so the delayed waves need no interpolation. See lib/sim/README.md.
 */

export type LineTotals = {
  z0: number;
  /** One-way delay of the whole line (s). */
  delay: number;
  /** Total series resistance of the line, both conductors (Ω). */
  resistance: number;
  /** Total shunt conductance (S). */
  conductance: number;
  /** Total capacitance (F), used when the line is too short to have a delay. */
  capacitance: number;
};

export type DriverResistances = {
  /** Driver plus series resistor while the driver pulls high (Ω). */
  high: number;
  /** Driver plus series resistor while the driver pulls low (Ω). */
  low: number;
};

/** The pixel's pin: its capacitance, supply, clamps (each behind `clampSeriesResistance`, Ω) and far-end termination. */
export type ReceiverLoad = { capacitance: number; supply: number; clamps: boolean; clampSeriesResistance: number; termination: PinTermination };

export type SolverPlan = {
  dt: number;
  /** Total steps from t = 0 to the end of the run. */
  stepCount: number;
  /** 0 when the line is treated as a lumped resistor and capacitor. */
  segments: number;
  stepsPerSegment: number;
  tolerances: SolverTolerances;
  /** Bit replays (bit-replays.ts): how close two states at a bit's first step must be for one to be copied on from the other (V); 0: off. */
  bitReplayTolerance: number;
};

/** Records a caller lends to the solver so that repeated runs reuse their memory. */
export type SolverScratch = { arrivals: RunRecord; near: Trace; far: Trace };

export type SolveOutput = {
  dt: number;
  stepCount: number;
  /** The cable's input, on demand. */
  near: NearEnd;
  /** The pixel's pin, within TRACE_TOLERANCE of every step. */
  far: Trace;
  clampCurrentPeak: number;
  clampCurrentPeakTime: number;
  /** Bits copied by bit replays instead of solved (bit-replays.ts). */
  copiedBits: number;
};

export const MAX_SOLVER_STEPS = 5_000_000;

/**
 * How far the solver lets small changes go unanswered (V). Without these every small arrival
 * would send back a train of still smaller ones, multiplying without end; with them the tail of
 * the ringing stops once it is far below anything the decoder can see. Each bounds its own error.
 */
export type SolverTolerances = {
  /** A pin this close to its DC value for a constant arriving wave is held there, so the wave it sends back is exactly constant. */
  settled: number;
  /** A held pin ignores arriving changes smaller than this. */
  input: number;
  /** The wave a moving pin sends back is passed on only when it has moved this much. */
  output: number;
  /** An inner junction ignores input changes this close to the inputs it last answered. */
  junction: number;
  /** When every wave and the pin lie this close to the DC state of a flat drive, the line is set to it (a rest). */
  quiet: number;
};

/** "grade": the full accuracy every verdict is given at; "preview": coarser, for redrawing while a control is dragged. */
export type SolveQuality = "grade" | "preview";

/**
 * Largest step and least steps per edge (0.1 ns for 3 ns edges, docs/simulator.md), and the
 * tolerances. Preview: half the steps and looser holds, within 1 % of VDD of "grade" (README).
 */
const QUALITY_RULES: Record<SolveQuality, { maxStep: number; stepsPerEdge: number; tolerances: SolverTolerances }> = {
  grade: { maxStep: 1e-10, stepsPerEdge: 25, tolerances: { settled: 2e-4, input: 5e-4, output: 2e-4, junction: 1e-4, quiet: 2e-3 } },
  preview: { maxStep: 2e-10, stepsPerEdge: 15, tolerances: { settled: 1e-3, input: 1.5e-3, output: 1e-3, junction: 5e-4, quiet: 5e-3 } },
};

/** Segments per unit of R/Z0: keeps the lumped-loss error of the first arrival, about R/(4N·Z0), under 0.3 %. */
const SEGMENTS_PER_LOSS = 80;
const MAX_SEGMENTS = 16;

export function planSolve(line: LineTotals, edgeTime: number, endTime: number, quality: SolveQuality = "grade"): SolverPlan {
  const rule = QUALITY_RULES[quality];
  const maxStep = Math.min(rule.maxStep, edgeTime / rule.stepsPerEdge);
  let plan: SolverPlan;
  if (line.delay < maxStep / 2) {
    plan = { dt: maxStep, stepCount: 0, segments: 0, stepsPerSegment: 0, tolerances: rule.tolerances, bitReplayTolerance: 0 };
  } else {
    const loss = Math.max(line.resistance / line.z0, line.conductance * line.z0);
    const wanted = Math.min(MAX_SEGMENTS, Math.max(1, Math.ceil(loss * SEGMENTS_PER_LOSS)));
    const segments = Math.max(1, Math.min(wanted, Math.floor(line.delay / maxStep)));
    const stepsPerSegment = Math.ceil(line.delay / segments / maxStep - 1e-9);
    plan = { dt: line.delay / (segments * stepsPerSegment), stepCount: 0, segments, stepsPerSegment, tolerances: rule.tolerances, bitReplayTolerance: 0 };
  }
  plan.stepCount = Math.ceil(endTime / plan.dt) + 1;
  if (plan.stepCount > MAX_SOLVER_STEPS) {
    throw new SimSolveBudgetError(
      `the run needs ${plan.stepCount.toLocaleString("en")} solver steps of ${(plan.dt * 1e9).toPrecision(3)} ns ` +
        `(${(endTime * 1e6).toPrecision(4)} µs simulated), more than the budget of ${MAX_SOLVER_STEPS.toLocaleString("en")}: ` +
        "send fewer bits, a shorter latch gap or slower edges",
    );
  }
  return plan;
}

export function solveLine(
  plan: SolverPlan,
  line: LineTotals,
  drive: DriveSchedule,
  resistances: DriverResistances,
  receiver: ReceiverLoad,
  scratch: SolverScratch = { arrivals: new RunRecord(), near: new Trace(), far: new Trace() },
): SolveOutput {
  return plan.segments === 0
    ? solveLumped(plan, line, drive, resistances, receiver, scratch)
    : solveDistributed(plan, line, drive, resistances, receiver, scratch);
}

/** A line with (almost) no delay: its resistance in series, its capacitance at the pin. */
function solveLumped(
  plan: SolverPlan,
  line: LineTotals,
  drive: DriveSchedule,
  resistances: DriverResistances,
  receiver: ReceiverLoad,
  scratch: SolverScratch,
): SolveOutput {
  const { dt, stepCount } = plan;
  const source = new DriveSource(drive, dt);
  const { near, far } = scratch;
  near.clear();
  far.clear();
  const node = new FarNode(
    receiver.capacitance + line.capacitance,
    dt,
    receiver.supply,
    receiver.clamps,
    receiver.clampSeriesResistance,
    receiver.termination,
  );
  const seriesConductance = (resistance: number) => 1 / Math.max(resistance + line.resistance, 1e-3);
  const gHigh = seriesConductance(resistances.high);
  const gLow = seriesConductance(resistances.low);
  const shunt = line.conductance;

  let clampCurrentPeak = 0;
  let clampCurrentPeakTime = 0;

  const advance = (step: number, drive: number, g: number): number => {
    const v = node.step((drive * g) / (g + shunt), g + shunt);
    const current = Math.abs(node.current);
    if (current > clampCurrentPeak) {
      clampCurrentPeak = current;
      clampCurrentPeakTime = step * dt;
    }
    far.push(step, v);
    near.push(step, v + line.resistance * (drive - v) * g);
    return v;
  };

  let step = 0;
  while (step < stepCount) {
    source.seek(step);
    const g = source.drivingHigh(step) ? gHigh : gLow;
    if (source.inRamp(step)) {
      const stop = Math.min(source.rampEnd(), stepCount);
      for (; step < stop; step += 1) advance(step, source.rampValue(step), g);
      continue;
    }
    const drive = source.level();
    const stop = Math.min(source.nextChange(), stepCount);
    const equilibrium = node.equilibrium((drive * g) / (g + shunt), g + shunt);
    while (step < stop) {
      advance(step, drive, g);
      step += 1;
      if (node.isSettledAt(equilibrium, plan.tolerances.settled)) {
        node.holdAt(equilibrium);
        step = stop;
      }
    }
  }
  near.finish(stepCount - 1);
  far.finish(stepCount - 1);
  return { dt, stepCount, near: new TracedNearEnd(near), far, clampCurrentPeak, clampCurrentPeakTime, copiedBits: 0 };
}
