/**
 * Reduces a long sampled trace to about `buckets` columns for drawing, keeping each column's
 * lowest and highest sample in time order so ringing and overshoot peaks survive the thinning.
 */
export function thinTrace(time: ArrayLike<number>, values: ArrayLike<number>, window: readonly [number, number], buckets: number): [number, number][] {
  const [from, to] = window;
  const width = (to - from) / buckets;
  const points: [number, number][] = [];
  let bucket = -1;
  let low: [number, number] | null = null;
  let high: [number, number] | null = null;
  const flush = () => {
    if (!low || !high) return;
    if (low[0] <= high[0]) points.push(low, ...(high === low ? [] : [high]));
    else points.push(high, low);
  };
  for (let i = 0; i < time.length; i += 1) {
    const t = time[i]!;
    if (t < from || t > to) continue;
    const b = Math.min(buckets - 1, Math.floor((t - from) / width));
    const point: [number, number] = [t, values[i]!];
    if (b !== bucket) {
      flush();
      bucket = b;
      low = point;
      high = point;
    } else {
      if (point[1] < low![1]) low = point;
      if (point[1] > high![1]) high = point;
    }
  }
  flush();
  return points;
}
