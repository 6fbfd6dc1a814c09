"use client";

import { useActionState, useState } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { buttonClass } from "@/components/ui/button-class";
import { idleFormState } from "@/lib/http/form-state";
import { submitReview, type ReviewFormState } from "./actions";

type Criterion = { id: string; criterion: string; points: number };

/** Points per rubric criterion, written feedback, and the decision: accept, or return for rework. */
export function ReviewForm({ submissionId, rubric }: { submissionId: string; rubric: Criterion[] }) {
  const [state, formAction, pending] = useActionState<ReviewFormState, FormData>(submitReview.bind(null, submissionId), idleFormState);
  const values = state.status === "error" ? state.values : {};
  const errors: Partial<Record<string, string>> = state.status === "error" ? state.fieldErrors : {};
  const [points, setPoints] = useState<Record<string, number>>(() =>
    Object.fromEntries(rubric.flatMap((c) => (values[`score-${c.id}`] ? [[c.id, Number(values[`score-${c.id}`])]] : []))),
  );
  const total = Object.values(points).reduce((sum, p) => sum + p, 0);
  const maximum = rubric.reduce((sum, c) => sum + c.points, 0);
  const complete = rubric.every((c) => points[c.id] !== undefined);

  return (
    <form action={formAction} noValidate className="space-y-5">
      {rubric.map((criterion) => {
        const name = `score-${criterion.id}`;
        const error = errors[name];
        return (
          <fieldset key={criterion.id} aria-describedby={error ? `${name}-error` : undefined} className="space-y-2">
            <legend className="text-sm font-medium text-ink">
              {criterion.criterion} <span className="text-ink-faint">(up to {criterion.points})</span>
            </legend>
            <div className="flex flex-wrap gap-2">
              {Array.from({ length: criterion.points + 1 }, (_, value) => (
                <label key={value} className="cursor-pointer">
                  <input
                    type="radio"
                    name={name}
                    value={value}
                    defaultChecked={values[name] === String(value)}
                    onChange={() => setPoints((current) => ({ ...current, [criterion.id]: value }))}
                    className="peer sr-only"
                  />
                  <span
                    className={`flex size-10 items-center justify-center rounded-lg border text-sm font-semibold tabular-nums transition-colors peer-checked:border-accent peer-checked:bg-accent peer-checked:text-white peer-focus-visible:ring-2 peer-focus-visible:ring-accent/40 ${
                      error ? "border-danger" : "border-line-strong"
                    } bg-surface text-ink hover:bg-sunken`}
                  >
                    <span className="sr-only">{`${criterion.criterion}: `}</span>
                    {value}
                  </span>
                </label>
              ))}
            </div>
            {error ? (
              <p id={`${name}-error`} className="text-sm font-medium text-danger">
                {error}
              </p>
            ) : null}
          </fieldset>
        );
      })}
      <p className="text-sm text-ink-soft" aria-live="polite">
        Total: <span className="font-semibold text-ink tabular-nums">{complete ? total : "–"}</span> of {maximum} points
      </p>
      <div className="space-y-1.5">
        <label htmlFor="field-feedback" className="block text-sm font-medium text-ink">
          Feedback for the learner
        </label>
        <textarea
          id="field-feedback"
          name="feedback"
          rows={6}
          maxLength={4000}
          defaultValue={values.feedback}
          aria-invalid={errors.feedback ? true : undefined}
          aria-describedby={errors.feedback ? "field-feedback-error" : "field-feedback-hint"}
          className={`block w-full rounded-lg border bg-surface px-3 py-2.5 text-base text-ink outline-none focus:border-accent focus:ring-2 focus:ring-accent/25 ${
            errors.feedback ? "border-danger" : "border-line-strong"
          }`}
        />
        {errors.feedback ? (
          <p id="field-feedback-error" className="text-sm font-medium text-danger">
            {errors.feedback}
          </p>
        ) : (
          <p id="field-feedback-hint" className="text-sm text-ink-faint">
            What the photo and readings show, how they compare with the prediction, and what to change if you return it.
          </p>
        )}
      </div>
      <FormAlert tone="error" message={state.status === "error" ? state.message : null} />
      <div className="flex flex-wrap gap-3">
        <button type="submit" name="decision" value="accept" disabled={pending} className={buttonClass("primary")}>
          {pending ? "Saving…" : "Accept"}
        </button>
        <button type="submit" name="decision" value="return" disabled={pending} className={buttonClass("secondary")}>
          Return for rework
        </button>
      </div>
    </form>
  );
}
