"use client";

import type { ReactNode } from "react";
import type { WorkbenchQuestion, WorkbenchRun } from "./workbench-types";
import type { SubmitReply } from "./attempts-api";
import { buttonClass } from "@/components/ui/button-class";

export type QuestionText = { prompt: ReactNode; hint: ReactNode };

type Props = {
  runs: WorkbenchRun[];
  questions: WorkbenchQuestion[];
  questionTexts: Record<string, QuestionText>;
  answers: Record<string, string>;
  onAnswer: (id: string, entry: string) => void;
  onSubmit: () => void;
  pending: boolean;
  error: { message: string; fieldErrors: Record<string, string[]> } | null;
  reply: SubmitReply | null;
  nextAttempt: number;
  attempts: { free: number; penalty: number };
};

function AttemptResult({ reply, runs }: { reply: SubmitReply; runs: WorkbenchRun[] }) {
  const { attempt } = reply;
  return (
    <div className={`rounded-lg border p-4 ${reply.passed ? "border-ok/30 bg-ok-soft" : "border-danger/30 bg-danger-soft"}`}>
      <p className="text-base font-semibold text-ink">
        Attempt {attempt.attemptNumber}: {reply.score} / 100 — {reply.passed ? "passed" : "not passed yet"}
        {reply.replayed ? " (this submission was already graded; here is its result)" : ""}
      </p>
      <ul className="mt-3 space-y-3 text-sm">
        {attempt.runs.map((run) => {
          const lines = reply.reasons.filter((line) => line.runId === run.runId);
          return (
            <li key={run.runId}>
              <p className="font-semibold">
                {runs.length > 1 ? `${run.label}: ` : ""}
                {run.pass ? "✓ meets the lab's rule" : "✗ does not meet the lab's rule"} ({run.bitsCorrect} of {run.bitsSent} bits decoded)
                {run.verdict.outcome ? <span className="block font-normal">Simulator verdict: {run.verdict.summary}.</span> : null}
              </p>
              {lines.length > 0 ? (
                <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-soft">
                  {lines.map((line, i) => (
                    <li key={i}>
                      <span className={`font-semibold ${line.severity === "fail" ? "text-danger" : "text-copper"}`}>
                        {line.heading}:
                      </span>{" "}
                      {line.message}
                    </li>
                  ))}
                </ul>
              ) : null}
            </li>
          );
        })}
      </ul>
      {attempt.questions.length > 0 ? (
        <ul className="mt-3 space-y-1 text-sm">
          {attempt.questions.map((q) => (
            <li key={q.id}>
              <span className="font-semibold">{q.correct ? "✓" : "✗"}</span> {q.message}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** The lab's questions (numbers with units), the submit button, and the graded result, announced as it arrives. */
export function SubmitPanel({ runs, questions, questionTexts, answers, onAnswer, onSubmit, pending, error, reply, nextAttempt, attempts }: Props) {
  const general = error ? Object.entries(error.fieldErrors).filter(([field]) => !field.startsWith("answers.")) : [];
  const onlyAnswers = error !== null && general.length === 0 && Object.keys(error.fieldErrors).length > 0;
  const penaltyNote =
    nextAttempt > attempts.free
      ? `This will be attempt ${nextAttempt}: attempts after the first ${attempts.free} lose ${attempts.penalty} points each.`
      : `This will be attempt ${nextAttempt}. The first ${attempts.free} attempts carry no penalty; later ones lose ${attempts.penalty} points each.`;
  return (
    <form
      className="space-y-5"
      onSubmit={(event) => {
        event.preventDefault();
        onSubmit();
      }}
      noValidate
    >
      {questions.length > 0 ? (
        <fieldset className="space-y-4">
          <legend className="mb-1 text-base font-semibold text-ink">Questions</legend>
          <p className="text-sm text-ink-soft">Type a number with its unit; arithmetic is fine (for example 2.2*270*600e-12 s).</p>
          {questions.map((question) => {
            const id = `answer-${question.id}`;
            const problem = error?.fieldErrors[`answers.${question.id}`]?.[0];
            return (
              <div key={question.id} className="space-y-1.5">
                <label htmlFor={id} className="block text-sm font-medium text-ink">
                  {questionTexts[question.id]?.prompt}
                </label>
                <input
                  id={id}
                  type="text"
                  inputMode="text"
                  autoComplete="off"
                  spellCheck={false}
                  value={answers[question.id] ?? ""}
                  onChange={(event) => onAnswer(question.id, event.target.value)}
                  placeholder={`e.g. ${question.example}`}
                  aria-invalid={problem ? true : undefined}
                  aria-describedby={`${id}-hint${problem ? ` ${id}-error` : ""}`}
                  className={`block w-full max-w-sm rounded-lg border bg-surface px-3 py-2 font-mono text-base text-ink focus:border-accent focus:ring-2 focus:ring-accent/25 focus:outline-none ${
                    problem ? "border-danger" : "border-line-strong"
                  }`}
                />
                <div id={`${id}-hint`} className="text-xs text-ink-faint">
                  {questionTexts[question.id]?.hint}
                </div>
                {problem ? (
                  <p id={`${id}-error`} className="text-sm font-medium text-danger">
                    {problem}
                  </p>
                ) : null}
              </div>
            );
          })}
        </fieldset>
      ) : null}
      <div className="flex flex-wrap items-center gap-4">
        <button type="submit" className={buttonClass("primary")} disabled={pending}>
          {pending ? "Grading…" : runs.length > 1 ? "Submit all runs for grading" : "Submit for grading"}
        </button>
        <p className="text-sm text-ink-soft">{penaltyNote}</p>
      </div>
      <div aria-live="polite" role="status" className="space-y-3" data-testid="grading-result">
        {error ? (
          <div className="rounded-lg border border-danger/30 bg-danger-soft px-3 py-2.5 text-sm text-danger">
            <p className="font-medium">
              {onlyAnswers ? "Some answers could not be read, so nothing was graded yet. The messages under them say why." : error.message}
            </p>
            {general.length > 0 ? (
              <ul className="mt-1 list-disc pl-5">
                {general.map(([field, messages]) => (
                  <li key={field}>
                    {field}: {messages.join("; ")}
                  </li>
                ))}
              </ul>
            ) : null}
          </div>
        ) : null}
        {reply && !pending ? <AttemptResult reply={reply} runs={runs} /> : null}
      </div>
    </form>
  );
}
