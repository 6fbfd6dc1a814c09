/** Round-number ticks inside [from, to]: steps of 1, 2 or 5 times a power of ten, about `target` of them. */
export function niceTicks(from: number, to: number, target: number): number[] {
  const span = to - from;
  if (!(span > 0)) return [from];
  const raw = span / target;
  const decade = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * decade).find((s) => s >= raw) ?? 10 * decade;
  const ticks: number[] = [];
  for (let value = Math.ceil(from / step) * step; value <= to + step * 1e-9; value += step) {
    ticks.push(Number(value.toPrecision(12)));
  }
  return ticks;
}
