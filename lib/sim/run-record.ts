/**
 * Index of the last of `count` ascending `steps` at or before `step` (0 if none), searched from
 * `from`: the next few by walking, any further by halving, so sampling a busy record stays cheap.
 */
export function runAt(steps: Int32Array, count: number, step: number, from: number): number {
  let low = from > 0 && steps[from] > step ? 0 : from;
  for (let walk = 0; walk < 8; walk += 1) {
    if (low + 1 >= count || steps[low + 1] > step) return low;
    low += 1;
  }
  let high = count;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if (steps[middle] <= step) low = middle;
    else high = middle;
  }
  return low;
}

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

  /** Pushes the first `count` runs of another run list, their steps moved by `shift`. */
  append(steps: Int32Array, values: Float64Array, shift: number, count: number): void {
    // Runs in the list already differ from their neighbours; only the first can repeat the last one here.
    const first = this.count > 0 && count > 0 && values[0] === this.values[this.count - 1] ? 1 : 0;
    while (this.count + count - first > this.steps.length) this.grow();
    const ownSteps = this.steps;
    const ownValues = this.values;
    let at = this.count;
    for (let i = first; i < count; i += 1) {
      ownSteps[at] = steps[i] + shift;
      ownValues[at] = values[i];
      at += 1;
    }
    this.count = at;
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
