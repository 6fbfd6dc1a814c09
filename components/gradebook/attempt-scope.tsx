"use client";

import { useState } from "react";
import { ScopeView } from "@/components/scope-view";
import { useLiveSimulation } from "@/components/simulation";
import type { AttemptRecord, AttemptRunRecord } from "@/lib/gradebook";
import type { SimInput } from "@/lib/sim";

function RunScope({ input, caption }: { input: SimInput; caption: string }) {
  const live = useLiveSimulation(input);
  if (live.error) {
    return (
      <p role="alert" className="rounded-lg border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
        The simulator could not redraw this run: {live.error}
      </p>
    );
  }
  if (!live.result) {
    return (
      <div className="flex h-72 items-center justify-center rounded-lg border border-dashed border-line-strong bg-sunken text-sm text-ink-soft" aria-live="polite">
        Re-simulating the stored run…
      </div>
    );
  }
  return <ScopeView run={live.result} stale={live.pending} caption={caption} />;
}

/**
 * A stored attempt on the scope: each run rebuilt from the learner's variant and choices and
 * simulated again in the browser's worker, so the instructor sees the waveform that was graded.
 */
export function AttemptScope({ attempt, learnerName }: { attempt: AttemptRecord; learnerName: string }) {
  const [runId, setRunId] = useState(attempt.runs[0]?.runId);
  const run: AttemptRunRecord | undefined = attempt.runs.find((r) => r.runId === runId) ?? attempt.runs[0];
  if (!run) return null;

  return (
    <div className="rounded-lg border border-accent/30 bg-surface p-4" data-testid="attempt-scope">
      <p className="mb-3 text-sm text-ink-soft" role="status">
        Attempt {attempt.attemptNumber} redrawn from its stored inputs: {run.setting}; chosen {run.chosen}.
      </p>
      {attempt.runs.length > 1 ? (
        <div role="tablist" aria-label="Runs of this attempt" className="mb-3 flex flex-wrap gap-1">
          {attempt.runs.map((r) => (
            <button
              key={r.runId}
              type="button"
              role="tab"
              aria-selected={r.runId === run.runId}
              onClick={() => setRunId(r.runId)}
              className={`rounded-md border px-3 py-1.5 text-sm font-medium ${r.runId === run.runId ? "border-accent bg-accent text-white" : "border-line-strong bg-surface hover:bg-sunken"}`}
            >
              {r.label} {r.pass === null ? "" : r.pass ? "✓" : "✗"}
            </button>
          ))}
        </div>
      ) : null}
      {run.input ? (
        <RunScope key={`${attempt.id}:${run.runId}`} input={run.input} caption={`Scope view of ${learnerName}'s attempt ${attempt.attemptNumber}, ${run.label}`} />
      ) : (
        <p className="text-sm text-ink-soft">This run cannot be redrawn: the lab has changed since the attempt was graded.</p>
      )}
    </div>
  );
}
