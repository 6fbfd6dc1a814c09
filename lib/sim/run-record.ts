/** A whole wave as runs of equal values: run k holds `values[k]` from step `steps[k]` to the next run. */
export class RunRecord {
  steps: Int32Array;
  values: Float64Array;
  count = 0;

  constructor(initialCapacity = 4096) {
    this.steps = new Int32Array(initialCapacity);
    this.values = new Float64Array(initialCapacity);
  }

  clear(): void {
    this.count = 0;
  }

  /** Starts a run at `step` unless the value equals the last run's. */
  push(step: number, value: number): void {
    const count = this.count;
    if (count > 0 && value === this.values[count - 1]) return;
    if (count === this.steps.length) this.grow();
    this.steps[count] = step;
    this.values[count] = value;
    this.count = count + 1;
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
