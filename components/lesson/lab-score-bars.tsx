"use client";

import { Bar, BarChart, CartesianGrid, Cell, LabelList, ResponsiveContainer, XAxis, YAxis } from "recharts";

export type LabScore = { lesson: number; title: string; bestScore: number | null; passed: boolean };

// Drawn as plain text above the bar: the library's own label wraps to the bar's width.
function BarLabel(props: { x?: number | string; y?: number | string; width?: number | string; value?: unknown }) {
  const x = Number(props.x ?? 0) + Number(props.width ?? 0) / 2;
  return (
    <text x={x} y={Number(props.y ?? 0) - 6} textAnchor="middle" fontSize={11} fontWeight={600} fill="var(--color-ink)">
      {String(props.value ?? "")}
    </text>
  );
}

/**
 * Best score per lab as bars, 0–100. Each bar carries its number and a ✓ when passed, so the
 * passed/not-passed difference never rests on the bar's colour alone.
 */
export function LabScoreBars({ scores }: { scores: LabScore[] }) {
  const data = scores.map((s) => ({ name: `L${s.lesson}`, score: s.bestScore ?? 0, label: s.bestScore === null ? "" : `${s.bestScore}${s.passed ? " ✓" : ""}`, passed: s.passed }));
  return (
    <div className="h-56 w-full">
      <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 320, height: 224 }}>
        <BarChart data={data} margin={{ top: 22, right: 4, bottom: 0, left: -22 }}>
          <CartesianGrid vertical={false} stroke="var(--color-line)" />
          <XAxis dataKey="name" tickLine={false} axisLine={{ stroke: "var(--color-line-strong)" }} tick={{ fontSize: 12, fill: "var(--color-ink-soft)" }} />
          <YAxis domain={[0, 100]} ticks={[0, 50, 100]} tickLine={false} axisLine={false} tick={{ fontSize: 11, fill: "var(--color-ink-faint)" }} />
          <Bar dataKey="score" radius={[4, 4, 0, 0]} isAnimationActive={false}>
            {data.map((entry) => (
              <Cell key={entry.name} fill={entry.passed ? "var(--color-accent)" : "var(--color-copper)"} fillOpacity={entry.passed ? 1 : 0.55} />
            ))}
            <LabelList dataKey="label" content={BarLabel} />
          </Bar>
        </BarChart>
      </ResponsiveContainer>
    </div>
  );
}
