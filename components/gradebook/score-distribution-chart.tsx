"use client";

import { useId, useState } from "react";
import { Bar, BarChart, CartesianGrid, Tooltip, XAxis, YAxis } from "recharts";
import type { ScoreDistribution } from "@/lib/gradebook";
import { plural } from "@/lib/gradebook/words";
import { chartColours } from "./chart-colours";

function summarise(distribution: ScoreDistribution): string {
  const scored = distribution.bins.reduce((sum, bin) => sum + bin.learners, 0);
  if (scored === 0) return `Nobody has a score on ${distribution.label} yet.`;
  const parts = distribution.bins.filter((bin) => bin.learners > 0).map((bin) => `${bin.learners} in ${bin.label}`);
  return `${plural(scored, "learner")} scored on ${distribution.label}: ${parts.join(", ")}; ${distribution.unscored} without a score yet.`;
}

/** Best score per learner on one chosen item, in tenths of the scale, with the counts also in words. */
export function ScoreDistributionChart({ distributions }: { distributions: ScoreDistribution[] }) {
  const [chosen, setChosen] = useState(distributions[0]?.itemKey ?? "");
  const selectId = useId();
  const distribution = distributions.find((d) => d.itemKey === chosen) ?? distributions[0];
  if (!distribution) return null;
  const summary = summarise(distribution);

  return (
    <figure>
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <figcaption className="text-base font-semibold">Best scores per learner</figcaption>
        <label htmlFor={selectId} className="flex min-w-0 max-w-full items-center gap-2 text-sm font-medium">
          Item
          <select
            id={selectId}
            value={distribution.itemKey}
            onChange={(event) => setChosen(event.target.value)}
            className="min-w-0 max-w-full flex-1 rounded-lg border border-line-strong bg-surface px-2 py-1.5 font-normal"
          >
            {distributions.map((d) => (
              <option key={d.itemKey} value={d.itemKey}>
                {d.label}: {d.title}
              </option>
            ))}
          </select>
        </label>
      </div>
      <div className="mt-3" role="img" aria-label={summary}>
        <BarChart data={distribution.bins} height={220} responsive style={{ width: "100%" }} margin={{ top: 8, right: 8, bottom: 4, left: 0 }}>
          <CartesianGrid stroke={chartColours.grid} vertical={false} />
          <XAxis
            dataKey="label"
            tick={{ fontSize: 11, fill: chartColours.axis }}
            tickFormatter={(label: string) => label.split("–")[0]}
            interval={0}
            label={{ value: "best score, in tens (90 takes 90–100)", position: "insideBottom", offset: -2, fontSize: 12, fill: chartColours.axis }}
            height={38}
          />
          <YAxis allowDecimals={false} tick={{ fontSize: 12, fill: chartColours.axis }} width={32} />
          <Tooltip formatter={(value) => [plural(Number(value), "learner"), "Learners"]} labelFormatter={(label) => `Score ${label}`} />
          <Bar dataKey="learners" name="Learners" fill={chartColours.accent} isAnimationActive={false} radius={[3, 3, 0, 0]} />
        </BarChart>
      </div>
      <p className="mt-2 text-sm text-ink-soft">{summary}</p>
    </figure>
  );
}
