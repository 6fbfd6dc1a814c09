"use client";

import { useActionState, useId, type ReactNode } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { SubmitButton } from "@/components/forms/submit-button";
import { AnsweredBadge, CheckNotes, checkStanding, type SavedCheck } from "./check-standing";
import { idleQuickCheckState, type QuickCheckState } from "./quick-check-state";

type Props = {
  action: (previous: QuickCheckState, formData: FormData) => Promise<QuickCheckState>;
  lessonSlug: string;
  checkId: string;
  number: number;
  total: number;
  prompt: ReactNode;
  hint: ReactNode;
  /** Rendered by the server only once the learner has answered correctly, so the page never gives it away. */
  explanation: ReactNode | null;
  expected: string;
  saved: SavedCheck;
};

export function QuickCheckForm({ action, lessonSlug, checkId, number, total, prompt, hint, explanation, expected, saved }: Props) {
  const [state, formAction, pending] = useActionState(action, idleQuickCheckState);
  const ids = useId();
  const { live, status, answeredRight, showHint } = checkStanding(state, saved);

  return (
    <section
      id={`check-${checkId}`}
      aria-labelledby={`${ids}-title`}
      className="my-10 scroll-mt-24 rounded-card border border-line bg-surface p-5 shadow-xs sm:p-6"
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`${ids}-title`} className="text-sm font-semibold uppercase tracking-wide text-accent">
          Quick check {number} of {total}
        </h3>
        {answeredRight ? <AnsweredBadge /> : null}
      </div>
      <div className="mt-3 text-ink">{prompt}</div>
      <form action={formAction} className="mt-4 space-y-3" noValidate>
        <input type="hidden" name="lessonSlug" value={lessonSlug} />
        <input type="hidden" name="checkId" value={checkId} />
        <div className="space-y-1.5">
          <label htmlFor={`${ids}-entry`} className="block text-sm font-medium text-ink">
            Your answer
          </label>
          <div className="flex flex-col gap-3 sm:flex-row">
            <input
              id={`${ids}-entry`}
              name="entry"
              type="text"
              defaultValue={live?.entry ?? saved.correctEntry ?? saved.lastEntry ?? ""}
              autoComplete="off"
              autoCapitalize="none"
              autoCorrect="off"
              spellCheck={false}
              aria-describedby={`${ids}-format`}
              className="block w-full min-w-0 rounded-lg border border-line-strong bg-surface px-3 py-2.5 font-mono text-base text-ink outline-none placeholder:text-ink-faint focus:border-accent focus:ring-2 focus:ring-accent/25 sm:max-w-xs"
            />
            <SubmitButton pending={pending} pendingLabel="Checking…" wide={false}>
              Check answer
            </SubmitButton>
          </div>
          <p id={`${ids}-format`} className="text-sm text-ink-faint">
            {expected}. A calculation works as well as its result.
          </p>
        </div>
        <FormAlert tone={status?.tone ?? "info"} message={status?.message ?? null} />
      </form>
      <CheckNotes showHint={showHint} hint={hint} answeredRight={answeredRight} explanation={explanation} />
    </section>
  );
}
