/**
 * Run-length storage of sampled waves: consecutive steps with the same value are one run, so
 * flat stretches (most of a pulse train) cost one entry and the solver can skip them.
 */

/** Recorded waveforms merge steps within this much of a run's first value (V). */
export const RUN_TOLERANCE = 1e-4;

/** One segment delay's worth of a wave entering a line segment, by step offset within the chunk. */
export class WaveChunk {
  offsets: Int32Array;
  values: Float64Array;
  count = 0;

  constructor(capacity: number) {
    this.offsets = new Int32Array(capacity);
    this.values = new Float64Array(capacity);
  }

  push(offset: number, value: number): void {
    const count = this.count;
    if (count > 0 && value === this.values[count - 1]) return;
    this.offsets[count] = offset;
    this.values[count] = value;
    this.count = count + 1;
  }

  fillConstant(value: number): void {
    this.offsets[0] = 0;
    this.values[0] = value;
    this.count = 1;
  }

  /** True when every run lies within `band` of `target`. */
  isNear(target: number, band: number): boolean {
    for (let k = 0; k < this.count; k += 1) {
      if (Math.abs(this.values[k] - target) > band) return false;
    }
    return true;
  }
}

/** A whole waveform as runs: run k holds `values[k]` from step `steps[k]` to the next run. */
export class RunHistory {
  steps: Int32Array;
  values: Float64Array;
  count = 0;

  constructor(initialCapacity = 4096) {
    this.steps = new Int32Array(initialCapacity);
    this.values = new Float64Array(initialCapacity);
  }

  push(step: number, value: number): void {
    const count = this.count;
    if (count > 0 && Math.abs(value - this.values[count - 1]) <= RUN_TOLERANCE) return;
    if (count === this.steps.length) this.grow();
    this.steps[count] = step;
    this.values[count] = value;
    this.count = count + 1;
  }

  clear(): void {
    this.count = 0;
  }

  /** Makes room for `extra` more runs, so that a caller may write them directly. */
  reserve(extra: number): void {
    while (this.count + extra > this.steps.length) this.grow();
  }

  private grow(): void {
    const steps = new Int32Array(this.steps.length * 2);
    const values = new Float64Array(this.values.length * 2);
    steps.set(this.steps);
    values.set(this.values);
    this.steps = steps;
    this.values = values;
  }
}
