import { rampProgress, rampSteps, type DriveSchedule } from "./drive-source";
import { runAt, type RunRecord } from "./run-record";
import type { Trace } from "./trace";

/**
 * The cable's input (the near end), evaluated on demand at solver steps visited in increasing
 * order. The solver records only what it must (the wave arriving back at the driver); the
 * voltage follows from it and the drive wherever a caller asks, so a busy run does not pay for
 * a near-end trace nobody samples at full resolution.
 */
export interface NearEnd {
  at(step: number): number;
}

/** How the near-end port depends on the drive and the arriving wave, for one source resistance. */
export type EndCoefficients = { fromSource: number; fromLine: number; sourceShare: number };

/** The distributed line's driver end: source, resistance, R/2N and G/2N in front of the line. */
export class LineNearEnd implements NearEnd {
  private readonly rampStart: Int32Array;
  private readonly rampEnd: Int32Array;
  private run = 0;
  private edge = 0;

  constructor(
    private readonly arrivals: RunRecord,
    private readonly drive: DriveSchedule,
    private readonly dt: number,
    private readonly high: EndCoefficients,
    private readonly low: EndCoefficients,
  ) {
    const ramps = rampSteps(drive, dt);
    this.rampStart = ramps.start;
    this.rampEnd = ramps.end;
  }

  at(step: number): number {
    const { steps, values, count } = this.arrivals;
    this.run = runAt(steps, count, step, this.run);
    const arriving = values[this.run];
    const { rampStart, rampEnd } = this;
    const { rising, highVoltage, edgeTime } = this.drive;
    const edges = rampStart.length;
    if (this.edge > 0 && rampEnd[this.edge - 1] > step) this.edge = 0;
    while (this.edge < edges && rampEnd[this.edge] <= step) this.edge += 1;
    const k = this.edge;
    let up: boolean;
    let drive: number;
    if (k < edges && rampStart[k] <= step) {
      up = rising[k] === 1;
      const progress = rampProgress(step - rampStart[k], this.dt, edgeTime);
      drive = up ? highVoltage * progress : highVoltage * (1 - progress);
    } else {
      up = k > 0 && rising[k - 1] === 1;
      drive = up ? highVoltage : 0;
    }
    const { fromSource, fromLine, sourceShare } = up ? this.high : this.low;
    const port = fromSource * drive + fromLine * arriving;
    return port + sourceShare * (drive - port);
  }
}

/** A near end the solver traced step by step (the lumped line). */
export class TracedNearEnd implements NearEnd {
  private segment = 0;

  constructor(private readonly trace: Trace) {}

  at(step: number): number {
    const { steps, values, count } = this.trace;
    this.segment = runAt(steps, count, step, this.segment);
    const k = this.segment;
    if (k + 1 >= count) return values[k];
    return values[k] + ((step - steps[k]) / (steps[k + 1] - steps[k])) * (values[k + 1] - values[k]);
  }
}
