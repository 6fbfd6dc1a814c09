export type ScopePoint = { t: number; near: number; far: number };

/**
 * The samples inside [from, to] reduced to at most about `budget` points for drawing. Each bucket
 * keeps the samples where either trace reaches its minimum or maximum, so a narrow spike or dip
 * survives the reduction instead of being skipped over. `t` is in microseconds.
 */
export function decimateTraces(
  trace: { time: Float64Array; nearEnd: Float64Array; farEnd: Float64Array },
  from: number,
  to: number,
  budget: number,
): ScopePoint[] {
  const { time, nearEnd, farEnd } = trace;
  const first = Math.max(0, lowerBound(time, from) - 1);
  const last = Math.min(time.length - 1, lowerBound(time, to));
  const count = last - first + 1;
  const point = (i: number): ScopePoint => ({ t: time[i] * 1e6, near: nearEnd[i], far: farEnd[i] });
  if (count <= budget) return Array.from({ length: count }, (_, k) => point(first + k));

  const buckets = Math.max(1, Math.floor(budget / 6));
  const size = count / buckets;
  const points: ScopePoint[] = [];
  for (let b = 0; b < buckets; b += 1) {
    const start = first + Math.floor(b * size);
    const end = Math.min(last, first + Math.floor((b + 1) * size) - 1);
    const keep = new Set([start, end]);
    let farMin = start, farMax = start, nearMin = start, nearMax = start;
    for (let i = start; i <= end; i += 1) {
      if (farEnd[i] < farEnd[farMin]) farMin = i;
      if (farEnd[i] > farEnd[farMax]) farMax = i;
      if (nearEnd[i] < nearEnd[nearMin]) nearMin = i;
      if (nearEnd[i] > nearEnd[nearMax]) nearMax = i;
    }
    for (const i of [farMin, farMax, nearMin, nearMax]) keep.add(i);
    for (const i of [...keep].sort((a, c) => a - c)) points.push(point(i));
  }
  return points;
}

/** First index whose time is at least `value`. */
function lowerBound(time: Float64Array, value: number): number {
  let lo = 0;
  let hi = time.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (time[mid] < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
