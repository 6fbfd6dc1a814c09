"use client";

import { useMemo } from "react";
import { createPortal } from "react-dom";
import { DRAG_SPAN, FULL_SPAN, useLiveSimulation, type LiveRun } from "@/components/simulation";
import { ScopeView } from "@/components/scope-view";
import type { PassRule } from "@/lessons/schema";
import type { SimInput } from "@/lib/sim";
import { JUDGEMENT_PROMISE } from "@/lessons/pass-rule";
import { previewJudgement } from "./rule-preview";

function SimulationBadge({ pending, roundTripMs, computeMs }: { pending: boolean; roundTripMs: number | null; computeMs: number | null }) {
  const text = pending ? "simulating…" : roundTripMs === null ? "" : `${Math.round(roundTripMs)} ms`;
  return (
    <span
      className="rounded-full border border-line bg-sunken px-2.5 py-0.5 text-xs tabular-nums text-ink-soft"
      title={computeMs === null || roundTripMs === null ? undefined : `Simulated in ${computeMs.toFixed(1)} ms in the worker; ${roundTripMs.toFixed(1)} ms from handing it the input to having the result back`}
      data-testid="resimulation-time"
      data-pending={pending}
    >
      <span className="sr-only">Re-simulation time: </span>
      {text}
    </span>
  );
}

/** Says what a drag preview leaves out, so that it is never taken for the full run. */
function DragPreviewNote({ run }: { run: LiveRun }) {
  const cut = run.bits.length < run.patternBits;
  return (
    <p className="mt-4 rounded-lg border border-line bg-sunken px-4 py-3 text-sm text-ink-soft" data-testid="drag-preview-note" role="status">
      A quick preview while the control moves{cut ? `: the first ${run.bits.length} of ${run.patternBits} bits` : ""}, within 2 % of the supply of the full
      simulation. Let go to see the full run checked against the lab&apos;s rule.
    </p>
  );
}

/**
 * "Try it on the workbench": the run re-simulated in the browser's worker as the controls move, drawn on
 * the scope view, with the lab's pass rule applied to it as a preview. While a control is dragged
 * the worker solves a quicker preview (DRAG_SPAN) so that the drawing keeps up; once it is let go,
 * the full run at grading accuracy, which alone is held against the rule. Grading happens only on submit.
 */
export function WorkbenchPreview({
  input,
  dragging = false,
  rule,
  caption,
  note,
  scopeHeight,
  detailsIn = null,
}: {
  input: SimInput;
  dragging?: boolean;
  rule: PassRule;
  caption: string;
  note?: React.ReactNode;
  /** The chart's height in pixels: smaller on a phone, where the scope stays on screen beside the controls. */
  scopeHeight?: number;
  /** On a phone, where the chart stays on screen alone: the places below the controls for the judgement and for the scope's words. */
  detailsIn?: { judgement: HTMLElement; scope: HTMLElement } | null;
}) {
  const live = useLiveSimulation(input, dragging ? DRAG_SPAN : FULL_SPAN);
  const run = live.result;
  const isFullRun = run !== null && run.span.quality === FULL_SPAN.quality && run.bits.length === run.patternBits;
  const judgement = run && isFullRun ? previewJudgement(rule, run) : null;
  // While a control is dragged the next preview is already on its way: dimming the scope and
  // blanking the badge meanwhile would only flicker, and would redraw the chart (the page's
  // costliest render) once more on every step, for nothing new to see.
  const stale = live.pending && !dragging;
  const { roundTripMs } = live;
  const scope = useMemo(
    () =>
      run ? (
        <ScopeView run={run} stale={stale} caption={caption} height={scopeHeight} detailsIn={detailsIn?.scope ?? null}>
          <SimulationBadge pending={stale} roundTripMs={roundTripMs} computeMs={run.computeMs} />
        </ScopeView>
      ) : null,
    [run, stale, caption, roundTripMs, scopeHeight, detailsIn],
  );

  // On a phone these go below the controls, so that the chart stays on screen beside them.
  const below = run ? (
    <>
      {run.span.quality === DRAG_SPAN.quality ? <DragPreviewNote run={run} /> : null}
      {judgement ? (
        <div
          className={`mt-4 rounded-lg border p-4 text-sm ${judgement.pass ? "border-ok/30 bg-ok-soft" : "border-copper/30 bg-copper-soft"}`}
          data-testid="rule-preview"
        >
          <p className="font-semibold">
            {judgement.pass ? "✓ On the workbench this run meets the lab's rule." : "✗ On the workbench this run does not yet meet the lab's rule:"}{" "}
            <span className="font-normal text-ink-soft">(a preview; only a submitted attempt is graded)</span>
          </p>
          <p className="mt-1" data-testid="rule-judgement">
            The lab asks that the run {JUDGEMENT_PROMISE[rule.judgement]}. {rule.judgementWhy}
          </p>
          {judgement.failures.length > 0 ? (
            <ul className="mt-2 list-disc space-y-1 pl-5">
              {judgement.failures.map((failure) => (
                <li key={failure.code}>{failure.message}</li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
    </>
  ) : null;

  return (
    <div data-testid="workbench-preview" data-pending={live.pending}>
      {live.error ? (
        <p role="alert" className="mb-3 rounded-lg border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
          The simulator could not run this: {live.error}
        </p>
      ) : null}
      {run ? (
        <>
          {note}
          {judgement ? (
            // On a phone the full judgement sits below the scope, out of sight while the controls move: its gist goes first.
            <p aria-hidden="true" className={`mb-2 text-sm font-semibold lg:hidden ${judgement.pass ? "text-ok" : "text-copper"}`}>
              {judgement.pass ? "✓ Meets the lab's rule (preview)" : "✗ Does not yet meet the lab's rule (preview)"}
            </p>
          ) : null}
          {scope}
          {detailsIn ? createPortal(below, detailsIn.judgement) : below}
        </>
      ) : (
        <div className="flex h-72 items-center justify-center rounded-lg border border-dashed border-line-strong bg-sunken text-sm text-ink-soft" aria-live="polite">
          {live.error ? "No waveform to show." : "Starting the simulator…"}
        </div>
      )}
    </div>
  );
}
