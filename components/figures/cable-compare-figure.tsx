"use client";

import { useCallback, useEffect, useState } from "react";
import { useLiveSimulation, type LiveRun } from "@/components/simulation";
import type { FigureParams } from "@/lessons";
import { figureSimInputs } from "@/lessons/figure-sim-inputs";
import type { SimInput } from "@/lib/sim";
import { FigureFrame } from "./figure-frame";
import { formatQuantity, formatVolts } from "./format-quantity";
import { gridValues, RangeControl } from "./range-control";
import { thinTrace } from "./thin-trace";
import type { Dash, Tone } from "./tones";
import { ViewToggle, type ViewWindow } from "./view-toggle";
import { WaveChart, type Trace } from "./wave-chart";

type Params = FigureParams<"cable-compare">;
export type CableRow = { kind: string; label: string; z0: number; capacitancePerMetre: number; delayPerMetre: number };

const styles: { tone: Tone; dash: Dash }[] = [
  { tone: "signal", dash: "solid" },
  { tone: "far", dash: "dashed" },
  { tone: "ink", dash: "dotted" },
  { tone: "high", dash: "solid" },
  { tone: "warn", dash: "dashed" },
];

/** Simulates one cable of the comparison and hands its run to the figure; draws nothing itself. */
function CableRun({ kind, input, onRun }: { kind: string; input: SimInput; onRun: (kind: string, run: LiveRun | null) => void }) {
  const { result } = useLiveSimulation(input, { quality: "preview" });
  useEffect(() => onRun(kind, result), [kind, result, onRun]);
  return null;
}

export function CableCompareFigure({ params, caption, cables }: { params: Params; caption: string; cables: CableRow[] }) {
  const slider = params.slider;
  const [moved, setMoved] = useState(slider ? params[slider.field] : 0);
  const [view, setView] = useState<ViewWindow>("edge");
  const [runs, setRuns] = useState<Record<string, LiveRun | null>>({});
  const onRun = useCallback((kind: string, run: LiveRun | null) => setRuns((previous) => (previous[kind] === run ? previous : { ...previous, [kind]: run })), []);
  const inputs = figureSimInputs({ figure: "cable-compare", params }, slider ? moved : undefined);
  const length = slider?.field === "length" ? moved : params.length;

  const first = runs[params.cables[0]];
  const firstOne = Math.max(0, params.bits.indexOf("1"));
  const edgeStart = first ? first.timing.leadIn + firstOne * first.timing.bitPeriod - 20e-9 : 0;
  const end = first ? first.trace.time[first.trace.time.length - 1] ?? 0 : 1e-6;
  const window = (view === "edge" ? [edgeStart, edgeStart + 500e-9] : [0, end]) as [number, number];
  const traces: Trace[] = params.cables.flatMap((kind, i) => {
    const run = runs[kind];
    const row = cables.find((c) => c.kind === kind);
    return run ? [{ id: kind, label: row?.label ?? kind, points: thinTrace(run.trace.time, run.trace.farEnd, window, 600), ...styles[i % styles.length]! }] : [];
  });
  const vHigh = first ? first.receiver.highThreshold * first.receiver.supplyVoltage : 0;

  return (
    <FigureFrame
      label="The same run on each cable"
      caption={caption}
      controls={
        <>
          {slider ? (
            <RangeControl
              label={slider.field === "length" ? "Cable length" : "Series resistor"}
              values={gridValues(slider.min, slider.max, slider.step)}
              value={moved}
              format={(value) => (slider.field === "length" ? `${value} m` : formatQuantity(value, "Ω"))}
              onChange={setMoved}
            />
          ) : null}
          <ViewToggle value={view} onChange={setView} />
        </>
      }
      readout={
        <div className="overflow-x-auto" role="region" aria-label="Cables compared" tabIndex={0}>
          <table className="w-full text-left text-sm whitespace-nowrap tabular-nums">
            <caption className="sr-only">Catalogue values and simulated far end per cable</caption>
            <thead>
              <tr className="text-ink">
                <th scope="col" className="py-1 pr-3 font-semibold">Cable</th>
                <th scope="col" className="py-1 pr-3 font-semibold">Z0</th>
                <th scope="col" className="py-1 pr-3 font-semibold">C′ per metre</th>
                <th scope="col" className="py-1 pr-3 font-semibold">Delay per metre</th>
                <th scope="col" className="py-1 pr-3 font-semibold">Overshoot at {length} m</th>
                <th scope="col" className="py-1 font-semibold">Simulator verdict</th>
              </tr>
            </thead>
            <tbody>
              {params.cables.map((kind) => {
                const row = cables.find((c) => c.kind === kind);
                const run = runs[kind];
                return (
                  <tr key={kind} className="border-t border-line">
                    <th scope="row" className="py-1 pr-3 font-medium">{row?.label ?? kind}</th>
                    <td className="py-1 pr-3">{row ? formatQuantity(row.z0, "Ω") : "—"}</td>
                    <td className="py-1 pr-3">{row ? formatQuantity(row.capacitancePerMetre, "F/m") : "—"}</td>
                    <td className="py-1 pr-3">{row ? formatQuantity(row.delayPerMetre, "s/m") : "—"}</td>
                    <td className="py-1 pr-3">{run ? formatVolts(run.metrics.overshoot) : "…"}</td>
                    <td className="py-1">{run ? run.verdict.summary : "…"}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      }
    >
      {inputs.map((input, i) => (
        <CableRun key={params.cables[i]} kind={params.cables[i]!} input={input} onRun={onRun} />
      ))}
      {traces.length > 0 ? (
        <WaveChart
          title={`Far end on each cable at ${length} m`}
          xDomain={window}
          yDomain={[-1, Math.max(params.highVoltage, params.supplyVoltage) * 1.5]}
          traces={traces}
          levels={[{ y: vHigh, label: `high threshold ${formatVolts(vHigh)}`, tone: "high" }]}
        />
      ) : (
        <div className="h-[280px] animate-pulse rounded-lg bg-sunken" aria-hidden="true" />
      )}
    </FigureFrame>
  );
}
