import type { NearEnd } from "./near-end";
import { runAt } from "./run-record";
import type { Trace } from "./trace";

/** A waveform as a piecewise-linear curve through its breakpoints (a solver trace on the time axis). */
export type Waveform = { time: Float64Array; value: Float64Array; count: number };

/** `reuse` lends arrays to fill when they are large enough. */
export function waveformFromTrace(trace: Trace, dt: number, reuse?: Waveform): Waveform {
  const count = trace.count;
  const fits = reuse !== undefined && reuse.time.length >= count;
  const wave = fits ? { time: reuse.time, value: reuse.value, count } : { time: new Float64Array(count), value: new Float64Array(count), count };
  placeOnTimeAxis(wave, trace.steps, trace.values, dt);
  return wave;
}

/** Kept apart from the allocation above so that the loop is compiled once, not re-entered every run. */
function placeOnTimeAxis(wave: Waveform, steps: Int32Array, values: Float64Array, dt: number): void {
  const { time, value, count } = wave;
  for (let k = 0; k < count; k += 1) {
    time[k] = steps[k] * dt;
    value[k] = values[k];
  }
}

/** Every solver step's value, for callers that asked for full resolution. */
export function expandTrace(trace: Trace, stepCount: number): Float64Array {
  const out = new Float64Array(stepCount);
  const { steps, values, count } = trace;
  for (let k = 0; k + 1 < count; k += 1) {
    const first = steps[k];
    const last = Math.min(steps[k + 1], stepCount - 1);
    const slope = (values[k + 1] - values[k]) / (steps[k + 1] - first);
    for (let n = first; n <= last; n += 1) out[n] = values[k] + slope * (n - first);
  }
  if (count === 1) out.fill(values[0]);
  return out;
}

/** Samples a trace onto the uniform grid t = p·interval, p < points (linear between breakpoints). */
export function sampleTrace(trace: Trace, dt: number, interval: number, points: number): Float64Array {
  const out = new Float64Array(points);
  const { steps, values, count } = trace;
  const lastStep = steps[count - 1];
  let k = 0;
  for (let p = 0; p < points; p += 1) {
    const position = Math.min((p * interval) / dt, lastStep);
    k = runAt(steps, count, position, k);
    if (k + 1 >= count) {
      out[p] = values[k];
    } else {
      const fraction = (position - steps[k]) / (steps[k + 1] - steps[k]);
      out[p] = values[k] + fraction * (values[k + 1] - values[k]);
    }
  }
  return out;
}

/** Every solver step's near-end voltage. */
export function expandNearEnd(near: NearEnd, stepCount: number): Float64Array {
  const out = new Float64Array(stepCount);
  for (let n = 0; n < stepCount; n += 1) out[n] = near.at(n);
  return out;
}

/** Samples the near end onto the uniform grid t = p·interval, linear between solver steps. */
export function sampleNearEnd(near: NearEnd, dt: number, stepCount: number, interval: number, points: number): Float64Array {
  const out = new Float64Array(points);
  for (let p = 0; p < points; p += 1) {
    const position = Math.min((p * interval) / dt, stepCount - 1);
    const step = Math.floor(position);
    const fraction = position - step;
    const here = near.at(step);
    out[p] = fraction > 0 ? here + fraction * (near.at(step + 1) - here) : here;
  }
  return out;
}

/** Index of the last breakpoint at or before t (0 when t is before the first). */
export function indexAt(wave: Waveform, t: number): number {
  let low = 0;
  let high = wave.count - 1;
  if (t >= wave.time[high]) return high;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if (wave.time[middle] <= t) low = middle;
    else high = middle;
  }
  return low;
}

export function valueAt(wave: Waveform, t: number): number {
  const i = indexAt(wave, t);
  if (i + 1 >= wave.count || t <= wave.time[i]) return wave.value[i];
  const fraction = (t - wave.time[i]) / (wave.time[i + 1] - wave.time[i]);
  return wave.value[i] + fraction * (wave.value[i + 1] - wave.value[i]);
}

/**
 * First time in [from, to] at which the wave reaches `level` going up (`rising`) or down;
 * null when it does not.
 */
export function firstReach(wave: Waveform, level: number, rising: boolean, from: number, to: number): number | null {
  const startValue = valueAt(wave, from);
  if (rising ? startValue >= level : startValue <= level) return from;
  let previousTime = from;
  let previousValue = startValue;
  for (let i = indexAt(wave, from) + 1; i < wave.count; i += 1) {
    const t = Math.min(wave.time[i], to);
    const v = t === wave.time[i] ? wave.value[i] : valueAt(wave, t);
    if (rising ? v >= level : v <= level) {
      return previousTime + ((level - previousValue) / (v - previousValue)) * (t - previousTime);
    }
    if (wave.time[i] >= to) return null;
    previousTime = t;
    previousValue = v;
  }
  return null;
}

/** Smallest and largest value of the whole wave. */
export function extremes(wave: Waveform): { min: number; max: number; minTime: number; maxTime: number } {
  let min = Infinity;
  let max = -Infinity;
  let minTime = 0;
  let maxTime = 0;
  for (let i = 0; i < wave.count; i += 1) {
    if (wave.value[i] < min) {
      min = wave.value[i];
      minTime = wave.time[i];
    }
    if (wave.value[i] > max) {
      max = wave.value[i];
      maxTime = wave.time[i];
    }
  }
  return { min, max, minTime, maxTime };
}
