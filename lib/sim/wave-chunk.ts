/**
 * One segment delay's worth of a wave entering a line segment, as runs of equal values: run k
 * holds `values[k]` from step offset `offsets[k]` to the next run's offset. Flat stretches (most
 * of a pulse train) cost one run; a reader steps through busy stretches run by run and jumps
 * over long ones.
 */
export class WaveChunk {
  readonly offsets: Int32Array;
  readonly values: Float64Array;
  count = 0;

  constructor(length: number) {
    this.offsets = new Int32Array(length + 1);
    this.values = new Float64Array(length + 1);
  }

  /** Starts a run at `offset` unless the value equals the last run's. */
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
