import type { RunHistory } from "./runs";

/**
 * A waveform as a piecewise-linear curve through its breakpoints. Built from the solver's runs
 * (a run's first and last step), it passes through every solver step to within the run
 * tolerance.
 */
export type Waveform = { time: Float64Array; value: Float64Array; count: number };

/** `reuse` lends arrays to fill when they are large enough. */
export function waveformFromRuns(history: RunHistory, dt: number, stepCount: number, reuse?: Waveform): Waveform {
  const needed = history.count * 2;
  const fits = reuse !== undefined && reuse.time.length >= needed;
  const time = fits ? reuse.time : new Float64Array(needed);
  const value = fits ? reuse.value : new Float64Array(needed);
  const { steps, values } = history;
  const runs = history.count;
  let count = 0;
  for (let k = 0; k < runs; k += 1) {
    const first = steps[k];
    if (first >= stepCount) break;
    const last = Math.min(k + 1 < runs ? steps[k + 1] : stepCount, stepCount) - 1;
    time[count] = first * dt;
    value[count] = values[k];
    count += 1;
    if (last > first) {
      time[count] = last * dt;
      value[count] = values[k];
      count += 1;
    }
  }
  return { time, value, count };
}

/** Every solver step's value, for callers that asked for full resolution. */
export function expandRuns(history: RunHistory, stepCount: number): Float64Array {
  const values = new Float64Array(stepCount);
  for (let k = 0; k < history.count; k += 1) {
    const first = history.steps[k];
    if (first >= stepCount) break;
    const end = Math.min(k + 1 < history.count ? history.steps[k + 1] : stepCount, stepCount);
    values.fill(history.values[k], first, end);
  }
  return values;
}

/** Samples runs directly onto a uniform grid (linear between solver steps), without building breakpoints. */
export function sampleRuns(history: RunHistory, dt: number, stepCount: number, interval: number, points: number): Float64Array {
  const out = new Float64Array(points);
  const { steps, values, count } = history;
  let k = 0;
  for (let p = 0; p < points; p += 1) {
    const position = Math.min((p * interval) / dt, stepCount - 1);
    const step = Math.floor(position);
    while (k + 1 < count && steps[k + 1] <= step) k += 1;
    const here = values[k];
    const fraction = position - step;
    if (fraction > 0 && k + 1 < count && steps[k + 1] === step + 1) {
      out[p] = here + fraction * (values[k + 1] - here);
    } else {
      out[p] = here;
    }
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

/** Linear interpolation onto a uniform grid t = i·interval, i < points. */
export function sampleUniform(wave: Waveform, interval: number, points: number): Float64Array {
  const out = new Float64Array(points);
  let i = 0;
  for (let p = 0; p < points; p += 1) {
    const t = p * interval;
    while (i + 1 < wave.count && wave.time[i + 1] <= t) i += 1;
    if (i + 1 >= wave.count || t <= wave.time[i]) {
      out[p] = wave.value[i];
    } else {
      const fraction = (t - wave.time[i]) / (wave.time[i + 1] - wave.time[i]);
      out[p] = wave.value[i] + fraction * (wave.value[i + 1] - wave.value[i]);
    }
  }
  return out;
}

/** Highest value on [from, to], endpoints interpolated. */
export function maxOver(wave: Waveform, from: number, to: number): { value: number; time: number } {
  let best = valueAt(wave, from);
  let bestTime = from;
  const end = valueAt(wave, to);
  if (end > best) {
    best = end;
    bestTime = to;
  }
  for (let i = indexAt(wave, from) + 1; i < wave.count && wave.time[i] < to; i += 1) {
    if (wave.value[i] > best) {
      best = wave.value[i];
      bestTime = wave.time[i];
    }
  }
  return { value: best, time: bestTime };
}

/** Lowest value on [from, to], endpoints interpolated. */
export function minOver(wave: Waveform, from: number, to: number): { value: number; time: number } {
  let best = valueAt(wave, from);
  let bestTime = from;
  const end = valueAt(wave, to);
  if (end < best) {
    best = end;
    bestTime = to;
  }
  for (let i = indexAt(wave, from) + 1; i < wave.count && wave.time[i] < to; i += 1) {
    if (wave.value[i] < best) {
      best = wave.value[i];
      bestTime = wave.time[i];
    }
  }
  return { value: best, time: bestTime };
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
