import type { KindFigures, PhaseFigures, RequestKind } from "./protocol";

// How the load benchmarks read a phase's figures and print them.

/** A non-negative number from the environment, or `fallback` when unset. */
export function envNumber(name: string, fallback: number): number {
  const value = process.env[name];
  if (value === undefined || value === "") return fallback;
  const number = Number(value);
  if (!Number.isFinite(number) || number < 0) throw new Error(`${name} must be a non-negative number, not "${value}".`);
  return number;
}

export const ms = (value: number | null) => (value === null ? "—" : `${Math.round(value)} ms`);
export const ratio = (a: number | null, b: number | null) => (a === null || b === null ? "—" : `×${(a / b).toFixed(1)}`);

/** The phase's throughput, then one line per kind of request: count, p50/p95/p99 and statuses. */
export function kindLines(title: string, figures: PhaseFigures): string[] {
  const lines = [`${title}: ${figures.throughput.toFixed(1)} answers/s over ${figures.seconds} s`];
  for (const [kind, k] of Object.entries(figures.kinds) as [RequestKind, KindFigures][]) {
    const statuses = Object.entries(k.statuses)
      .map(([status, count]) => `${status}×${count}`)
      .join(" ");
    lines.push(`  ${kind.padEnd(7)} ${String(k.count).padStart(6)}  p50 ${ms(k.p50).padStart(8)}  p95 ${ms(k.p95).padStart(8)}  p99 ${ms(k.p99).padStart(8)}  ${statuses}`);
  }
  return lines;
}

export function count5xx(figures: PhaseFigures): number {
  return Object.values(figures.kinds).reduce(
    (sum, k) => sum + Object.entries(k!.statuses).reduce((n, [status, c]) => n + (Number(status) >= 500 ? c : 0), 0),
    0,
  );
}

/** Answers of 300 or more, by kind and status. */
export function nonSuccess(figures: PhaseFigures): Record<string, number> {
  const breakdown: Record<string, number> = {};
  for (const [kind, k] of Object.entries(figures.kinds)) {
    for (const [status, c] of Object.entries(k!.statuses)) if (Number(status) >= 300) breakdown[`${kind} ${status}`] = c;
  }
  return breakdown;
}
