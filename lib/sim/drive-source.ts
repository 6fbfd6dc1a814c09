/**
 * The driver's ideal source sampled on the solver's step grid: linear ramps of `edgeTime`
 * (0–100 %) starting at each edge, flat in between. Steps are visited in increasing order, so
 * a cursor finds the current edge in constant time.
 */
export type DriveSchedule = {
  /** Start of each edge (s), ascending; edges never overlap. */
  edgeStarts: Float64Array;
  rising: Uint8Array;
  edgeTime: number;
  highVoltage: number;
};

export class DriveSource {
  private readonly startSteps: Int32Array;
  private readonly endSteps: Int32Array;
  private cursor = 0;

  constructor(
    private readonly schedule: DriveSchedule,
    private readonly dt: number,
  ) {
    const count = schedule.edgeStarts.length;
    this.startSteps = new Int32Array(count);
    this.endSteps = new Int32Array(count);
    for (let k = 0; k < count; k += 1) {
      this.startSteps[k] = Math.ceil(schedule.edgeStarts[k] / dt - 1e-9);
      this.endSteps[k] = Math.ceil((schedule.edgeStarts[k] + schedule.edgeTime) / dt - 1e-9);
    }
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
    const { edgeStarts, edgeTime, highVoltage, rising } = this.schedule;
    const progress = Math.min(1, Math.max(0, (step * this.dt - edgeStarts[this.cursor]) / edgeTime));
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
