/**
 * The driver's ideal source sampled on the solver's step grid: linear ramps of `edgeTime`
 * (0–100 %), flat in between. Each ramp starts on the first step at or after its edge (so
 * nothing moves before the edge) and has the same samples as every other ramp: an edge that
 * repeats from the same state gives the same run of steps, which the solver can replay. The
 * shift is under one step (0.1 ns). Steps are visited in increasing order, so a cursor finds
 * the current edge in constant time.
 */
export type DriveSchedule = {
  /** Start of each edge (s), ascending; edges never overlap. */
  edgeStarts: Float64Array;
  rising: Uint8Array;
  edgeTime: number;
  highVoltage: number;
};

/** First step of each ramp and the first step after it. */
export function rampSteps(schedule: DriveSchedule, dt: number): { start: Int32Array; end: Int32Array } {
  const count = schedule.edgeStarts.length;
  const start = new Int32Array(count);
  const end = new Int32Array(count);
  const length = Math.ceil(schedule.edgeTime / dt - 1e-9);
  for (let k = 0; k < count; k += 1) {
    start[k] = Math.ceil(schedule.edgeStarts[k] / dt - 1e-9);
    end[k] = start[k] + length;
  }
  return { start, end };
}

/** Share of the swing a ramp covers `offset` steps after its first step. */
export function rampProgress(offset: number, dt: number, edgeTime: number): number {
  return Math.min(1, (offset * dt) / edgeTime);
}

export class DriveSource {
  private readonly startSteps: Int32Array;
  private readonly endSteps: Int32Array;
  private cursor = 0;

  constructor(
    private readonly schedule: DriveSchedule,
    private readonly dt: number,
  ) {
    const { start, end } = rampSteps(schedule, dt);
    this.startSteps = start;
    this.endSteps = end;
  }

  /** Moves the cursor to the first edge not yet finished at step n. */
  seek(step: number): void {
    const count = this.endSteps.length;
    while (this.cursor < count && this.endSteps[this.cursor] <= step) this.cursor += 1;
  }

  inRamp(step: number): boolean {
    return this.cursor < this.startSteps.length && this.startSteps[this.cursor] <= step;
  }

  rampEnd(): number {
    return this.endSteps[this.cursor];
  }

  rampValue(step: number): number {
    const { edgeTime, highVoltage, rising } = this.schedule;
    const progress = rampProgress(step - this.startSteps[this.cursor], this.dt, edgeTime);
    return rising[this.cursor] ? highVoltage * progress : highVoltage * (1 - progress);
  }

  /** The flat level before the current edge. */
  level(): number {
    return this.cursor > 0 && this.schedule.rising[this.cursor - 1] ? this.schedule.highVoltage : 0;
  }

  /** The step at which the source next starts to move (a large number after the last edge). */
  nextChange(): number {
    return this.cursor < this.startSteps.length ? this.startSteps[this.cursor] : 0x7fffffff;
  }

  /** Whether the driver's high-side resistance applies at this step (it switches as each edge starts). */
  drivingHigh(step: number): boolean {
    if (this.inRamp(step)) return this.schedule.rising[this.cursor] === 1;
    return this.cursor > 0 && this.schedule.rising[this.cursor - 1] === 1;
  }
}
