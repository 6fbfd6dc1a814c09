"use client";

import { formatMoment } from "@/components/ui/dates";
import type { AttemptView } from "@/lib/grading";
import type { WorkbenchRun } from "./workbench-types";
import { describeChoices } from "./run-facts";

type Props = {
  runs: WorkbenchRun[];
  attempts: AttemptView[] | undefined;
  loading: boolean;
  error: string | null;
  /** Set while older attempts than those shown are on the server: the list comes a page at a time. */
  olderAttempts: { loading: boolean; error: string | null; load: () => void } | null;
  shownAttemptId: string | null;
  openingAttemptId: string | null;
  onOpen: (attempt: AttemptView) => void;
};

/** The learner's graded attempts, newest first; each can be redrawn on the scope view from what was stored. */
export function AttemptHistory({ runs, attempts, loading, error, olderAttempts, shownAttemptId, openingAttemptId, onOpen }: Props) {
  if (error) return <p className="text-sm text-danger">{error}</p>;
  if (loading && !attempts) return <p className="text-sm text-ink-soft">Loading your attempts…</p>;
  if (!attempts || attempts.length === 0) {
    return <p className="text-sm text-ink-soft">No graded attempts yet. Try your design on the workbench, then submit it.</p>;
  }
  return (
    <>
      <ol className="divide-y divide-line" aria-label="Your attempts, newest first" data-testid="attempt-history">
        {attempts.map((attempt) => {
          const shown = attempt.id === shownAttemptId;
          return (
            <li key={attempt.id} className={`flex flex-wrap items-center gap-x-4 gap-y-2 py-3 ${shown ? "bg-accent-soft/60" : ""}`} data-attempt={attempt.attemptNumber}>
              <span className="w-10 shrink-0 font-semibold tabular-nums text-ink">#{attempt.attemptNumber}</span>
              <span className="min-w-0 flex-1 text-sm">
                <span className="block text-ink">
                  {runs.map((run) => `${runs.length > 1 ? `${run.label.split(":")[0]}: ` : ""}${describeChoices(run, attempt.choices[run.id])}`).join(" · ")}
                </span>
                <span className="block text-xs text-ink-faint">{formatMoment(new Date(attempt.createdAt))}</span>
              </span>
              <span className="w-20 text-right font-semibold whitespace-nowrap tabular-nums">{attempt.score} / 100</span>
              <span
                className={`w-24 rounded-full px-2 py-0.5 text-center text-xs font-semibold ${attempt.passed ? "bg-ok-soft text-ok" : "bg-danger-soft text-danger"}`}
              >
                {attempt.passed ? "✓ passed" : "✗ not passed"}
              </span>
              <button
                type="button"
                onClick={() => onOpen(attempt)}
                disabled={openingAttemptId === attempt.id}
                aria-pressed={shown}
                className="rounded-lg border border-line-strong bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken disabled:opacity-60"
              >
                {openingAttemptId === attempt.id ? "Opening…" : shown ? "Shown on the scope" : `Redraw attempt ${attempt.attemptNumber}`}
              </button>
            </li>
          );
        })}
      </ol>
      {olderAttempts ? (
        <div className="mt-3 flex flex-wrap items-center gap-3">
          <button
            type="button"
            onClick={olderAttempts.load}
            disabled={olderAttempts.loading}
            className="rounded-lg border border-line-strong bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken disabled:opacity-60"
          >
            {olderAttempts.loading ? "Loading older attempts…" : "Show older attempts"}
          </button>
          {olderAttempts.error ? (
            <p role="alert" className="text-sm text-danger">
              {olderAttempts.error}
            </p>
          ) : null}
        </div>
      ) : null}
    </>
  );
}
