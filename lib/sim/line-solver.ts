import { DriveSource, type DriveSchedule } from "./drive-source";
import { SimSolveBudgetError } from "./errors";
import { FarNode, pinEquilibrium } from "./far-node";
import { RunHistory, WaveChunk } from "./runs";

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
/** Segments per unit of R/Z0: keeps the lumped-loss error of the first arrival under about 0.2 %. */
const SEGMENTS_PER_LOSS = 125;
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
): SolveOutput {
  return plan.segments === 0
    ? solveLumped(plan, line, drive, resistances, receiver)
    : solveDistributed(plan, line, drive, resistances, receiver);
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

function solveDistributed(
  plan: SolverPlan,
  line: LineTotals,
  drive: DriveSchedule,
  resistances: DriverResistances,
  receiver: ReceiverLoad,
): SolveOutput {
  const { dt, stepCount, segments, stepsPerSegment: m } = plan;
  const z0 = line.z0;
  const endResistance = line.resistance / (2 * segments);
  const endConductance = line.conductance / (2 * segments);
  const junctionResistance = line.resistance / segments;
  const junctionConductance = line.conductance / segments;

  const source = new DriveSource(drive, dt);
  const near = new RunHistory();
  const far = new RunHistory();
  const node = new FarNode(receiver.capacitance, dt, receiver.supply, receiver.clamps);
  const high = nearEndCoefficients(resistances.high, endResistance, endConductance, z0);
  const low = nearEndCoefficients(resistances.low, endResistance, endConductance, z0);
  const forward: Stream[] = Array.from({ length: segments }, () => makeStream(m + 1));
  const backward: Stream[] = Array.from({ length: segments }, () => makeStream(m + 1));
  const streams = [...forward, ...backward];

  const theveninScale = 1 / (1 + endConductance * z0);
  const theveninConductance = 1 / (endResistance + z0 * theveninScale);
  const junctionArm = z0 + junctionResistance / 2;
  const junctionDivider = 1 / (2 + junctionConductance * junctionArm);

  let clampCurrentPeak = 0;
  let clampCurrentPeakTime = 0;

  const processNearEnd = (start: number, incoming: WaveChunk, out: WaveChunk) => {
    const end = start + m;
    let run = 0;
    let step = start;
    while (step < end) {
      const runEnd = start + (run + 1 < incoming.count ? incoming.offsets[run + 1] : m);
      const arriving = incoming.values[run];
      source.seek(step);
      const c = source.drivingHigh(step) ? high : low;
      if (source.inRamp(step)) {
        const stop = Math.min(source.rampEnd(), runEnd);
        for (; step < stop; step += 1) {
          const drive = source.rampValue(step);
          const port = c.fromSource * drive + c.fromLine * arriving;
          out.push(step - start, 2 * port - arriving);
          near.push(step, port + c.sourceShare * (drive - port));
        }
      } else {
        const drive = source.level();
        const port = c.fromSource * drive + c.fromLine * arriving;
        out.push(step - start, 2 * port - arriving);
        near.push(step, port + c.sourceShare * (drive - port));
        step = Math.min(source.nextChange(), runEnd);
      }
      if (step >= runEnd) run += 1;
    }
  };

  const processJunction = (fromLeft: WaveChunk, fromRight: WaveChunk, toLeft: WaveChunk, toRight: WaveChunk) => {
    let left = 0;
    let right = 0;
    let offset = 0;
    while (offset < m) {
      const leftEnd = left + 1 < fromLeft.count ? fromLeft.offsets[left + 1] : m;
      const rightEnd = right + 1 < fromRight.count ? fromRight.offsets[right + 1] : m;
      const waveLeft = fromLeft.values[left];
      const waveRight = fromRight.values[right];
      const middle = (waveLeft + waveRight) * junctionDivider;
      toLeft.push(offset, waveLeft - (2 * z0 * (waveLeft - middle)) / junctionArm);
      toRight.push(offset, waveRight - (2 * z0 * (waveRight - middle)) / junctionArm);
      offset = Math.min(leftEnd, rightEnd);
      if (offset >= leftEnd) left += 1;
      if (offset >= rightEnd) right += 1;
    }
  };

  let held = false;
  let heldInput = 0;
  let heldOutput = 0;

  const processFarEnd = (start: number, incoming: WaveChunk, out: WaveChunk) => {
    for (let run = 0; run < incoming.count; run += 1) {
      const runStart = start + incoming.offsets[run];
      const runEnd = start + (run + 1 < incoming.count ? incoming.offsets[run + 1] : m);
      const arriving = incoming.values[run];
      if (held && Math.abs(arriving - heldInput) <= INPUT_DEADBAND) {
        out.push(runStart - start, heldOutput);
        continue;
      }
      held = false;
      const thevenin = arriving * theveninScale;
      let equilibrium = Number.NaN;
      let previous = Number.NaN;
      for (let step = runStart; step < runEnd; step += 1) {
        const v = node.step(thevenin, theveninConductance);
        const current = Math.abs(node.current);
        if (current > clampCurrentPeak) {
          clampCurrentPeak = current;
          clampCurrentPeakTime = step * dt;
        }
        const port = v + endResistance * (thevenin - v) * theveninConductance;
        const wave = 2 * port - arriving;
        out.push(step - start, wave);
        far.push(step, v);
        if (Math.abs(v - previous) <= SETTLED_TOLERANCE) {
          if (Number.isNaN(equilibrium)) equilibrium = node.equilibrium(thevenin, theveninConductance);
          if (node.isSettledAt(equilibrium, SETTLED_TOLERANCE)) {
            node.holdAt(equilibrium);
            held = true;
            heldInput = arriving;
            heldOutput = wave;
            break;
          }
        }
        previous = v;
      }
    }
  };

  const dc = (level: number, sourceResistance: number) =>
    dcState(level, sourceResistance, segments, z0, endResistance, endConductance, junctionResistance, junctionConductance, receiver);
  const dcHigh = dc(drive.highVoltage, resistances.high);
  const dcLow = dc(0, resistances.low);

  const isQuiet = (state: DcState) => {
    if (!node.isSettledAt(state.pin, QUIET_BAND)) return false;
    for (let j = 0; j < segments; j += 1) {
      if (!forward[j].read.isNear(state.forward[j], QUIET_BAND)) return false;
      if (!backward[j].read.isNear(state.backward[j], QUIET_BAND)) return false;
    }
    return true;
  };

  const settleTo = (state: DcState, step: number) => {
    for (let j = 0; j < segments; j += 1) {
      forward[j].read.fillConstant(state.forward[j]);
      backward[j].read.fillConstant(state.backward[j]);
    }
    node.holdAt(state.pin);
    held = false;
    near.push(step, state.near);
    far.push(step, state.pin);
  };

  let chunk = 0;
  while (chunk * m < stepCount) {
    const start = chunk * m;
    processNearEnd(start, backward[0].read, forward[0].write);
    for (let j = 1; j < segments; j += 1) {
      processJunction(forward[j - 1].read, backward[j].read, backward[j - 1].write, forward[j].write);
    }
    processFarEnd(start, forward[segments - 1].read, backward[segments - 1].write);
    for (const stream of streams) {
      const written = stream.write;
      stream.write = stream.read;
      stream.read = written;
      stream.write.count = 0;
    }
    chunk += 1;

    const next = chunk * m;
    source.seek(next);
    if (!source.inRamp(next)) {
      const state = source.drivingHigh(next) ? dcHigh : dcLow;
      if (state.level === source.level() && isQuiet(state)) {
        settleTo(state, next);
        chunk = Math.max(chunk, Math.floor(source.nextChange() / m));
      }
    }
  }

  return { dt, stepCount, near, far, clampCurrentPeak, clampCurrentPeakTime };
}

/** A line with (almost) no delay: its resistance in series, its capacitance at the pin. */
function solveLumped(
  plan: SolverPlan,
  line: LineTotals,
  drive: DriveSchedule,
  resistances: DriverResistances,
  receiver: ReceiverLoad,
): SolveOutput {
  const { dt, stepCount } = plan;
  const source = new DriveSource(drive, dt);
  const near = new RunHistory();
  const far = new RunHistory();
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
