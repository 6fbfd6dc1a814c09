"use client";

import dynamic from "next/dynamic";
import { useMemo, useState } from "react";
import { createPortal } from "react-dom";
import type { LiveRun } from "@/components/simulation";
import { BitStrip } from "./bit-strip";
import { DragOverlay } from "./drag-overlay";
import type { ScopeMarker } from "./scope-chart";
import { ScopeLegend } from "./scope-legend";
import { ScopeSummary } from "./scope-summary";
import { decimateTraces } from "./decimate";
import { bitAtFarEnd, timeWindow, type ZoomMode } from "./time-window";
import { useElementWidth } from "./use-element-width";

// The charting library is most of the page's script; it loads beside the simulator's worker
// instead of holding up the first paint of the workbench, which has nothing to draw until the
// first run is simulated anyway.
const ScopeChart = dynamic(() => import("./scope-chart").then((module) => module.ScopeChart), { ssr: false });

const zoomModes: { mode: ZoomMode; label: string }[] = [
  { mode: "whole", label: "Whole pattern" },
  { mode: "bit", label: "One bit" },
  { mode: "rise", label: "Rising edge" },
  { mode: "fall", label: "Falling edge" },
];

const POINT_BUDGET = 1500;

function voltageRange(run: LiveRun): [number, number] {
  let low = 0;
  let high = run.receiver.supplyVoltage;
  for (const trace of [run.trace.nearEnd, run.trace.farEnd]) {
    for (let i = 0; i < trace.length; i += 1) {
      if (trace[i] < low) low = trace[i];
      if (trace[i] > high) high = trace[i];
    }
  }
  return [Math.floor((low - 0.3) * 2) / 2, Math.ceil((high + 0.3) * 2) / 2];
}

function firstWrongBit(run: LiveRun): number {
  const index = run.bits.findIndex((bit) => bit.received !== String(bit.sent));
  return index === -1 ? 0 : index;
}

type Props = {
  run: LiveRun;
  /** The run drawn is older than the inputs on screen (a newer one is being simulated). */
  stale?: boolean;
  /** What this scope view shows, for the figure's accessible name. */
  caption: string;
  height?: number;
  /** Where the decoded bits and the verdict in words go when not under the chart (a phone, where the chart stays on screen alone). */
  detailsIn?: HTMLElement | null;
  children?: React.ReactNode;
};

/**
 * A simulated run on a scope: near and far end against the pixel's thresholds, with bit slots,
 * misread bits and the verdict's reasons marked, a time zoom down to one edge, the decoded bits
 * and the whole verdict in words beside it.
 */
export function ScopeView({ run, stale = false, caption, height = 300, detailsIn = null, children }: Props) {
  const [mode, setMode] = useState<ZoomMode>("whole");
  const [chosenBit, setChosenBit] = useState<number | null>(null);
  const [chartBox, chartWidth] = useElementWidth<HTMLDivElement>();
  const bitIndex = Math.min(chosenBit ?? firstWrongBit(run), run.bits.length - 1);

  // While a control is dragged the chart keeps the last full run's frame and only the preview's
  // traces are drawn over it (DragOverlay); the whole chart follows once the full run is back.
  const [settledRun, setSettledRun] = useState<LiveRun | null>(run.span.quality === "preview" ? null : run);
  if (run.span.quality !== "preview" && settledRun !== run) setSettledRun(run);
  const dragging = run.span.quality === "preview" && settledRun !== null;
  const chartRun = dragging ? settledRun : run;

  const yDomain = useMemo(() => voltageRange(chartRun), [chartRun]);
  const { from, to } = timeWindow(chartRun, mode, bitIndex);
  const points = useMemo(() => decimateTraces(chartRun.trace, from, to, POINT_BUDGET), [chartRun, from, to]);
  const selectedBit = mode === "whole" ? null : bitIndex;
  const slotLabels = Math.floor((chartWidth - 110) / 22);
  // The same element while only the preview changes, so React leaves the chart as it is.
  const chart = useMemo(() => {
    // The verdict's markers belong to the run drawn in full; while dragging, the summary below already
    // speaks of the preview, whose reasons may be others.
    const markers: ScopeMarker[] = dragging ? [] : chartRun.verdict.reasons.flatMap((reason, i) => (reason.at ? [{ number: i + 1, time: reason.at.time }] : []));
    return (
      <ScopeChart
        run={chartRun}
        points={points}
        window={{ from, to }}
        yDomain={yDomain}
        markers={markers}
        selectedBit={selectedBit}
        height={height}
        slotLabels={slotLabels}
        tracesHidden={dragging}
      />
    );
  }, [chartRun, points, from, to, yDomain, selectedBit, height, slotLabels, dragging]);

  const selectBit = (index: number) => {
    setChosenBit(index);
    if (mode === "whole") setMode("bit");
  };
  const showReason = (index: number) => {
    const at = run.verdict.reasons[index]?.at;
    if (!at) return;
    setChosenBit(at.bit ?? bitAtFarEnd(run, at.time));
    setMode("bit");
  };

  const legend = (
    <div className="mt-3">
      <ScopeLegend />
    </div>
  );
  // Away from the chart (a phone) the legend goes with the words, so that the chart alone stays compact.
  const details = (
    <>
      {detailsIn ? legend : null}
      <BitStrip bits={run.bits} selected={mode === "whole" ? null : bitIndex} onSelect={selectBit} />
      <div className="mt-4 rounded-lg border border-line bg-sunken/50 p-4">
        <ScopeSummary run={run} onShowReason={showReason} />
      </div>
    </>
  );

  return (
    <figure className={`transition-opacity ${stale ? "opacity-60" : ""}`} aria-busy={stale}>
      <figcaption className="sr-only">{caption}</figcaption>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div role="group" aria-label="Time zoom" className="inline-flex overflow-hidden rounded-lg border border-line-strong">
          {zoomModes.map((option) => (
            <button
              key={option.mode}
              type="button"
              aria-pressed={mode === option.mode}
              onClick={() => setMode(option.mode)}
              className={`px-3 py-1.5 text-sm font-medium ${mode === option.mode ? "bg-accent text-white" : "bg-surface text-ink hover:bg-sunken"}`}
            >
              {option.label}
            </button>
          ))}
        </div>
        {mode !== "whole" ? (
          <div className="flex items-center gap-1 text-sm" role="group" aria-label="Which bit">
            <button
              type="button"
              className="rounded-md border border-line-strong px-2 py-1 disabled:opacity-40"
              onClick={() => setChosenBit(Math.max(0, bitIndex - 1))}
              disabled={bitIndex === 0}
              aria-label="Previous bit"
            >
              ◀
            </button>
            <span className="min-w-20 text-center tabular-nums">
              bit {bitIndex + 1} of {run.bits.length}
            </span>
            <button
              type="button"
              className="rounded-md border border-line-strong px-2 py-1 disabled:opacity-40"
              onClick={() => setChosenBit(Math.min(run.bits.length - 1, bitIndex + 1))}
              disabled={bitIndex >= run.bits.length - 1}
              aria-label="Next bit"
            >
              ▶
            </button>
          </div>
        ) : null}
        {children}
      </div>
      {detailsIn ? null : legend}
      <div className="relative mt-2 -ml-2" aria-hidden="true" ref={chartBox} style={{ minHeight: height }} data-testid="scope-chart">
        {chart}
        {dragging ? <DragOverlay run={run} window={{ from, to }} yDomain={yDomain} width={chartWidth} height={height} /> : null}
      </div>
      {detailsIn ? createPortal(details, detailsIn) : details}
    </figure>
  );
}
