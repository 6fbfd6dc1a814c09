import { RECEIVER_DEFAULTS } from "@/lib/sim";
import type { DrawnTrace } from "@/lib/quick-checks/choice-check";
import { traceInWindow } from "@/lib/quick-checks/trace-window";

const WIDTH = 320;
const HEIGHT = 170;
const PAD = { left: 30, right: 8, top: 8, bottom: 24 };
const TOP_VOLTS = 6.5;
const SUPPLY = 5;
const GRID_VOLTS = [0, 2, 4, 6];
const GRID_NS = [0, 200, 400, 600];

/**
 * Far-end traces of a quick check, drawn on the server as plain SVG from the simulator's samples:
 * same axes for every trace (time from the first 1 bit leaving the driver), with the pixel's
 * guaranteed high threshold marked, so the traces compare at a glance.
 */
export function CheckTraces({ traces, caption }: { traces: readonly DrawnTrace[]; caption: string }) {
  return (
    <figure className="mt-4">
      <div className={`grid gap-3 ${traces.length > 1 ? "sm:grid-cols-2" : "sm:max-w-sm"}`}>
        {traces.map((trace) => (
          <TracePlot key={trace.key} trace={trace} />
        ))}
      </div>
      <figcaption className="mt-2 text-sm text-ink-soft">{caption}</figcaption>
    </figure>
  );
}

function TracePlot({ trace }: { trace: DrawnTrace }) {
  const { points, start, end } = traceInWindow(trace, trace.firstOneStart);
  const x = (t: number) => PAD.left + ((t - start) / (end - start)) * (WIDTH - PAD.left - PAD.right);
  const y = (v: number) => PAD.top + (1 - Math.max(-0.5, Math.min(TOP_VOLTS, v)) / TOP_VOLTS) * (HEIGHT - PAD.top - PAD.bottom);
  const path = points.map(([t, v], i) => `${i === 0 ? "M" : "L"}${x(t).toFixed(1)},${y(v).toFixed(1)}`).join("");
  const threshold = RECEIVER_DEFAULTS.highThreshold * SUPPLY;
  return (
    <div className="rounded-lg border border-line bg-surface p-2" data-trace={trace.key}>
      <p className="px-1 text-sm font-semibold text-ink">{trace.label}</p>
      <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} className="block h-auto w-full" role="img" aria-label={`${trace.label}: far-end voltage over time`}>
        {GRID_VOLTS.map((v) => (
          <g key={`v${v}`}>
            <line x1={PAD.left} x2={WIDTH - PAD.right} y1={y(v)} y2={y(v)} stroke="var(--color-line)" strokeWidth={1} />
            <text x={PAD.left - 4} y={y(v) + 3} textAnchor="end" fontSize={9} fill="var(--color-ink-faint)">
              {v} V
            </text>
          </g>
        ))}
        {GRID_NS.map((ns) => (
          <g key={`t${ns}`}>
            <line x1={x(ns * 1e-9)} x2={x(ns * 1e-9)} y1={PAD.top} y2={HEIGHT - PAD.bottom} stroke="var(--color-line)" strokeWidth={1} />
            <text x={x(ns * 1e-9)} y={HEIGHT - PAD.bottom + 12} textAnchor="middle" fontSize={9} fill="var(--color-ink-faint)">
              {ns} ns
            </text>
          </g>
        ))}
        <line x1={PAD.left} x2={WIDTH - PAD.right} y1={y(threshold)} y2={y(threshold)} stroke="var(--color-ok)" strokeWidth={1} strokeDasharray="5 4" />
        <text x={WIDTH - PAD.right - 2} y={y(threshold) - 3} textAnchor="end" fontSize={9} fill="var(--color-ok)">
          pixel&apos;s high threshold
        </text>
        <path d={path} fill="none" stroke="var(--color-copper)" strokeWidth={2} strokeLinejoin="round" />
      </svg>
    </div>
  );
}
