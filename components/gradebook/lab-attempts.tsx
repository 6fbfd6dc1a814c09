"use client";

import { useState } from "react";
import type { AttemptRecord } from "@/lib/gradebook";
import { AttemptScope } from "./attempt-scope";

const momentFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", timeZone: "UTC" });

/** Every attempt at one lab, oldest first; any one of them opens on the scope below the list. A grid of columns from the small breakpoint up, stacked on a phone. */
export function LabAttempts({ attempts, labLabel, learnerName }: { attempts: AttemptRecord[]; labLabel: string; learnerName: string }) {
  const [openId, setOpenId] = useState<string | null>(null);
  const open = attempts.find((attempt) => attempt.id === openId) ?? null;

  return (
    <div>
      <div aria-hidden="true" className="-mx-2 hidden border-b border-line px-2 pb-2 text-sm font-semibold text-ink-soft sm:grid sm:grid-cols-[8rem_minmax(0,1fr)_4rem_minmax(0,13rem)_9rem] sm:gap-x-4">
        <span>Attempt</span>
        <span>Choices</span>
        <span className="text-right">Score</span>
        <span>Verdict</span>
      </div>
      <ol aria-label={`Attempts at ${labLabel}`} className="divide-y divide-line">
        {attempts.map((attempt) => {
          const isOpen = attempt.id === openId;
          const failures = attempt.runs.flatMap((run) => run.failures);
          return (
            <li
              key={attempt.id}
              className={`-mx-2 grid grid-cols-[minmax(0,1fr)_auto] gap-x-4 gap-y-1.5 rounded-md px-2 py-3 text-sm sm:grid-cols-[8rem_minmax(0,1fr)_4rem_minmax(0,13rem)_9rem] sm:items-start ${isOpen ? "bg-accent-soft/60" : ""}`}
            >
              <div className="sm:order-1">
                <span className="font-semibold">Attempt {attempt.attemptNumber}</span>
                <span className="block text-xs text-ink-soft">{momentFormat.format(attempt.createdAt)} UTC</span>
              </div>
              <div className="text-right sm:order-3">
                <span className="text-base font-semibold tabular-nums">{attempt.score}</span>
                <span className="text-xs text-ink-soft"> / 100</span>
              </div>
              <div className="col-span-2 sm:order-2 sm:col-span-1">
                {attempt.runs.map((run) => (
                  <span key={run.runId} className="block">
                    {attempt.runs.length > 1 ? <span className="text-ink-soft">{run.label}: </span> : null}
                    {run.chosen}
                  </span>
                ))}
                {attempt.questions.length > 0 ? (
                  <span className="block text-xs text-ink-soft">
                    Answers: {attempt.questions.map((q) => `${q.entry} ${q.correct ? "✓" : "✗"}`).join(", ")}
                  </span>
                ) : null}
              </div>
              <div className="col-span-2 sm:order-4 sm:col-span-1">
                <span className={`font-semibold ${attempt.passed ? "text-ok" : "text-danger"}`}>{attempt.passed ? "✓ passed" : "✗ failed"}</span>
                {failures.length > 0 ? <span className="block text-xs text-ink-soft">{failures[0]}</span> : null}
              </div>
              <div className="col-span-2 sm:order-5 sm:col-span-1 sm:text-right">
                <button
                  type="button"
                  aria-expanded={isOpen}
                  onClick={() => setOpenId(isOpen ? null : attempt.id)}
                  className="whitespace-nowrap rounded-md border border-line-strong bg-surface px-2.5 py-1 text-sm font-medium hover:bg-sunken"
                >
                  {isOpen ? "Close scope" : "Open on scope"}
                  <span className="sr-only"> (attempt {attempt.attemptNumber})</span>
                </button>
              </div>
            </li>
          );
        })}
      </ol>
      {open ? (
        <div className="mt-4">
          <AttemptScope key={open.id} attempt={open} learnerName={learnerName} />
        </div>
      ) : null}
    </div>
  );
}
