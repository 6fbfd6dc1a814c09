"use client";

import { useId } from "react";
import type { LiveRun } from "@/components/simulation";
import { plotArea } from "./chart-geometry";
import { decimateTraces } from "./decimate";
import type { TimeWindow } from "./time-window";
import { traceStyle } from "./trace-style";

type Props = { run: LiveRun; window: TimeWindow; yDomain: [number, number]; width: number; height: number };

/**
 * The traces of a drag preview, drawn straight into SVG over the last full chart. The charting
 * library takes about 40 ms to redraw the whole scope (axes, bands, bit slots), several frames, so
 * while a control is held only the two traces move; the chart is redrawn in full on release.
 */
export function DragOverlay({ run, window, yDomain, width, height }: Props) {
  const clipId = useId();
  const plot = plotArea(width, height);
  if (plot.width === 0 || window.to <= window.from) return null;
  // Two points a pixel keep every spike the decimation saves without drawing more than the eye can see.
  const points = decimateTraces(run.trace, window.from, window.to, Math.max(300, Math.round(plot.width * 2)));
  const fromMicro = window.from * 1e6;
  const xScale = plot.width / ((window.to - window.from) * 1e6);
  const yScale = plot.height / (yDomain[1] - yDomain[0]);
  const pathOf = (pick: (point: (typeof points)[number]) => number) =>
    points
      .map((point, i) => `${i === 0 ? "M" : "L"}${(plot.left + (point.t - fromMicro) * xScale).toFixed(1)},${(plot.top + (yDomain[1] - pick(point)) * yScale).toFixed(1)}`)
      .join("");

  return (
    <svg className="pointer-events-none absolute inset-0" width={width} height={height} data-testid="drag-preview-traces">
      <clipPath id={clipId}>
        <rect x={plot.left} y={plot.top} width={plot.width} height={plot.height} />
      </clipPath>
      <g clipPath={`url(#${clipId})`} fill="none">
        <path d={pathOf((point) => point.near)} stroke={traceStyle.near.stroke} strokeWidth={traceStyle.near.width} strokeDasharray={traceStyle.near.dash} data-trace="near" />
        <path d={pathOf((point) => point.far)} stroke={traceStyle.far.stroke} strokeWidth={traceStyle.far.width} data-trace="far" />
      </g>
    </svg>
  );
}
