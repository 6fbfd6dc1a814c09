"use client";

import { useState } from "react";
import { useLiveSimulation } from "@/components/simulation";
import type { FigureParams } from "@/lessons";
import { figureSimInputs } from "@/lessons/figure-sim-inputs";
import { FigureFrame } from "./figure-frame";
import { formatQuantity, formatVolts } from "./format-quantity";
import { thinTrace } from "./thin-trace";
import { ViewToggle, type ViewWindow } from "./view-toggle";
import { WaveChart, type Band, type Trace } from "./wave-chart";

type Params = FigureParams<"clamp-compare">;

/** The same run with the pixel's clamp diodes and without them, on shared axes, each with its verdict. */
export function ClampCompareFigure({ params, caption }: { params: Params; caption: string }) {
  const [view, setView] = useState<ViewWindow>("edge");
  const [withClamps, withoutClamps] = figureSimInputs({ figure: "clamp-compare", params });
  const clamped = useLiveSimulation(withClamps!, { quality: "preview" }).result;
  const open = useLiveSimulation(withoutClamps!, { quality: "preview" }).result;

  const firstOne = Math.max(0, params.bits.indexOf("1"));
  const edgeStart = clamped ? clamped.timing.leadIn + firstOne * clamped.timing.bitPeriod - 20e-9 : 0;
  const end = clamped ? (clamped.trace.time[clamped.trace.time.length - 1] ?? 0) : 1e-6;
  const window = (view === "edge" ? [edgeStart, edgeStart + 500e-9] : [0, end]) as [number, number];
  const rows = [
    { id: "clamped", label: "With the clamp diodes (a real pixel input)", run: clamped, tone: "far" as const, dash: "solid" as const },
    { id: "open", label: "Without them (the bounce arithmetic)", run: open, tone: "signal" as const, dash: "dashed" as const },
  ];
  const traces: Trace[] = rows.flatMap((row) =>
    row.run ? [{ id: row.id, label: row.label, points: thinTrace(row.run.trace.time, row.run.trace.farEnd, window, 600), tone: row.tone, dash: row.dash }] : [],
  );
  const typical = clamped?.verdict.typical.band;
  const guaranteed = clamped?.verdict.guaranteed.band;
  const bands: Band[] = typical ? [{ from: typical.lowest, to: typical.highest, label: "typical pixels switch here", tone: "ideal" }] : [];

  return (
    <FigureFrame
      label="One run with and without the clamp diodes"
      caption={caption}
      controls={<ViewToggle value={view} onChange={setView} />}
      readout={
        <div className="overflow-x-auto" role="region" aria-label="Clamped and unclamped runs compared" tabIndex={0}>
          <table className="w-full text-left text-sm tabular-nums">
            <caption className="sr-only">Peak, clamp current and verdict of each run</caption>
            <thead>
              <tr className="text-ink">
                <th scope="col" className="py-1 pr-3 font-semibold">Pixel input</th>
                <th scope="col" className="py-1 pr-3 font-semibold">Highest far end</th>
                <th scope="col" className="py-1 pr-3 font-semibold">Clamp current</th>
                <th scope="col" className="py-1 font-semibold">Simulator verdict</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((row) => (
                <tr key={row.id} className="border-t border-line align-top">
                  <th scope="row" className="py-1 pr-3 font-medium">{row.label}</th>
                  <td className="py-1 pr-3">{row.run ? formatVolts(Math.max(...row.run.trace.farEnd)) : "…"}</td>
                  <td className="py-1 pr-3">{row.id === "open" ? "no clamps" : row.run ? formatQuantity(row.run.metrics.clampCurrentPeak, "A") : "…"}</td>
                  <td className="py-1">{row.run ? row.run.verdict.summary : "…"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      }
    >
      {traces.length > 0 && guaranteed ? (
        <WaveChart
          title="Far end with and without the clamp diodes"
          xDomain={window}
          yDomain={[-1.5, Math.max(params.highVoltage, params.supplyVoltage) * 1.5 + 1]}
          traces={traces}
          bands={bands}
          levels={[
            { y: guaranteed.highest, label: `high threshold ${formatVolts(guaranteed.highest)}`, tone: "high" },
            { y: guaranteed.lowest, label: `low threshold ${formatVolts(guaranteed.lowest)}`, tone: "low" },
          ]}
        />
      ) : (
        <div className="h-[280px] animate-pulse rounded-lg bg-sunken" aria-hidden="true" />
      )}
    </FigureFrame>
  );
}
