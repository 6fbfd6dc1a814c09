import { BitReplays, rephase, restoreStreams, type BitSnapshot, type PinState } from "./bit-replays";
import { rampProgress, rampSteps, type DriveSchedule } from "./drive-source";
import { LineNearEnd, type EndCoefficients } from "./near-end";
import type { RunRecord } from "./run-record";
import { SegmentLibrary } from "./segment-replays";
import { clampStepFrom, NEGLIGIBLE_CONDUCTION, pinEquilibrium, solveClamped } from "./far-node";
import type { DriverResistances, LineTotals, ReceiverLoad, SolveOutput, SolverPlan, SolverScratch, SolverTolerances } from "./line-solver";
import { RcBranch, withTermination } from "./termination";
import type { Trace } from "./trace";
import { WaveChunk } from "./wave-chunk";

/**
 * The distributed line by the method of characteristics (Bergeron), see lib/sim/README.md. It is
 * advanced one segment delay (a "chunk" of m steps) at a time: within a chunk every node reads
 * only what the other nodes wrote in the previous chunk, so each node runs through its chunk
 * alone. A node steps through busy stretches value by value and jumps over constant ones; the
 * hot loops keep their state in locals and write the typed arrays directly.
 */

/** Longer stretches between rests (a run that keeps ringing) are unlikely to come again: not worth copying. */
const MAX_RECORDED_EDGES = 8;

type DcState = {
  /** Stream values entering each segment from its left (forward) and right (backward) end. */
  forward: Float64Array;
  backward: Float64Array;
  pin: number;
};

/** Coefficients of the driver end: source, its resistance and R/2N, G/2N, then the line. */
function nearEndCoefficients(sourceResistance: number, endResistance: number, endConductance: number, z0: number): EndCoefficients {
  const total = sourceResistance + endResistance;
  const denominator = z0 + total + endConductance * total * z0;
  return {
    fromSource: z0 / denominator,
    fromLine: total / denominator,
    sourceShare: total > 0 ? endResistance / total : 1,
  };
}

type Ladder = {
  segments: number;
  z0: number;
  endResistance: number;
  endConductance: number;
  junctionResistance: number;
  junctionConductance: number;
};

/**
 * The DC state of the whole circuit for a flat drive level: the resistive ladder reduced to a
 * Thevenin source at the pin, the pin solved with its clamps, then currents and voltages walked
 * back to the driver. Stream values are v + Z0·i with i the current into the segment.
 */
function dcState(level: number, sourceResistance: number, ladder: Ladder, receiver: ReceiverLoad): DcState {
  const { segments, z0, endResistance, endConductance, junctionResistance, junctionConductance } = ladder;
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
  const fed = withTermination(theveninVoltage, 1 / theveninResistance, receiver.termination);
  const pin = pinEquilibrium(fed.source, fed.conductance, receiver.supply, receiver.clamps, receiver.clampSeriesResistance);

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
  return { forward, backward, pin };
}

/** Two chunks per stream: the one being read (written last chunk) and the one being written; a third when bit replays re-cut the chunks. */
type Stream = { read: WaveChunk; write: WaveChunk; spare: WaveChunk | null };

function makeStream(length: number, withSpare: boolean): Stream {
  const read = new WaveChunk(length);
  read.fillConstant(0);
  return { read, write: new WaveChunk(length), spare: withSpare ? new WaveChunk(length) : null };
}

class DistributedLine {
  private readonly m: number;
  private readonly segments: number;
  private readonly dt: number;
  private readonly stepCount: number;
  private readonly tolerances: SolverTolerances;
  private readonly z0: number;
  private readonly endResistance: number;
  private readonly theveninScale: number;
  private readonly theveninConductance: number;
  /** An inner junction sends back `junctionBack` of each arriving wave and passes on `junctionThrough`. */
  private readonly junctionBack: number;
  private readonly junctionThrough: number;
  private readonly forward: Stream[];
  private readonly backward: Stream[];
  /** Per inner junction: the two inputs it last answered and its two outputs. */
  private readonly junctionState: Float64Array;
  /** The pin's voltage at each step of the current chunk, handed to the trace in spans. */
  private readonly pinValues: Float64Array;
  /** The wave arriving back at the driver end, from which the near-end voltage follows. */
  readonly arrivals: RunRecord;
  readonly far: Trace;

  private readonly drive: DriveSchedule;
  private readonly edgeTime: number;
  private readonly highVoltage: number;
  private readonly rising: Uint8Array;
  private readonly rampStart: Int32Array;
  private readonly rampEnd: Int32Array;
  /** The first edge not yet finished, as far as the near end has got. */
  private cursor = 0;
  private readonly high: EndCoefficients;
  private readonly low: EndCoefficients;
  private readonly dcHigh: DcState;
  private readonly dcLow: DcState;

  private readonly capacitiveConductance: number;
  private readonly historyWeight1: number;
  private readonly historyWeight2: number;
  private readonly supply: number;
  private readonly clamps: boolean;
  private readonly clampSeriesResistance: number;
  private readonly safeLow: number;
  private readonly safeHigh: number;
  /** The far-end termination's resistive part (to ground and its current from the supply) and its RC branch. */
  private readonly terminationConductance: number;
  private readonly terminationCurrent: number;
  private readonly branch: RcBranch;
  private readonly library = new SegmentLibrary();
  private readonly replays: BitReplays | null;
  /** The bit being solved since its first step, to be completed when the next bit starts. */
  private openBit: BitSnapshot | null = null;
  private bitClampPeak = 0;
  private bitClampPeakStep = -1;
  /** The stretch being solved since the last rest, to be recorded when the next rest comes. */
  private segment: { start: number; firstEdge: number; startsHigh: boolean; farFrom: number; arrivalsFrom: number } | null = null;
  private segmentClampPeak = 0;
  private segmentClampPeakStep = -1;
  private v1 = 0;
  private v2 = 0;
  private held = false;
  private heldInput = 0;
  private heldOutput = 0;
  private lastWave = 0;
  /** Clamp current of the last step (A, positive into VDD), 0 when the clamps were off. */
  private clampCurrent = 0;
  clampCurrentPeak = 0;
  clampCurrentPeakTime = 0;
  /** Bits copied by bit replays instead of solved. */
  copiedBits = 0;

  constructor(plan: SolverPlan, line: LineTotals, drive: DriveSchedule, resistances: DriverResistances, receiver: ReceiverLoad, scratch: SolverScratch) {
    const { segments, stepsPerSegment: m, dt } = plan;
    this.m = m;
    this.segments = segments;
    this.dt = dt;
    this.stepCount = plan.stepCount;
    this.tolerances = plan.tolerances;
    this.z0 = line.z0;
    const ladder: Ladder = {
      segments,
      z0: line.z0,
      endResistance: line.resistance / (2 * segments),
      endConductance: line.conductance / (2 * segments),
      junctionResistance: line.resistance / segments,
      junctionConductance: line.conductance / segments,
    };
    this.endResistance = ladder.endResistance;
    this.theveninScale = 1 / (1 + ladder.endConductance * this.z0);
    this.theveninConductance = 1 / (this.endResistance + this.z0 * this.theveninScale);
    // Junction middle node: m = (a + b)·d with d = 1/(2 + G·arm), arm = Z0 + R/2; each port sends
    // back a − (2·Z0/arm)·(a − m), so back = 1 − k + k·d and through = k·d with k = 2·Z0/arm.
    const arm = this.z0 + ladder.junctionResistance / 2;
    const divider = 1 / (2 + ladder.junctionConductance * arm);
    const share = (2 * this.z0) / arm;
    this.junctionBack = 1 - share + share * divider;
    this.junctionThrough = share * divider;
    const replaying = plan.bitReplayTolerance > 0;
    this.forward = Array.from({ length: segments }, () => makeStream(m, replaying));
    this.backward = Array.from({ length: segments }, () => makeStream(m, replaying));
    this.replays = replaying ? new BitReplays(plan.bitReplayTolerance) : null;
    this.junctionState = new Float64Array(4 * segments);
    this.pinValues = new Float64Array(m);
    this.arrivals = scratch.arrivals;
    this.far = scratch.far;
    this.arrivals.clear();
    this.far.clear();

    this.drive = drive;
    this.edgeTime = drive.edgeTime;
    this.highVoltage = drive.highVoltage;
    this.rising = drive.rising;
    const ramps = rampSteps(drive, dt);
    this.rampStart = ramps.start;
    this.rampEnd = ramps.end;
    this.high = nearEndCoefficients(resistances.high, this.endResistance, ladder.endConductance, this.z0);
    this.low = nearEndCoefficients(resistances.low, this.endResistance, ladder.endConductance, this.z0);
    this.dcHigh = dcState(drive.highVoltage, resistances.high, ladder, receiver);
    this.dcLow = dcState(0, resistances.low, ladder, receiver);

    this.capacitiveConductance = (3 * receiver.capacitance) / (2 * dt);
    this.historyWeight1 = (2 * receiver.capacitance) / dt;
    this.historyWeight2 = receiver.capacitance / (2 * dt);
    this.supply = receiver.supply;
    this.clamps = receiver.clamps;
    this.clampSeriesResistance = receiver.clampSeriesResistance;
    this.safeLow = receiver.clamps ? -NEGLIGIBLE_CONDUCTION : -Infinity;
    this.safeHigh = receiver.clamps ? receiver.supply + NEGLIGIBLE_CONDUCTION : Infinity;
    this.terminationConductance = receiver.termination.conductance;
    this.terminationCurrent = receiver.termination.current;
    this.branch = new RcBranch(receiver.termination, dt);
  }

  run(): void {
    const { m, segments, forward, backward, stepCount, rampStart, rising } = this;
    const streams = [...forward, ...backward];
    // Everything starts at 0 V: the DC state of the low drive.
    let start = this.restAt(0, false, 0);
    let edge = 0;
    let marked = -1;
    while (start < stepCount) {
      let length = Math.min(m, stepCount - start);
      let cut = false;
      if (this.replays !== null) {
        // Bit replays need whole states at each bit's first step (a rising edge's): chunks end there.
        const edges = rampStart.length;
        while (edge < edges && (rampStart[edge] < start || rising[edge] !== 1 || (rampStart[edge] === start && marked === start))) edge += 1;
        if (edge < edges && rampStart[edge] === start) {
          start = this.atBitStart(edge, start, streams);
          marked = start;
          continue;
        }
        if (edge < edges && rampStart[edge] < start + length) {
          length = rampStart[edge] - start;
          cut = true;
        }
      }
      this.nearEnd(start, length, backward[0].read, forward[0].write);
      for (let j = 1; j < segments; j += 1) {
        this.junction(j, length, forward[j - 1].read, backward[j].read, backward[j - 1].write, forward[j].write);
      }
      this.farEnd(start, length, forward[segments - 1].read, backward[segments - 1].write);
      for (const stream of streams) {
        if (cut) {
          const spare = stream.spare as WaveChunk;
          stream.spare = rephase(stream.read, stream.write, length, m, spare);
          stream.read = spare;
          continue;
        }
        const written = stream.write;
        stream.write = stream.read;
        stream.read = written;
      }
      start = this.restIfQuiet(start + length);
    }
    this.far.finish(stepCount - 1);
  }

  private pinState(): PinState {
    return {
      v1: this.v1,
      v2: this.v2,
      held: this.held,
      heldInput: this.heldInput,
      heldOutput: this.heldOutput,
      lastWave: this.lastWave,
      clampCurrent: this.clampCurrent,
      branch1: this.branch.c1,
      branch2: this.branch.c2,
    };
  }

  private setPinState(pin: PinState): void {
    this.v1 = pin.v1;
    this.v2 = pin.v2;
    this.held = pin.held;
    this.heldInput = pin.heldInput;
    this.heldOutput = pin.heldOutput;
    this.lastWave = pin.lastWave;
    this.clampCurrent = pin.clampCurrent;
    this.branch.c1 = pin.branch1;
    this.branch.c2 = pin.branch2;
  }

  /** What must match for bit replays: the fall's and the next bit's steps after this rising edge. */
  private bitKey(edge: number): string {
    const { rampStart } = this;
    const fall = edge + 1 < rampStart.length ? rampStart[edge + 1] - rampStart[edge] : -1;
    const next = edge + 2 < rampStart.length ? rampStart[edge + 2] - rampStart[edge] : -1;
    return `${fall}:${next}`;
  }

  /**
   * At a bit's first step (edge `edge`, step `step`): closes the bit solved before it, then copies
   * bits on from an earlier one whose state matches, as long as the bits ahead match too, and
   * takes a snapshot where solving resumes. Returns that step.
   */
  private atBitStart(edge: number, step: number, streams: Stream[]): number {
    const replays = this.replays as BitReplays;
    const reads = () => streams.map((stream) => stream.read);
    this.far.closeAtLast();
    const open = this.openBit;
    if (open !== null) {
      open.farTo = this.far.count;
      open.arrivalsTo = this.arrivals.count;
      open.clampPeak = this.bitClampPeak;
      open.clampPeakAt = this.bitClampPeakStep < 0 ? -1 : this.bitClampPeakStep - open.step;
    }
    const last = (at: number) => at + 2 >= this.rampStart.length;
    let match = last(edge) ? null : replays.find(this.bitKey(edge), reads(), this.junctionState, this.pinState());
    if (match !== null) {
      if (open !== null) open.next = match;
      while (match.next !== null && !last(edge) && match.key === this.bitKey(edge)) {
        const shift = step - match.step;
        if (match.farTo > match.farFrom) {
          this.far.append(this.far.steps.slice(match.farFrom, match.farTo), this.far.values.slice(match.farFrom, match.farTo), shift);
        }
        const arrivalSteps = this.arrivals.steps.slice(match.arrivalsFrom, match.arrivalsTo);
        this.arrivals.append(arrivalSteps, this.arrivals.values.slice(match.arrivalsFrom, match.arrivalsTo), shift, arrivalSteps.length);
        if (match.clampPeakAt >= 0 && match.clampPeak > this.clampCurrentPeak) {
          this.clampCurrentPeak = match.clampPeak;
          this.clampCurrentPeakTime = (step + match.clampPeakAt) * this.dt;
        }
        // The next snapshot may stand for a state met elsewhere in the run: the step moves by this run's bit.
        step += this.rampStart[edge + 2] - this.rampStart[edge];
        edge += 2;
        this.copiedBits += 1;
        match = match.next;
      }
      restoreStreams(match, reads());
      this.junctionState.set(match.junctions);
      this.setPinState(match.pin);
      this.cursor = edge;
      // A stretch being recorded for the rest replays no longer holds only solved steps.
      this.segment = null;
    }
    this.bitClampPeak = 0;
    this.bitClampPeakStep = -1;
    const snapshot = replays.take(step, this.bitKey(edge), reads(), this.junctionState, this.pinState(), this.far.count, this.arrivals.count);
    if (open !== null && match === null) open.next = snapshot;
    this.openBit = snapshot;
    return step;
  }

  nearEndVoltages(): LineNearEnd {
    return new LineNearEnd(this.arrivals, this.drive, this.dt, this.high, this.low);
  }

  /** Index of the first edge not finished at `step`, from the cursor on. */
  private edgeAt(step: number): number {
    let k = this.cursor;
    while (k < this.rampEnd.length && this.rampEnd[k] <= step) k += 1;
    this.cursor = k;
    return k;
  }

  /** When the whole line sits within the quiet tolerance of the DC state of a flat drive, rests it there. Returns the step to go on from. */
  private restIfQuiet(next: number): number {
    if (next >= this.stepCount) return next;
    const k = this.edgeAt(next);
    if (k < this.rampStart.length && this.rampStart[k] <= next) return next;
    const high = k > 0 && this.rising[k - 1] === 1;
    const state = high ? this.dcHigh : this.dcLow;
    const band = this.tolerances.quiet;
    if (Math.abs(this.v1 - state.pin) > band || Math.abs(this.v2 - state.pin) > band) return next;
    if (!this.branch.isQuietAt(state.pin, band)) return next;
    const { segments, forward, backward } = this;
    for (let j = 0; j < segments; j += 1) {
      if (!forward[j].read.isNear(state.forward[j], band)) return next;
      if (!backward[j].read.isNear(state.backward[j], band)) return next;
    }
    return this.restAt(next, high, k);
  }

  /**
   * Sets the line to the exact DC state at step `rest` and moves on to edge `edge`: while the
   * edges ahead match a recorded segment, copies it (it ends at another rest); otherwise starts
   * recording and returns the edge's first step, where solving resumes.
   */
  private restAt(rest: number, high: boolean, edge: number): number {
    let state = high ? this.dcHigh : this.dcLow;
    this.far.breakAt(rest, state.pin);
    this.arrivals.push(rest, state.backward[0]);
    this.closeSegment(rest, edge);
    let startsHigh = high;
    let k = edge;
    while (k < this.rampStart.length) {
      const edgeStep = this.rampStart[k];
      this.far.breakAt(edgeStep, state.pin);
      this.arrivals.push(edgeStep, state.backward[0]);
      const recording = this.library.find(startsHigh, this.rampStart, this.rising, k, this.stepCount);
      if (recording === null) {
        this.setDc(state, k);
        this.segment = { start: edgeStep, firstEdge: k, startsHigh, farFrom: this.far.count, arrivalsFrom: this.arrivals.count };
        this.segmentClampPeak = 0;
        this.segmentClampPeakStep = -1;
        return edgeStep;
      }
      // The bit being solved now spans recorded stretches: it cannot be copied as one bit.
      this.openBit = null;
      this.far.append(recording.farSteps, recording.farValues, edgeStep);
      this.arrivals.append(recording.arrivalSteps, recording.arrivalValues, edgeStep, recording.arrivalSteps.length);
      if (recording.clampPeakAt >= 0 && recording.clampCurrentPeak > this.clampCurrentPeak) {
        this.clampCurrentPeak = recording.clampCurrentPeak;
        this.clampCurrentPeakTime = (edgeStep + recording.clampPeakAt) * this.dt;
      }
      k += recording.offsets.length;
      startsHigh = recording.rising[recording.offsets.length - 1] === 1;
      state = startsHigh ? this.dcHigh : this.dcLow;
    }
    this.setDc(state, k);
    return this.stepCount;
  }

  /** Records the segment solved since the last rest, which ends with the rest at `rest`, before edge `nextEdge`. */
  private closeSegment(rest: number, nextEdge: number): void {
    const segment = this.segment;
    this.segment = null;
    if (segment === null || nextEdge - segment.firstEdge > MAX_RECORDED_EDGES) return;
    const { start, firstEdge } = segment;
    const offsets = this.rampStart.slice(firstEdge, nextEdge);
    for (let j = 0; j < offsets.length; j += 1) offsets[j] -= start;
    const far = this.far.copySince(segment.farFrom, start);
    const arrivalSteps = this.arrivals.steps.slice(segment.arrivalsFrom, this.arrivals.count);
    for (let i = 0; i < arrivalSteps.length; i += 1) arrivalSteps[i] -= start;
    this.library.add({
      startsHigh: segment.startsHigh,
      offsets,
      rising: this.rising.slice(firstEdge, nextEdge),
      restAt: rest - start,
      farSteps: far.steps,
      farValues: far.values,
      arrivalSteps,
      arrivalValues: this.arrivals.values.slice(segment.arrivalsFrom, this.arrivals.count),
      clampCurrentPeak: this.segmentClampPeak,
      clampPeakAt: this.segmentClampPeakStep < 0 ? -1 : this.segmentClampPeakStep - start,
    });
  }

  /** Puts every wave, junction and the pin at the DC state; `edge` is the next edge. */
  private setDc(state: DcState, edge: number): void {
    const { segments, forward, backward, junctionState } = this;
    for (let j = 0; j < segments; j += 1) {
      forward[j].read.fillConstant(state.forward[j]);
      backward[j].read.fillConstant(state.backward[j]);
    }
    for (let j = 1; j < segments; j += 1) {
      junctionState[4 * j] = state.forward[j - 1];
      junctionState[4 * j + 1] = state.backward[j];
      junctionState[4 * j + 2] = state.backward[j - 1];
      junctionState[4 * j + 3] = state.forward[j];
    }
    // The DC state is exact: the pin holds it until something new arrives.
    this.v1 = state.pin;
    this.v2 = state.pin;
    this.branch.holdAt(state.pin);
    this.held = true;
    this.heldInput = state.forward[segments - 1];
    this.heldOutput = state.backward[segments - 1];
    this.lastWave = this.heldOutput;
    this.clampCurrent = 0;
    this.cursor = edge;
  }

  private nearEnd(start: number, length: number, incoming: WaveChunk, out: WaveChunk): void {
    const { rampStart, rampEnd, rising, high, low, dt, edgeTime, highVoltage } = this;
    const progressOf = rampProgress;
    const edges = rampStart.length;
    const inOffsets = incoming.offsets;
    const inValues = incoming.values;
    const inCount = incoming.count;
    const outOffsets = out.offsets;
    const outValues = out.values;
    let inside = inCount;
    while (inside > 1 && inOffsets[inside - 1] >= length) inside -= 1;
    this.arrivals.append(inOffsets, inValues, start, inside);
    let outCount = 0;
    let lastOut = Number.NaN;
    let k = this.cursor;
    let run = 0;
    let nextChange = inCount > 1 ? inOffsets[1] : length;
    let arriving = inValues[0];
    let i = 0;
    while (i < length) {
      const step = start + i;
      while (k < edges && rampEnd[k] <= step) k += 1;
      const ramping = k < edges && rampStart[k] <= step;
      const up = ramping ? rising[k] === 1 : k > 0 && rising[k - 1] === 1;
      const { fromSource, fromLine } = up ? high : low;
      if (ramping) {
        const stop = Math.min(rampEnd[k] - start, length);
        const origin = rampStart[k];
        for (; i < stop; i += 1) {
          if (i >= nextChange) {
            run += 1;
            arriving = inValues[run];
            nextChange = run + 1 < inCount ? inOffsets[run + 1] : length;
          }
          const progress = progressOf(start + i - origin, dt, edgeTime);
          const drive = up ? highVoltage * progress : highVoltage * (1 - progress);
          const port = fromSource * drive + fromLine * arriving;
          const wave = 2 * port - arriving;
          if (wave !== lastOut) {
            outOffsets[outCount] = i;
            outValues[outCount] = wave;
            outCount += 1;
            lastOut = wave;
          }
        }
        continue;
      }
      // A flat drive and a constant arriving wave give one output for the whole stretch.
      const drive = up ? highVoltage : 0;
      const stop = k < edges ? Math.min(rampStart[k] - start, length) : length;
      while (i < stop) {
        if (i >= nextChange) {
          run += 1;
          arriving = inValues[run];
          nextChange = run + 1 < inCount ? inOffsets[run + 1] : length;
        }
        const port = fromSource * drive + fromLine * arriving;
        const wave = 2 * port - arriving;
        if (wave !== lastOut) {
          outOffsets[outCount] = i;
          outValues[outCount] = wave;
          outCount += 1;
          lastOut = wave;
        }
        i = Math.min(nextChange, stop);
      }
    }
    out.count = outCount;
    this.cursor = k;
  }

  /**
   * An inner junction (R/N in series, G/N to ground). It ignores input changes within the
   * junction tolerance of the inputs it last answered: the small reflections of the lumped
   * resistors would otherwise bounce between junctions without end.
   */
  private junction(j: number, length: number, fromLeft: WaveChunk, fromRight: WaveChunk, toLeft: WaveChunk, toRight: WaveChunk): void {
    const { junctionThrough, junctionBack, junctionState } = this;
    const deadband = this.tolerances.junction;
    const base = 4 * j;
    let heldLeft = junctionState[base];
    let heldRight = junctionState[base + 1];
    let outLeft = junctionState[base + 2];
    let outRight = junctionState[base + 3];
    const leftOffsets = fromLeft.offsets;
    const leftValues = fromLeft.values;
    const leftCount = fromLeft.count;
    const rightOffsets = fromRight.offsets;
    const rightValues = fromRight.values;
    const rightCount = fromRight.count;
    const toLeftOffsets = toLeft.offsets;
    const toLeftValues = toLeft.values;
    const toRightOffsets = toRight.offsets;
    const toRightValues = toRight.values;
    let toLeftCount = 0;
    let toRightCount = 0;
    let left = 0;
    let right = 0;
    let offset = 0;
    while (offset < length) {
      const leftEnd = left + 1 < leftCount ? leftOffsets[left + 1] : length;
      const rightEnd = right + 1 < rightCount ? rightOffsets[right + 1] : length;
      const waveLeft = leftValues[left];
      const waveRight = rightValues[right];
      if (Math.abs(waveLeft - heldLeft) > deadband || Math.abs(waveRight - heldRight) > deadband) {
        heldLeft = waveLeft;
        heldRight = waveRight;
        outLeft = junctionBack * waveLeft + junctionThrough * waveRight;
        outRight = junctionThrough * waveLeft + junctionBack * waveRight;
      }
      if (toLeftCount === 0 || outLeft !== toLeftValues[toLeftCount - 1]) {
        toLeftOffsets[toLeftCount] = offset;
        toLeftValues[toLeftCount] = outLeft;
        toLeftCount += 1;
      }
      if (toRightCount === 0 || outRight !== toRightValues[toRightCount - 1]) {
        toRightOffsets[toRightCount] = offset;
        toRightValues[toRightCount] = outRight;
        toRightCount += 1;
      }
      offset = leftEnd < rightEnd ? leftEnd : rightEnd;
      if (offset >= leftEnd) left += 1;
      if (offset >= rightEnd) right += 1;
    }
    toLeft.count = toLeftCount;
    toRight.count = toRightCount;
    junctionState[base] = heldLeft;
    junctionState[base + 1] = heldRight;
    junctionState[base + 2] = outLeft;
    junctionState[base + 3] = outRight;
  }

  /**
   * The pin: C by BDF2, the clamps by a bracketed Newton solve when the pin is beyond a rail.
   * Once it sits within the settled tolerance of its DC value for the arriving wave it is held
   * there, and ignores arriving changes under the input tolerance.
   */
  private farEnd(start: number, length: number, incoming: WaveChunk, out: WaveChunk): void {
    const { endResistance, theveninScale, theveninConductance, safeLow, safeHigh, supply, clamps, clampSeriesResistance, dt } = this;
    const { settled, input: inputDeadband, output: outputDeadband } = this.tolerances;
    // Imported functions are property reads in bundled code: read them once, not every step.
    const clampedVoltage = solveClamped;
    const clampStep = clampStepFrom;
    const equilibriumOf = pinEquilibrium;
    const { terminationConductance, terminationCurrent, branch } = this;
    const branchActive = branch.active;
    // What feeds the pin at DC: the line's Thevenin source with the termination beside it.
    const feedConductance = theveninConductance + terminationConductance;
    const total = feedConductance + branch.conductance + this.capacitiveConductance;
    const inverseTotal = 1 / total;
    const weight1 = this.historyWeight1;
    const weight2 = this.historyWeight2;
    const inOffsets = incoming.offsets;
    const inValues = incoming.values;
    const inCount = incoming.count;
    const outOffsets = out.offsets;
    const outValues = out.values;
    const trace = this.far;
    let outCount = 0;
    let lastOut = Number.NaN;
    let v1 = this.v1;
    let v2 = this.v2;
    let held = this.held;
    let heldInput = this.heldInput;
    let heldOutput = this.heldOutput;
    let lastWave = this.lastWave;
    let clampCurrent = this.clampCurrent;
    let clampPeak = 0;
    let clampPeakStep = -1;
    const pin = this.pinValues;
    let traced = 0;
    let run = 0;
    let nextChange = inCount > 1 ? inOffsets[1] : length;
    let arriving = inValues[0];
    let thevenin = arriving * theveninScale;
    let driven = theveninConductance * thevenin + terminationCurrent;
    let equilibrium = Number.NaN;
    let i = 0;
    while (i < length) {
      if (i >= nextChange) {
        run += 1;
        arriving = inValues[run];
        nextChange = run + 1 < inCount ? inOffsets[run + 1] : length;
        thevenin = arriving * theveninScale;
        driven = theveninConductance * thevenin + terminationCurrent;
        equilibrium = Number.NaN;
      }
      if (held) {
        if (Math.abs(arriving - heldInput) <= inputDeadband) {
          trace.pushSpan(start, pin, traced, i);
          traced = nextChange;
          if (heldOutput !== lastOut) {
            outOffsets[outCount] = i;
            outValues[outCount] = heldOutput;
            outCount += 1;
            lastOut = heldOutput;
          }
          i = nextChange;
          continue;
        }
        held = false;
      }
      const branchCurrent = branchActive ? branch.current() : 0;
      const injected = driven + branchCurrent + weight1 * v1 - weight2 * v2;
      let v = injected * inverseTotal;
      if (v > safeHigh || v < safeLow) {
        const quick = clampCurrent === 0 ? Number.NaN : clampStep(total, injected, supply, v1, clampCurrent, clampSeriesResistance);
        v = quick === quick ? quick : clampedVoltage(total, injected, supply, 2 * v1 - v2, clampSeriesResistance);
        clampCurrent = injected - total * v;
        const magnitude = Math.abs(clampCurrent);
        if (magnitude > clampPeak) {
          clampPeak = magnitude;
          clampPeakStep = start + i;
        }
      } else {
        clampCurrent = 0;
      }
      if (branchActive) branch.advance(v, branchCurrent);
      v2 = v1;
      v1 = v;
      const wave = 2 * (v + endResistance * (thevenin - v) * theveninConductance) - arriving;
      if (Math.abs(wave - lastWave) > outputDeadband) lastWave = wave;
      if (lastWave !== lastOut) {
        outOffsets[outCount] = i;
        outValues[outCount] = lastWave;
        outCount += 1;
        lastOut = lastWave;
      }
      pin[i] = v;
      if (Math.abs(v1 - v2) <= settled) {
        // A clamped pin's DC value is one short Newton step away, or too far away to hold at.
        if (clampCurrent !== 0) equilibrium = clampStep(feedConductance, driven, supply, v1, clampCurrent, clampSeriesResistance);
        else if (equilibrium !== equilibrium) equilibrium = equilibriumOf(driven / feedConductance, feedConductance, supply, clamps, clampSeriesResistance);
        if (
          Math.abs(v1 - equilibrium) <= settled &&
          Math.abs(v2 - equilibrium) <= settled &&
          (!branchActive || branch.isQuietAt(equilibrium, settled))
        ) {
          v1 = equilibrium;
          v2 = equilibrium;
          if (branchActive) branch.holdAt(equilibrium);
          clampCurrent = 0;
          held = true;
          heldInput = arriving;
          heldOutput = lastWave;
        }
      }
      i += 1;
    }
    trace.pushSpan(start, pin, traced, length);
    out.count = outCount;
    this.v1 = v1;
    this.v2 = v2;
    this.held = held;
    this.heldInput = heldInput;
    this.heldOutput = heldOutput;
    this.lastWave = lastWave;
    this.clampCurrent = clampCurrent;
    if (clampPeak > this.clampCurrentPeak) {
      this.clampCurrentPeak = clampPeak;
      this.clampCurrentPeakTime = clampPeakStep * dt;
    }
    if (clampPeak > this.bitClampPeak) {
      this.bitClampPeak = clampPeak;
      this.bitClampPeakStep = clampPeakStep;
    }
    if (clampPeak > this.segmentClampPeak) {
      this.segmentClampPeak = clampPeak;
      this.segmentClampPeakStep = clampPeakStep;
    }
  }
}

export function solveDistributed(
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
    near: solver.nearEndVoltages(),
    far: solver.far,
    clampCurrentPeak: solver.clampCurrentPeak,
    clampCurrentPeakTime: solver.clampCurrentPeakTime,
    copiedBits: solver.copiedBits,
  };
}
