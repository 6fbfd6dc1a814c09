"use client";

import { linearScale, linePath, niceTicks, type Range } from "./plot-scale";
import { dash, tone, type Dash, type Tone } from "./tones";
import { useElementWidth } from "./use-element-width";

export type Trace = { id: string; label: string; points: readonly (readonly [number, number])[]; tone: Tone; dash?: Dash; width?: number };
export type Level = { y: number; label: string; tone: Tone; dash?: Dash };
export type Band = { from: number; to: number; label: string; tone: Tone };
export type Mark = { x: number; label?: string; tone: Tone; dash?: Dash };
export type Span = { from: number; to: number; y: number; label: string; tone: Tone };
// A paper-coloured outline behind labels keeps them readable where they cross a trace.
const halo = { stroke: "var(--color-surface)", strokeWidth: 3, paintOrder: "stroke", strokeLinejoin: "round" } as const;

export type Note = { x: number; y: number; text: string; tone: Tone; bold?: boolean };


function timeTickFormat(domain: Range): (value: number) => string {
  const exponent = Math.floor(Math.log10(Math.max(Math.abs(domain[1]), 1e-15)) / 3) * 3;
  const symbol = { [-12]: "ps", [-9]: "ns", [-6]: "µs", [-3]: "ms", 0: "s" }[exponent] ?? "s";
  return (value) => `${Number((value / 10 ** exponent).toPrecision(4))}${value === 0 ? "" : ` ${symbol}`}`;
}

/**
 * Voltage against time, drawn in real pixels: threshold bands, level lines, vertical marks,
 * traces and labelled spans, with a legend that names each trace and shows its line style.
 */
export function WaveChart({
  title,
  xDomain,
  yDomain,
  traces,
  levels = [],
  bands = [],
  marks = [],
  spans = [],
  notes = [],
  height = 280,
}: {
  title: string;
  xDomain: Range;
  yDomain: Range;
  traces: readonly Trace[];
  levels?: readonly Level[];
  bands?: readonly Band[];
  marks?: readonly Mark[];
  spans?: readonly Span[];
  notes?: readonly Note[];
  height?: number;
}) {
  const { ref, width } = useElementWidth<HTMLDivElement>();
  const margin = { top: 16, right: 14, bottom: 38, left: width < 420 ? 38 : 46 };
  const sx = linearScale(xDomain, [margin.left, width - margin.right]);
  const sy = linearScale(yDomain, [height - margin.bottom, margin.top]);
  const xTicks = niceTicks(xDomain, width < 480 ? 4 : 7);
  const yTicks = niceTicks(yDomain, 5);
  const formatX = timeTickFormat(xDomain);
  const clip = `clip-${title.replace(/\W+/g, "-")}`;

  return (
    <div ref={ref} className="w-full">
      <svg width={width} height={height} role="img" aria-label={title} className="block max-w-full font-sans">
        <defs>
          <clipPath id={clip}>
            <rect x={margin.left} y={margin.top} width={width - margin.left - margin.right} height={height - margin.top - margin.bottom} />
          </clipPath>
        </defs>
        {bands.map((band) => (
          <g key={band.label}>
            <rect
              x={margin.left}
              width={width - margin.left - margin.right}
              y={sy(Math.min(band.to, yDomain[1]))}
              height={Math.max(0, sy(Math.max(band.from, yDomain[0])) - sy(Math.min(band.to, yDomain[1])))}
              fill={tone[band.tone]}
              opacity={0.08}
            />
            <text x={width - margin.right - 4} y={sy(Math.min(band.to, yDomain[1])) + 13} textAnchor="end" fontSize={11} fill={tone[band.tone]}>
              {band.label}
            </text>
          </g>
        ))}
        {yTicks.map((t) => (
          <g key={`y${t}`}>
            <line x1={margin.left} x2={width - margin.right} y1={sy(t)} y2={sy(t)} stroke={tone.grid} strokeWidth={1} />
            <text x={margin.left - 6} y={sy(t) + 4} textAnchor="end" fontSize={11} fill="var(--color-ink-faint)">
              {Number(t.toPrecision(3))} V
            </text>
          </g>
        ))}
        {xTicks.map((t) => (
          <g key={`x${t}`}>
            <line x1={sx(t)} x2={sx(t)} y1={height - margin.bottom} y2={height - margin.bottom + 4} stroke="var(--color-line-strong)" />
            <text x={sx(t)} y={height - margin.bottom + 17} textAnchor="middle" fontSize={11} fill="var(--color-ink-faint)">
              {formatX(t)}
            </text>
          </g>
        ))}
        <line x1={margin.left} x2={width - margin.right} y1={height - margin.bottom} y2={height - margin.bottom} stroke="var(--color-line-strong)" />
        <g clipPath={`url(#${clip})`}>
          {marks.map((mark, i) => (
            <g key={`m${i}`}>
              <line
                x1={sx(mark.x)}
                x2={sx(mark.x)}
                y1={margin.top}
                y2={height - margin.bottom}
                stroke={tone[mark.tone]}
                strokeDasharray={dash[mark.dash ?? "dotted"]}
                strokeWidth={1.2}
              />
              {mark.label ? (
                <text x={sx(mark.x) + 3} y={margin.top + 10} fontSize={10} fill={tone[mark.tone]} {...halo}>
                  {mark.label}
                </text>
              ) : null}
            </g>
          ))}
          {levels.map((level) => (
            <g key={level.label}>
              <line
                x1={margin.left}
                x2={width - margin.right}
                y1={sy(level.y)}
                y2={sy(level.y)}
                stroke={tone[level.tone]}
                strokeDasharray={dash[level.dash ?? "dashed"]}
                strokeWidth={1.3}
              />
              <text x={width - margin.right - 4} y={sy(level.y) - 4} textAnchor="end" fontSize={11} fill={tone[level.tone]} {...halo}>
                {level.label}
              </text>
            </g>
          ))}
          {traces.map((trace) => (
            <path
              key={trace.id}
              d={linePath(trace.points.map(([t, v]) => [sx(t), sy(v)] as const))}
              fill="none"
              stroke={tone[trace.tone]}
              strokeWidth={trace.width ?? 2}
              strokeDasharray={dash[trace.dash ?? "solid"]}
              strokeLinejoin="round"
            />
          ))}
          {spans.map((span) => (
            <g key={span.label}>
              <line x1={sx(span.from)} x2={sx(span.to)} y1={sy(span.y)} y2={sy(span.y)} stroke={tone[span.tone]} strokeWidth={2} />
              <line x1={sx(span.from)} x2={sx(span.from)} y1={sy(span.y) - 5} y2={sy(span.y) + 5} stroke={tone[span.tone]} strokeWidth={2} />
              <line x1={sx(span.to)} x2={sx(span.to)} y1={sy(span.y) - 5} y2={sy(span.y) + 5} stroke={tone[span.tone]} strokeWidth={2} />
              <text x={(sx(span.from) + sx(span.to)) / 2} y={sy(span.y) - 7} textAnchor="middle" fontSize={11} fontWeight={600} fill={tone[span.tone]} {...halo}>
                {span.label}
              </text>
            </g>
          ))}
          {notes.map((note, i) => (
            <text key={`n${i}`} x={sx(note.x)} y={sy(note.y)} textAnchor="middle" fontSize={12} fontWeight={note.bold ? 700 : 500} fill={tone[note.tone]} {...halo}>
              {note.text}
            </text>
          ))}
        </g>
      </svg>
      <ul className="mt-1 mb-2 flex flex-wrap gap-x-5 gap-y-1 pl-1 text-xs text-ink-soft" aria-label="Legend">
        {traces.map((trace) => (
          <li key={trace.id} className="inline-flex items-center gap-2">
            <svg width="26" height="8" aria-hidden="true">
              <line x1="1" x2="25" y1="4" y2="4" stroke={tone[trace.tone]} strokeWidth={trace.width ?? 2} strokeDasharray={dash[trace.dash ?? "solid"]} />
            </svg>
            {trace.label}
          </li>
        ))}
      </ul>
    </div>
  );
}

