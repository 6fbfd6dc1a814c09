/**
 * Waveform distance as docs/simulator.md ("Reference tools") defines it: the error at each instant is the
 * smallest difference to the other waveform within ±window (0.5 ns), so a tiny time shift on a steep edge
 * does not count as a voltage error. Both waveforms are taken as piecewise linear between their samples;
 * over a window a continuous piecewise-linear curve takes every value between its minimum and maximum,
 * so the smallest difference is the distance from the value to that range.
 */
export interface Waveform {
  time: ArrayLike<number>;
  value: ArrayLike<number>;
}

export interface WaveformError {
  maxError: number;
  /** Instant of the largest error. */
  at: number;
}

export const COMPARISON_WINDOW = 0.5e-9;

function interpolateAt(wave: Waveform, index: number, t: number): number {
  const { time, value } = wave;
  if (index <= 0) return value[0];
  if (index >= time.length) return value[time.length - 1];
  const t0 = time[index - 1];
  const t1 = time[index];
  return value[index - 1] + ((t - t0) / (t1 - t0)) * (value[index] - value[index - 1]);
}

/** One-sided: each sample of `probe` against the range of `reference` around it. */
function oneSidedError(probe: Waveform, reference: Waveform, window: number, from: number, to: number): WaveformError {
  const rt = reference.time;
  const rv = reference.value;
  let lo = 0;
  let worst: WaveformError = { maxError: 0, at: from };
  for (let i = 0; i < probe.time.length; i++) {
    const t = probe.time[i];
    if (t < from || t > to) continue;
    const start = t - window;
    const end = t + window;
    while (lo < rt.length && rt[lo] < start) lo++;
    let min = interpolateAt(reference, lo, start);
    let max = min;
    let j = lo;
    for (; j < rt.length && rt[j] <= end; j++) {
      if (rv[j] < min) min = rv[j];
      if (rv[j] > max) max = rv[j];
    }
    const atEnd = interpolateAt(reference, j, end);
    if (atEnd < min) min = atEnd;
    if (atEnd > max) max = atEnd;
    const v = probe.value[i];
    const error = v > max ? v - max : v < min ? min - v : 0;
    if (error > worst.maxError) worst = { maxError: error, at: t };
  }
  return worst;
}

/** Symmetric windowed error over the time span both waveforms cover. */
export function windowedError(a: Waveform, b: Waveform, window = COMPARISON_WINDOW): WaveformError {
  const from = Math.max(a.time[0], b.time[0]);
  const to = Math.min(a.time[a.time.length - 1], b.time[b.time.length - 1]);
  if (!(to > from)) throw new Error("the waveforms share no time span");
  const ab = oneSidedError(a, b, window, from, to);
  const ba = oneSidedError(b, a, window, from, to);
  return ab.maxError >= ba.maxError ? ab : ba;
}
