import type { DrawnTrace } from "./choice-check";

/** Where a check's trace is cut: from just before the first 1 bit leaves the driver, long enough to ring out or climb. */
export const TRACE_WINDOW = { before: 50e-9, after: 700e-9 } as const;

export type TracePoints = { points: [number, number][]; start: number; end: number };

/** The trace's samples inside the window after `edge`, times relative to the edge (s). */
export function traceInWindow(trace: DrawnTrace, edge: number): TracePoints {
  const start = edge - TRACE_WINDOW.before;
  const end = edge + TRACE_WINDOW.after;
  const points: [number, number][] = [];
  trace.time.forEach((t, i) => {
    if (t >= start && t <= end) points.push([t - edge, trace.farEnd[i]]);
  });
  return { points, start: -TRACE_WINDOW.before, end: TRACE_WINDOW.after };
}
