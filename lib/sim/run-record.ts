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

  /** Pushes runs copied from another record, their steps moved by `shift`. */
  append(steps: Int32Array, values: Float64Array, shift: number): void {
    let i = 0;
    while (i < steps.length && this.count > 0 && values[i] === this.values[this.count - 1]) i += 1;
    while (this.count + steps.length - i > this.steps.length) this.grow();
    for (; i < steps.length; i += 1) {
      this.steps[this.count] = steps[i] + shift;
      this.values[this.count] = values[i];
      this.count += 1;
    }
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
