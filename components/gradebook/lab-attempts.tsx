"use client";

import { useState } from "react";
import type { AttemptRecord } from "@/lib/gradebook";
import { AttemptScope } from "./attempt-scope";

const momentFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", timeZone: "UTC" });

/** Every attempt at one lab, oldest first; any one of them opens on the scope below the list. */
export function LabAttempts({ attempts, labLabel, learnerName }: { attempts: AttemptRecord[]; labLabel: string; learnerName: string }) {
  const [openId, setOpenId] = useState<string | null>(null);
  const open = attempts.find((attempt) => attempt.id === openId) ?? null;

  return (
    <div>
      <div className="relative overflow-x-auto">
        <table className="w-full min-w-[40rem] table-fixed border-collapse text-sm">
          <caption className="sr-only">Attempts at {labLabel}</caption>
          <thead>
            <tr className="border-b border-line text-left text-ink-soft">
              <th scope="col" className="w-10 py-2 pr-3 font-semibold">#</th>
              <th scope="col" className="w-32 py-2 pr-3 font-semibold">When (UTC)</th>
              <th scope="col" className="py-2 pr-3 font-semibold">Choices</th>
              <th scope="col" className="w-16 py-2 pr-3 text-right font-semibold">Score</th>
              <th scope="col" className="w-52 py-2 pr-3 font-semibold">Verdict</th>
              <th scope="col" className="w-36 py-2 font-semibold">
                <span className="sr-only">Scope</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {attempts.map((attempt) => {
              const isOpen = attempt.id === openId;
              const failures = attempt.runs.flatMap((run) => run.failures);
              return (
                <tr key={attempt.id} className={`border-b border-line align-top last:border-b-0 ${isOpen ? "bg-accent-soft/60" : ""}`}>
                  <td className="py-2 pr-3 tabular-nums">{attempt.attemptNumber}</td>
                  <td className="whitespace-nowrap py-2 pr-3">{momentFormat.format(attempt.createdAt)}</td>
                  <td className="py-2 pr-3">
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
                  </td>
                  <td className="py-2 pr-3 text-right font-semibold tabular-nums">{attempt.score}</td>
                  <td className="py-2 pr-3">
                    <span className={`font-semibold ${attempt.passed ? "text-ok" : "text-danger"}`}>
                      {attempt.passed ? "✓ passed" : "✗ failed"}
                    </span>
                    {failures.length > 0 ? <span className="block text-xs text-ink-soft">{failures[0]}</span> : null}
                  </td>
                  <td className="py-2 text-right">
                    <button
                      type="button"
                      aria-expanded={isOpen}
                      onClick={() => setOpenId(isOpen ? null : attempt.id)}
                      className="whitespace-nowrap rounded-md border border-line-strong px-2.5 py-1 text-sm font-medium hover:bg-sunken"
                    >
                      {isOpen ? "Close scope" : "Open on scope"}
                      <span className="sr-only"> (attempt {attempt.attemptNumber})</span>
                    </button>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {open ? (
        <div className="mt-4">
          <AttemptScope key={open.id} attempt={open} learnerName={learnerName} />
        </div>
      ) : null}
    </div>
  );
}
