/**
 * A recorded waveform as a piecewise-linear curve on the solver's step grid, kept to within
 * TRACE_TOLERANCE of every step's value. Steps are fed in increasing order; a step that is
 * skipped holds the value fed last (a flat stretch costs nothing). Each new breakpoint is placed
 * on a line that still fits every step since the previous one (the "swinging door" of
 * data-historian compression, with the door's middle slope), so the bound holds at every step.
 */

/** Largest difference between the recorded curve and any solver step (V). */
export const TRACE_TOLERANCE = 1e-4;

export class Trace {
  steps: Int32Array;
  values: Float64Array;
  /** Breakpoints written so far; `finish` writes the last one. */
  count = 0;
  private lastStep = -1;
  private lastValue = 0;
  /** The last breakpoint written. */
  private originStep = 0;
  private originValue = 0;
  /** Slopes (V per step) from the last breakpoint that keep every step fed since within tolerance. */
  private upper = -Infinity;
  private lower = Infinity;

  constructor(initialCapacity = 4096) {
    this.steps = new Int32Array(initialCapacity);
    this.values = new Float64Array(initialCapacity);
  }

  clear(): void {
    this.count = 0;
    this.lastStep = -1;
    // Empty, every line fails: the first step fed becomes the first breakpoint.
    this.upper = -Infinity;
    this.lower = Infinity;
  }

  push(step: number, value: number): void {
    if (step > this.lastStep + 1 && this.count > 0) this.extend(step - 1, this.lastValue);
    this.extend(step, value);
  }

  /** Feeds steps `firstStep + from` … `firstStep + to − 1` with `values[from]` … `values[to − 1]`. */
  pushSpan(firstStep: number, values: Float64Array, from: number, to: number): void {
    if (from >= to) return;
    this.push(firstStep + from, values[from]);
    // The swinging door of `extend`, kept in locals for the busy stretches of a run.
    if (this.count + (to - from) > this.steps.length) this.grow(this.count + (to - from));
    const steps = this.steps;
    const points = this.values;
    let count = this.count;
    let originStep = this.originStep;
    let originValue = this.originValue;
    let upper = this.upper;
    let lower = this.lower;
    for (let i = from + 1; i < to; i += 1) {
      const step = firstStep + i;
      const value = values[i];
      const reciprocal = 1 / (step - originStep);
      const rise = value - originValue;
      const nextUpper = Math.min(upper, (rise + TRACE_TOLERANCE) * reciprocal);
      const nextLower = Math.max(lower, (rise - TRACE_TOLERANCE) * reciprocal);
      if (nextUpper >= nextLower) {
        upper = nextUpper;
        lower = nextLower;
      } else {
        const corner = originValue + (upper === Infinity ? 0 : 0.5 * (upper + lower)) * (step - 1 - originStep);
        steps[count] = step - 1;
        points[count] = corner;
        count += 1;
        originStep = step - 1;
        originValue = corner;
        upper = value - corner + TRACE_TOLERANCE;
        lower = value - corner - TRACE_TOLERANCE;
      }
    }
    this.count = count;
    this.originStep = originStep;
    this.originValue = originValue;
    this.upper = upper;
    this.lower = lower;
    this.lastStep = firstStep + to - 1;
    this.lastValue = values[to - 1];
  }

  /**
   * Ends the curve so far exactly where it stands and starts again from (step, value): the
   * line is set to a known state there (the solver's DC reset), and what follows depends on
   * nothing before it.
   */
  breakAt(step: number, value: number): void {
    if (this.count > 0 && step === this.originStep && this.lastStep === step) {
      this.values[this.count - 1] = value;
      this.originValue = value;
      this.lastValue = value;
      return;
    }
    if (this.count > 0) {
      if (step > this.lastStep + 1) this.extend(step - 1, this.lastValue);
      if (this.lastStep > this.originStep) this.write(this.lastStep, this.originValue + this.slope() * (this.lastStep - this.originStep));
    }
    this.write(step, value);
    this.lastStep = step;
    this.lastValue = value;
  }

  /** Ends the current line at the last step fed with a breakpoint there, so that copied breakpoints can follow it (bit replays). */
  closeAtLast(): void {
    if (this.count > 0 && this.lastStep > this.originStep) this.write(this.lastStep, this.originValue + this.slope() * (this.lastStep - this.originStep));
  }

  /** Breakpoints written from index `from` on, with their steps counted from `origin`. */
  copySince(from: number, origin: number): { steps: Int32Array; values: Float64Array } {
    const steps = this.steps.slice(from, this.count);
    for (let i = 0; i < steps.length; i += 1) steps[i] -= origin;
    return { steps, values: this.values.slice(from, this.count) };
  }

  /** Appends breakpoints copied by `copySince`, moved to start at `origin`; the last one becomes the curve's end. */
  append(steps: Int32Array, values: Float64Array, origin: number): void {
    for (let i = 0; i < steps.length; i += 1) this.write(steps[i] + origin, values[i]);
    this.lastStep = steps[steps.length - 1] + origin;
    this.lastValue = values[values.length - 1];
  }

  /** Closes the curve at `lastStep` (the run's final step), holding the last value up to it. */
  finish(lastStep: number): void {
    if (this.count === 0) return;
    if (lastStep > this.lastStep) this.extend(lastStep, this.lastValue);
    const origin = this.originStep;
    if (this.lastStep > origin) this.write(this.lastStep, this.originValue + this.slope() * (this.lastStep - origin));
  }

  private slope(): number {
    return this.upper === Infinity ? 0 : 0.5 * (this.upper + this.lower);
  }

  private extend(step: number, value: number): void {
    const reciprocal = 1 / (step - this.originStep);
    const rise = value - this.originValue;
    const upper = Math.min(this.upper, (rise + TRACE_TOLERANCE) * reciprocal);
    const lower = Math.max(this.lower, (rise - TRACE_TOLERANCE) * reciprocal);
    if (upper >= lower) {
      this.upper = upper;
      this.lower = lower;
      this.lastStep = step;
      this.lastValue = value;
    } else {
      this.turn(step, value);
    }
  }

  /** No line from the last breakpoint fits this step too: end the segment at the step before. */
  private turn(step: number, value: number): void {
    if (this.count === 0) {
      this.write(step, value);
    } else {
      const corner = this.originValue + this.slope() * (this.lastStep - this.originStep);
      this.write(this.lastStep, corner);
      const span = step - this.lastStep;
      this.upper = (value - corner + TRACE_TOLERANCE) / span;
      this.lower = (value - corner - TRACE_TOLERANCE) / span;
    }
    this.lastStep = step;
    this.lastValue = value;
  }

  private write(step: number, value: number): void {
    if (this.count === this.steps.length) this.grow();
    this.steps[this.count] = step;
    this.values[this.count] = value;
    this.count += 1;
    this.originStep = step;
    this.originValue = value;
    this.upper = Infinity;
    this.lower = -Infinity;
  }

  /** Makes room for at least `needed` breakpoints. */
  private grow(needed = this.count + 1): void {
    let capacity = this.steps.length * 2;
    while (capacity < needed) capacity *= 2;
    const steps = new Int32Array(capacity);
    const values = new Float64Array(capacity);
    steps.set(this.steps);
    values.set(this.values);
    this.steps = steps;
    this.values = values;
  }
}
