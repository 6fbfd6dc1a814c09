import { DriveSource, type DriveSchedule } from "./drive-source";
import { SimSolveBudgetError } from "./errors";
import { FarNode, lastClampCurrent, NEGLIGIBLE_CONDUCTION, pinEquilibrium, solveClamped } from "./far-node";
import { RUN_TOLERANCE, RunHistory, WaveChunk } from "./runs";

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

export type ReceiverLoad = { capacitance: number; supply: number; clamps: boolean };

export type SolverPlan = {
  dt: number;
  /** Total steps from t = 0 to the end of the run. */
  stepCount: number;
  /** 0 when the line is treated as a lumped resistor and capacitor. */
  segments: number;
  stepsPerSegment: number;
};

/** Run histories a caller lends to the solver so that repeated runs reuse their memory. */
export type SolverScratch = { near: RunHistory; far: RunHistory };

export type SolveOutput = {
  dt: number;
  stepCount: number;
  near: RunHistory;
  far: RunHistory;
  clampCurrentPeak: number;
  clampCurrentPeakTime: number;
};

export const MAX_SOLVER_STEPS = 5_000_000;
/** Fixed step for 3 ns edges (0.1 ns, see docs/simulator.md); finer for faster edges. */
const BASE_STEP = 1e-10;
const STEPS_PER_EDGE = 25;
/** Segments per unit of R/Z0: keeps the lumped-loss error of the first arrival, about R/(4N·Z0), under 0.3 %. */
const SEGMENTS_PER_LOSS = 80;
const MAX_SEGMENTS = 16;
/**
 * Once the pin is this close to the DC value for a constant arriving wave it is held there, so
 * the wave it sends back becomes exactly constant (a flat run) instead of creeping forever.
 */
const SETTLED_TOLERANCE = 2e-4;
/**
 * A settled pin ignores arriving changes smaller than this. Without it every small arrival
 * would send back a train of still smaller ones, multiplying without end; with it the tail of
 * the ringing stops once it is far below anything the decoder can see.
 */
const INPUT_DEADBAND = 5e-4;
const JUNCTION_DEADBAND = 1e-4;
/** The wave a moving pin sends back is passed on only when it has moved this much. */
const OUTPUT_DEADBAND = 2e-4;
/**
 * When every wave on the line and the pin lie this close to the DC state of a flat drive, the
 * state is set to that DC state and the solver jumps to the driver's next edge.
 */
const QUIET_BAND = 2e-3;

export function planSolve(line: LineTotals, edgeTime: number, endTime: number): SolverPlan {
  const maxStep = Math.min(BASE_STEP, edgeTime / STEPS_PER_EDGE);
  let plan: SolverPlan;
  if (line.delay < maxStep / 2) {
    plan = { dt: maxStep, stepCount: 0, segments: 0, stepsPerSegment: 0 };
  } else {
    const loss = Math.max(line.resistance / line.z0, line.conductance * line.z0);
    const wanted = Math.min(MAX_SEGMENTS, Math.max(1, Math.ceil(loss * SEGMENTS_PER_LOSS)));
    const segments = Math.max(1, Math.min(wanted, Math.floor(line.delay / maxStep)));
    const stepsPerSegment = Math.ceil(line.delay / segments / maxStep - 1e-9);
    plan = { dt: line.delay / (segments * stepsPerSegment), stepCount: 0, segments, stepsPerSegment };
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

type Stream = { read: WaveChunk; write: WaveChunk };

function makeStream(capacity: number): Stream {
  const read = new WaveChunk(capacity);
  read.fillConstant(0);
  return { read, write: new WaveChunk(capacity) };
}

/** Coefficients of the driver end: source, its resistance and R/2N, G/2N, then the line. */
function nearEndCoefficients(sourceResistance: number, endResistance: number, endConductance: number, z0: number) {
  const total = sourceResistance + endResistance;
  const denominator = z0 + total + endConductance * total * z0;
  const fromSource = z0 / denominator;
  const fromLine = total / denominator;
  const sourceShare = total > 0 ? endResistance / total : 1;
  return { fromSource, fromLine, sourceShare };
}

export function solveLine(
  plan: SolverPlan,
  line: LineTotals,
  drive: DriveSchedule,
  resistances: DriverResistances,
  receiver: ReceiverLoad,
  scratch: SolverScratch = { near: new RunHistory(), far: new RunHistory() },
): SolveOutput {
  return plan.segments === 0
    ? solveLumped(plan, line, drive, resistances, receiver, scratch)
    : solveDistributed(plan, line, drive, resistances, receiver, scratch);
}

type DcState = {
  level: number;
  /** Stream values entering each segment from its left (forward) and right (backward) end. */
  forward: Float64Array;
  backward: Float64Array;
  near: number;
  pin: number;
};

/**
 * The DC state of the whole circuit for a flat drive level: the resistive ladder reduced to a
 * Thevenin source at the pin, the pin solved with its clamps, then currents and voltages walked
 * back to the driver. Stream values are v + Z0·i with i the current into the segment.
 */
function dcState(
  level: number,
  sourceResistance: number,
  segments: number,
  z0: number,
  endResistance: number,
  endConductance: number,
  junctionResistance: number,
  junctionConductance: number,
  receiver: ReceiverLoad,
): DcState {
  let theveninVoltage = level;
  let theveninResistance = sourceResistance + endResistance;
  const shunt = (g: number) => {
    theveninVoltage /= 1 + g * theveninResistance;
    theveninResistance /= 1 + g * theveninResistance;
  };
  shunt(endConductance);
  for (let j = 1; j < segments; j += 1) {
    theveninResistance += junctionResistance / 2;
    shunt(junctionConductance);
    theveninResistance += junctionResistance / 2;
  }
  shunt(endConductance);
  theveninResistance = Math.max(theveninResistance + endResistance, 1e-3);
  const pin = pinEquilibrium(theveninVoltage, 1 / theveninResistance, receiver.supply, receiver.clamps);

  const forward = new Float64Array(segments);
  const backward = new Float64Array(segments);
  const pinCurrent = (theveninVoltage - pin) / theveninResistance;
  let portVoltage = pin + endResistance * pinCurrent;
  let current = pinCurrent + endConductance * portVoltage;
  backward[segments - 1] = portVoltage - z0 * current;
  for (let j = segments - 1; j >= 1; j -= 1) {
    forward[j] = portVoltage + z0 * current;
    const middle = portVoltage + (junctionResistance / 2) * current;
    current += junctionConductance * middle;
    portVoltage = middle + (junctionResistance / 2) * current;
    backward[j - 1] = portVoltage - z0 * current;
  }
  forward[0] = portVoltage + z0 * current;
  const sourceCurrent = current + endConductance * portVoltage;
  return { level, forward, backward, near: portVoltage + endResistance * sourceCurrent, pin };
}

/**
 * The distributed line, advanced one segment delay (a "chunk" of m steps) at a time: within a
 * chunk every node reads only what the other nodes wrote in the previous chunk, so each node
 * runs through its chunk alone, over runs of constant input rather than over single steps.
 * The hot loops keep their state in locals and write the typed arrays directly.
 */
class DistributedLine {
  private readonly m: number;
  private readonly segments: number;
  private readonly z0: number;
  private readonly endResistance: number;
  private readonly theveninScale: number;
  private readonly theveninConductance: number;
  private readonly junctionArm: number;
  private readonly junctionDivider: number;
  private readonly forward: Stream[];
  /** Per inner junction: the two inputs it last answered and its two outputs. */
  private readonly junctionState: Float64Array;
  private readonly backward: Stream[];
  readonly near: RunHistory;
  readonly far: RunHistory;

  private readonly rampStart: Int32Array;
  private readonly rampEnd: Int32Array;
  private readonly edgeStart: Float64Array;
  private readonly rising: Uint8Array;
  private cursor = 0;
  private readonly high: ReturnType<typeof nearEndCoefficients>;
  private readonly low: ReturnType<typeof nearEndCoefficients>;

  private readonly capacitiveConductance: number;
  private readonly historyWeight1: number;
  private readonly historyWeight2: number;
  private readonly safeLow: number;
  private readonly safeHigh: number;
  private v1 = 0;
  private v2 = 0;
  private held = false;
  private heldInput = 0;
  private heldOutput = 0;
  private lastWave = 0;
  clampCurrentPeak = 0;
  clampCurrentPeakTime = 0;

  constructor(
    private readonly plan: SolverPlan,
    line: LineTotals,
    private readonly drive: DriveSchedule,
    resistances: DriverResistances,
    private readonly receiver: ReceiverLoad,
    scratch: SolverScratch,
  ) {
    const { segments, stepsPerSegment: m, dt } = plan;
    this.m = m;
    this.segments = segments;
    this.z0 = line.z0;
    this.endResistance = line.resistance / (2 * segments);
    const endConductance = line.conductance / (2 * segments);
    const junctionResistance = line.resistance / segments;
    const junctionConductance = line.conductance / segments;
    this.theveninScale = 1 / (1 + endConductance * this.z0);
    this.theveninConductance = 1 / (this.endResistance + this.z0 * this.theveninScale);
    this.junctionArm = this.z0 + junctionResistance / 2;
    this.junctionDivider = 1 / (2 + junctionConductance * this.junctionArm);
    this.forward = Array.from({ length: segments }, () => makeStream(m + 1));
    this.backward = Array.from({ length: segments }, () => makeStream(m + 1));
    this.junctionState = new Float64Array(4 * segments);
    this.near = scratch.near;
    this.far = scratch.far;
    this.near.clear();
    this.far.clear();

    const edges = drive.edgeStarts.length;
    this.edgeStart = drive.edgeStarts;
    this.rising = drive.rising;
    this.rampStart = new Int32Array(edges);
    this.rampEnd = new Int32Array(edges);
    for (let k = 0; k < edges; k += 1) {
      this.rampStart[k] = Math.ceil(drive.edgeStarts[k] / dt - 1e-9);
      this.rampEnd[k] = Math.ceil((drive.edgeStarts[k] + drive.edgeTime) / dt - 1e-9);
    }
    this.high = nearEndCoefficients(resistances.high, this.endResistance, endConductance, this.z0);
    this.low = nearEndCoefficients(resistances.low, this.endResistance, endConductance, this.z0);

    this.capacitiveConductance = (3 * receiver.capacitance) / (2 * dt);
    this.historyWeight1 = (2 * receiver.capacitance) / dt;
    this.historyWeight2 = receiver.capacitance / (2 * dt);
    this.safeLow = receiver.clamps ? -NEGLIGIBLE_CONDUCTION : -Infinity;
    this.safeHigh = receiver.clamps ? receiver.supply + NEGLIGIBLE_CONDUCTION : Infinity;

    const dc = (level: number, sourceResistance: number) =>
      dcState(level, sourceResistance, segments, this.z0, this.endResistance, endConductance, junctionResistance, junctionConductance, receiver);
    this.dcHigh = dc(drive.highVoltage, resistances.high);
    this.dcLow = dc(0, resistances.low);
  }

  private readonly dcHigh: DcState;
  private readonly dcLow: DcState;

  run(): void {
    const { m, segments, forward, backward, plan } = this;
    const streams = [...forward, ...backward];
    let chunk = 0;
    while (chunk * m < plan.stepCount) {
      const start = chunk * m;
      this.near.reserve(m + 2);
      this.far.reserve(m + 2);
      this.nearEnd(start, backward[0].read, forward[0].write);
      for (let j = 1; j < segments; j += 1) {
        this.junction(j, forward[j - 1].read, backward[j].read, backward[j - 1].write, forward[j].write);
      }
      this.farEnd(start, forward[segments - 1].read, backward[segments - 1].write);
      for (const stream of streams) {
        const written = stream.write;
        stream.write = stream.read;
        stream.read = written;
        stream.write.count = 0;
      }
      chunk += 1;
      chunk = this.skipWhileQuiet(chunk);
    }
  }

  /** Index of the first edge not finished at `step`, from the cursor on. */
  private edgeAt(step: number): number {
    let k = this.cursor;
    while (k < this.rampEnd.length && this.rampEnd[k] <= step) k += 1;
    this.cursor = k;
    return k;
  }

  /** When the whole line sits at the DC state of a flat drive, set it there and jump to the next edge. */
  private skipWhileQuiet(chunk: number): number {
    const next = chunk * this.m;
    const k = this.edgeAt(next);
    const edges = this.rampStart.length;
    if (k < edges && this.rampStart[k] <= next) return chunk;
    const state = k > 0 && this.rising[k - 1] ? this.dcHigh : this.dcLow;
    if (Math.abs(this.v1 - state.pin) > QUIET_BAND || Math.abs(this.v2 - state.pin) > QUIET_BAND) return chunk;
    for (let j = 0; j < this.segments; j += 1) {
      if (!this.forward[j].read.isNear(state.forward[j], QUIET_BAND)) return chunk;
      if (!this.backward[j].read.isNear(state.backward[j], QUIET_BAND)) return chunk;
    }
    for (let j = 0; j < this.segments; j += 1) {
      this.forward[j].read.fillConstant(state.forward[j]);
      this.backward[j].read.fillConstant(state.backward[j]);
    }
    for (let j = 1; j < this.segments; j += 1) {
      this.junctionState[4 * j] = state.forward[j - 1];
      this.junctionState[4 * j + 1] = state.backward[j];
      this.junctionState[4 * j + 2] = state.backward[j - 1];
      this.junctionState[4 * j + 3] = state.forward[j];
    }
    this.v1 = state.pin;
    this.v2 = state.pin;
    this.held = false;
    this.near.push(next, state.near);
    this.far.push(next, state.pin);
    const nextEdge = k < edges ? this.rampStart[k] : Number.MAX_SAFE_INTEGER;
    return Math.max(chunk, Math.floor(nextEdge / this.m));
  }

  private nearEnd(start: number, incoming: WaveChunk, out: WaveChunk): void {
    const { m, rampStart, rampEnd, rising, edgeStart, high, low } = this;
    const dt = this.plan.dt;
    const edgeTime = this.drive.edgeTime;
    const highVoltage = this.drive.highVoltage;
    const edges = rampStart.length;
    const inOffsets = incoming.offsets;
    const inValues = incoming.values;
    const inCount = incoming.count;
    const outOffsets = out.offsets;
    const outValues = out.values;
    let outCount = out.count;
    const history = this.near;
    const historySteps = history.steps;
    const historyValues = history.values;
    let historyCount = history.count;
    let k = this.cursor;
    const end = start + m;
    let run = 0;
    let step = start;
    while (step < end) {
      const runEnd = start + (run + 1 < inCount ? inOffsets[run + 1] : m);
      const arriving = inValues[run];
      while (k < edges && rampEnd[k] <= step) k += 1;
      const ramping = k < edges && rampStart[k] <= step;
      const up = ramping ? rising[k] === 1 : k > 0 && rising[k - 1] === 1;
      const c = up ? high : low;
      // A flat drive and a constant arriving wave give one output for the whole stretch.
      const stop = ramping ? Math.min(rampEnd[k], runEnd) : step + 1;
      const resume = ramping ? stop : Math.min(k < edges ? rampStart[k] : runEnd, runEnd);
      const rampOrigin = ramping ? edgeStart[k] : 0;
      for (; step < stop; step += 1) {
        let drive = up ? highVoltage : 0;
        if (ramping) {
          const progress = Math.min(1, Math.max(0, (step * dt - rampOrigin) / edgeTime));
          drive = up ? highVoltage * progress : highVoltage * (1 - progress);
        }
        const port = c.fromSource * drive + c.fromLine * arriving;
        const wave = 2 * port - arriving;
        if (outCount === 0 || wave !== outValues[outCount - 1]) {
          outOffsets[outCount] = step - start;
          outValues[outCount] = wave;
          outCount += 1;
        }
        const nearVoltage = port + c.sourceShare * (drive - port);
        if (historyCount === 0 || Math.abs(nearVoltage - historyValues[historyCount - 1]) > RUN_TOLERANCE) {
          historySteps[historyCount] = step;
          historyValues[historyCount] = nearVoltage;
          historyCount += 1;
        }
      }
      step = resume;
      if (step >= runEnd) run += 1;
    }
    out.count = outCount;
    history.count = historyCount;
    this.cursor = k;
  }

  /**
   * An inner junction (R/N in series, G/N to ground). It ignores input changes within
   * JUNCTION_DEADBAND of the inputs it last answered: the small reflections of the lumped
   * resistors would otherwise bounce between junctions without end.
   */
  private junction(j: number, fromLeft: WaveChunk, fromRight: WaveChunk, toLeft: WaveChunk, toRight: WaveChunk): void {
    const { m, z0, junctionArm, junctionDivider, junctionState } = this;
    const base = 4 * j;
    let heldLeft = junctionState[base];
    let heldRight = junctionState[base + 1];
    let outLeft = junctionState[base + 2];
    let outRight = junctionState[base + 3];
    let left = 0;
    let right = 0;
    let offset = 0;
    while (offset < m) {
      const leftEnd = left + 1 < fromLeft.count ? fromLeft.offsets[left + 1] : m;
      const rightEnd = right + 1 < fromRight.count ? fromRight.offsets[right + 1] : m;
      const waveLeft = fromLeft.values[left];
      const waveRight = fromRight.values[right];
      if (Math.abs(waveLeft - heldLeft) > JUNCTION_DEADBAND || Math.abs(waveRight - heldRight) > JUNCTION_DEADBAND) {
        heldLeft = waveLeft;
        heldRight = waveRight;
        const middle = (waveLeft + waveRight) * junctionDivider;
        outLeft = waveLeft - (2 * z0 * (waveLeft - middle)) / junctionArm;
        outRight = waveRight - (2 * z0 * (waveRight - middle)) / junctionArm;
      }
      toLeft.push(offset, outLeft);
      toRight.push(offset, outRight);
      offset = Math.min(leftEnd, rightEnd);
      if (offset >= leftEnd) left += 1;
      if (offset >= rightEnd) right += 1;
    }
    junctionState[base] = heldLeft;
    junctionState[base + 1] = heldRight;
    junctionState[base + 2] = outLeft;
    junctionState[base + 3] = outRight;
  }

  private farEnd(start: number, incoming: WaveChunk, out: WaveChunk): void {
    const { m, endResistance, theveninScale, theveninConductance, safeLow, safeHigh } = this;
    const dt = this.plan.dt;
    const supply = this.receiver.supply;
    const clamps = this.receiver.clamps;
    const total = theveninConductance + this.capacitiveConductance;
    const inverseTotal = 1 / total;
    const weight1 = this.historyWeight1;
    const weight2 = this.historyWeight2;
    const inOffsets = incoming.offsets;
    const inValues = incoming.values;
    const inCount = incoming.count;
    const outOffsets = out.offsets;
    const outValues = out.values;
    let outCount = out.count;
    const history = this.far;
    const historySteps = history.steps;
    const historyValues = history.values;
    let historyCount = history.count;
    let v1 = this.v1;
    let v2 = this.v2;
    let held = this.held;
    let heldInput = this.heldInput;
    let heldOutput = this.heldOutput;
    let lastWave = outCount > 0 ? outValues[outCount - 1] : this.lastWave;

    for (let run = 0; run < inCount; run += 1) {
      const runStart = start + inOffsets[run];
      const runEnd = start + (run + 1 < inCount ? inOffsets[run + 1] : m);
      const arriving = inValues[run];
      if (held && Math.abs(arriving - heldInput) <= INPUT_DEADBAND) {
        if (outCount === 0 || heldOutput !== outValues[outCount - 1]) {
          outOffsets[outCount] = runStart - start;
          outValues[outCount] = heldOutput;
          outCount += 1;
        }
        continue;
      }
      held = false;
      const thevenin = arriving * theveninScale;
      const driven = theveninConductance * thevenin;
      let equilibrium = Number.NaN;
      let previous = Number.NaN;
      for (let step = runStart; step < runEnd; step += 1) {
        const injected = driven + weight1 * v1 - weight2 * v2;
        let v = injected * inverseTotal;
        if (v > safeHigh || v < safeLow) {
          v = solveClamped(total, injected, supply, v1);
          const current = Math.abs(lastClampCurrent);
          if (current > this.clampCurrentPeak) {
            this.clampCurrentPeak = current;
            this.clampCurrentPeakTime = step * dt;
          }
        }
        v2 = v1;
        v1 = v;
        const port = v + endResistance * (thevenin - v) * theveninConductance;
        const wave = 2 * port - arriving;
        if (Math.abs(wave - lastWave) > OUTPUT_DEADBAND || outCount === 0) {
          lastWave = wave;
          outOffsets[outCount] = step - start;
          outValues[outCount] = wave;
          outCount += 1;
        }
        if (historyCount === 0 || Math.abs(v - historyValues[historyCount - 1]) > RUN_TOLERANCE) {
          historySteps[historyCount] = step;
          historyValues[historyCount] = v;
          historyCount += 1;
        }
        if (Math.abs(v - previous) <= SETTLED_TOLERANCE) {
          if (Number.isNaN(equilibrium)) equilibrium = pinEquilibrium(thevenin, theveninConductance, supply, clamps);
          if (Math.abs(v1 - equilibrium) <= SETTLED_TOLERANCE && Math.abs(v2 - equilibrium) <= SETTLED_TOLERANCE) {
            v1 = equilibrium;
            v2 = equilibrium;
            held = true;
            heldInput = arriving;
            heldOutput = lastWave;
            break;
          }
        }
        previous = v;
      }
    }
    out.count = outCount;
    history.count = historyCount;
    this.v1 = v1;
    this.v2 = v2;
    this.held = held;
    this.heldInput = heldInput;
    this.heldOutput = heldOutput;
    this.lastWave = lastWave;
  }
}

function solveDistributed(
  plan: SolverPlan,
  line: LineTotals,
  drive: DriveSchedule,
  resistances: DriverResistances,
  receiver: ReceiverLoad,
  scratch: SolverScratch,
): SolveOutput {
  const solver = new DistributedLine(plan, line, drive, resistances, receiver, scratch);
  solver.run();
  return {
    dt: plan.dt,
    stepCount: plan.stepCount,
    near: solver.near,
    far: solver.far,
    clampCurrentPeak: solver.clampCurrentPeak,
    clampCurrentPeakTime: solver.clampCurrentPeakTime,
  };
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
  const node = new FarNode(receiver.capacitance + line.capacitance, dt, receiver.supply, receiver.clamps);
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
      if (node.isSettledAt(equilibrium, SETTLED_TOLERANCE)) {
        node.holdAt(equilibrium);
        step = stop;
      }
    }
  }

  return { dt, stepCount, near, far, clampCurrentPeak, clampCurrentPeakTime };
}
