"use client";

import { useRef } from "react";
import type { WorkbenchRun } from "./workbench-types";

/** One tab per run of an installation; arrow keys, Home and End move between them. */
export function RunTabs({ runs, activeRunId, onSelect }: { runs: WorkbenchRun[]; activeRunId: string; onSelect: (runId: string) => void }) {
  const tabs = useRef<(HTMLButtonElement | null)[]>([]);
  const activeIndex = runs.findIndex((run) => run.id === activeRunId);
  const focus = (index: number) => {
    const wrapped = (index + runs.length) % runs.length;
    onSelect(runs[wrapped].id);
    tabs.current[wrapped]?.focus();
  };
  return (
    <div role="tablist" aria-label="Runs of the installation" className="flex flex-wrap gap-2 border-b border-line">
      {runs.map((run, index) => {
        const active = run.id === activeRunId;
        return (
          <button
            key={run.id}
            ref={(element) => {
              tabs.current[index] = element;
            }}
            id={`run-tab-${run.id}`}
            role="tab"
            type="button"
            aria-selected={active}
            aria-controls={`run-panel-${run.id}`}
            tabIndex={active ? 0 : -1}
            onClick={() => onSelect(run.id)}
            onKeyDown={(event) => {
              const moves: Record<string, number> = { ArrowRight: activeIndex + 1, ArrowLeft: activeIndex - 1, Home: 0, End: runs.length - 1 };
              if (event.key in moves) {
                event.preventDefault();
                focus(moves[event.key]);
              }
            }}
            className={`-mb-px rounded-t-lg border px-4 py-2 text-sm font-semibold ${
              active ? "border-line border-b-surface bg-surface text-ink" : "border-transparent text-ink-soft hover:text-ink"
            }`}
          >
            {run.label}
          </button>
        );
      })}
    </div>
  );
}
