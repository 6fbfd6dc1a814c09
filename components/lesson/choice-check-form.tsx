"use client";

import { useActionState, useId, type ReactNode } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { SubmitButton } from "@/components/forms/submit-button";
import { AnsweredBadge, CheckNotes, checkStanding, type SavedCheck } from "./check-standing";
import { idleQuickCheckState, type QuickCheckState } from "./quick-check-state";

const ASK_TITLES = { "pick-trace": "Pick the trace", predict: "Predict, then run", diagnose: "Diagnose" } as const;

type Props = {
  action: (previous: QuickCheckState, formData: FormData) => Promise<QuickCheckState>;
  lessonSlug: string;
  checkId: string;
  ask: keyof typeof ASK_TITLES;
  number: number;
  total: number;
  prompt: ReactNode;
  /** The learner's run in words. */
  run: string;
  symptom: string | null;
  /** Traces drawn before an answer (every candidate, or the failing run). */
  figure: ReactNode | null;
  /** Rendered by the server once the learner has answered: the run a prediction was about. */
  revealed: ReactNode | null;
  options: readonly { key: string; label: string }[];
  hint: ReactNode;
  /** Rendered by the server only once the learner has answered correctly. */
  explanation: ReactNode | null;
  saved: SavedCheck;
};

/** A quick check answered by choosing one option; which one is right is known only to the server. */
export function ChoiceCheckForm(props: Props) {
  const { action, lessonSlug, checkId, ask, number, total, prompt, run, symptom, figure, revealed, options, hint, explanation, saved } = props;
  const [state, formAction, pending] = useActionState(action, idleQuickCheckState);
  const ids = useId();
  const { live, status, answeredRight, showHint } = checkStanding(state, saved);
  const chosen = live?.entry ?? saved.correctEntry ?? saved.lastEntry ?? null;

  return (
    <section
      id={`check-${checkId}`}
      aria-labelledby={`${ids}-title`}
      className="my-10 scroll-mt-24 rounded-card border border-line bg-surface p-5 shadow-xs sm:p-6"
      data-check-kind={ask}
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`${ids}-title`} className="text-sm font-semibold uppercase tracking-wide text-accent">
          Quick check {number} of {total} · {ASK_TITLES[ask]}
        </h3>
        {answeredRight ? <AnsweredBadge /> : null}
      </div>
      <div className="mt-3 text-ink">{prompt}</div>
      <p className="mt-3 rounded-lg bg-sunken px-3 py-2 text-sm text-ink">
        <span className="font-semibold">The run: </span>
        {run}
      </p>
      {symptom ? (
        <p className="mt-2 rounded-lg bg-sunken px-3 py-2 text-sm text-ink">
          <span className="font-semibold">On site: </span>
          {symptom}
        </p>
      ) : null}
      {figure}
      <form action={formAction} className="mt-4 space-y-3">
        <input type="hidden" name="lessonSlug" value={lessonSlug} />
        <input type="hidden" name="checkId" value={checkId} />
        <fieldset>
          <legend className="text-sm font-medium text-ink">{ask === "predict" ? "Your prediction" : "Your answer"}</legend>
          <div className={`mt-2 grid gap-2 ${ask === "diagnose" ? "" : "sm:grid-cols-2"}`}>
            {options.map((option) => (
              <label
                key={option.key}
                className="flex min-h-11 cursor-pointer items-center gap-3 rounded-lg border border-line-strong px-3 py-2 text-sm text-ink has-[:checked]:border-accent has-[:checked]:bg-accent-soft"
              >
                <input type="radio" name="choice" value={option.key} defaultChecked={chosen === option.label} className="h-4 w-4 accent-[var(--color-accent)]" />
                {option.label}
              </label>
            ))}
          </div>
        </fieldset>
        <SubmitButton pending={pending} pendingLabel="Checking…" wide={false}>
          {ask === "predict" ? "Commit to this prediction" : "Check answer"}
        </SubmitButton>
        <FormAlert tone={status?.tone ?? "info"} message={status?.message ?? null} />
      </form>
      {revealed}
      <CheckNotes showHint={showHint} hint={hint} answeredRight={answeredRight} explanation={explanation} />
    </section>
  );
}
