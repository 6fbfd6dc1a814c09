"use client";

import { useState } from "react";
import { useLiveSimulation } from "@/components/simulation";
import type { FigureParams } from "@/lessons";
import { figureSimInputs } from "@/lessons/figure-sim-inputs";
import { FigureFrame } from "./figure-frame";
import { formatQuantity, formatVolts } from "./format-quantity";
import { gridValues, RangeControl } from "./range-control";
import { thinTrace } from "./thin-trace";
import { ViewToggle, type ViewWindow } from "./view-toggle";
import { WaveChart } from "./wave-chart";

type Params = FigureParams<"series-termination">;

/** The simulated run of lessons 6 and 7: near and far end on one chart, re-simulated as the control moves. */
export function SeriesTerminationFigure({ params, caption, resistorValues }: { params: Params; caption: string; resistorValues: number[] }) {
  const slider = params.slider;
  const isResistor = slider.field === "seriesResistance";
  const values = "series" in slider ? resistorValues : gridValues(slider.min, slider.max, slider.step);
  const [moved, setMoved] = useState(params[slider.field]);
  const [view, setView] = useState<ViewWindow>("edge");
  const [input] = figureSimInputs({ figure: "series-termination", params }, moved);
  const { result, pending, error } = useLiveSimulation(input ?? null);

  const firstOne = params.bits.indexOf("1");
  const edgeStart = result ? result.timing.leadIn + Math.max(0, firstOne) * result.timing.bitPeriod - 20e-9 : 0;
  const end = result ? result.trace.time[result.trace.time.length - 1] ?? 0 : 1e-6;
  const window = (view === "edge" ? [edgeStart, edgeStart + 500e-9] : [0, end]) as [number, number];
  const vHigh = result ? result.receiver.highThreshold * result.receiver.supplyVoltage : 0;
  const vLow = result ? result.receiver.lowThreshold * result.receiver.supplyVoltage : 0;
  const failure = result?.verdict.reasons.find((reason) => reason.severity === "fail");
  const warning = result?.verdict.reasons.find((reason) => reason.severity === "warning");

  return (
    <FigureFrame
      label="Simulated run with a series resistor"
      caption={caption}
      controls={
        <>
          <RangeControl
            label={isResistor ? `Series resistor${"series" in slider ? ` (${slider.series} values)` : ""}` : "Cable length"}
            values={values}
            value={moved}
            format={(value) => (isResistor ? formatQuantity(value, "Ω") : `${value} m`)}
            onChange={setMoved}
          />
          <ViewToggle value={view} onChange={setView} />
        </>
      }
      readout={
        error ? (
          <p role="alert">The simulator could not run this: {error}</p>
        ) : result ? (
          <div className="space-y-1">
            <p>
              Line Z0 {formatQuantity(result.line.z0, "Ω")}, one-way delay {formatQuantity(result.line.delay, "s")}. Far end: rise time{" "}
              {result.metrics.riseTime === null ? "does not complete" : formatQuantity(result.metrics.riseTime, "s")}, overshoot{" "}
              {formatVolts(result.metrics.overshoot)}, voltage margin {formatVolts(result.metrics.voltageMargin)}
              {result.metrics.timingMargin === null ? "" : `, timing margin ${formatQuantity(result.metrics.timingMargin, "s")}`}.
            </p>
            <p className="font-medium">
              Sent <span className="font-mono">{params.bits}</span>, the pixel reads <span className="font-mono">{result.decoded || "nothing"}</span>
              {result.verdict.pass
                ? warning
                  ? `: the run works, but ${warning.message}`
                  : ": the run works."
                : `: it fails — ${failure?.message ?? "bits are lost"}`}
              {pending ? " (updating…)" : ""}
            </p>
          </div>
        ) : (
          <p>Simulating the run…</p>
        )
      }
    >
      {result ? (
        <WaveChart
          title={`Near and far end with ${isResistor ? formatQuantity(moved, "Ω") : `${moved} m`}`}
          xDomain={window}
          yDomain={[-1, Math.max(params.highVoltage, params.supplyVoltage) * 1.45]}
          traces={[
            { id: "near", label: "Near end (after the resistor)", points: thinTrace(result.trace.time, result.trace.nearEnd, window, 700), tone: "ideal", dash: "dashed", width: 1.5 },
            { id: "far", label: "Far end (pixel input)", points: thinTrace(result.trace.time, result.trace.farEnd, window, 700), tone: "far", width: 2.2 },
          ]}
          levels={[
            { y: vHigh, label: `high threshold ${formatVolts(vHigh)}`, tone: "high" },
            { y: vLow, label: `low threshold ${formatVolts(vLow)}`, tone: "low" },
          ]}
        />
      ) : (
        <div className="h-[280px] animate-pulse rounded-lg bg-sunken" aria-hidden="true" />
      )}
    </FigureFrame>
  );
}
