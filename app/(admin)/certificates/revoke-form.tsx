"use client";

import { useActionState, useId } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { buttonClass } from "@/components/ui/button-class";
import { idleFormState } from "@/lib/http/form-state";
import { revokeCertificateAction, type RevokeState } from "./actions";

/** Revoking is final, so the form sits folded away and asks for the reason that will be kept on record. */
export function RevokeForm({ certificateId, learnerName }: { certificateId: string; learnerName: string }) {
  const [state, formAction, pending] = useActionState<RevokeState, FormData>(revokeCertificateAction, idleFormState);
  const id = useId();
  const error = state.status === "error" ? state.fieldErrors.reason : undefined;
  return (
    <details className="group">
      <summary className="cursor-pointer text-sm font-semibold text-danger">Revoke…</summary>
      <form action={formAction} noValidate className="mt-3 space-y-3">
        <FormAlert tone={state.status === "error" ? "error" : "success"} message={state.status === "idle" ? null : state.message} />
        <input type="hidden" name="certificateId" value={certificateId} />
        <div className="space-y-1.5">
          <label htmlFor={`${id}-reason`} className="block text-sm font-medium">
            Reason for revoking {learnerName}&apos;s certificate
          </label>
          <textarea
            id={`${id}-reason`}
            name="reason"
            rows={3}
            required
            minLength={10}
            maxLength={500}
            defaultValue={state.status === "error" ? state.values.reason : undefined}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-error` : `${id}-hint`}
            className={`block w-full rounded-lg border bg-surface px-3 py-2 text-sm outline-none focus:border-accent focus:ring-2 focus:ring-accent/25 ${
              error ? "border-danger" : "border-line-strong"
            }`}
          />
          {error ? (
            <p id={`${id}-error`} className="text-sm font-medium text-danger">
              {error}
            </p>
          ) : (
            <p id={`${id}-hint`} className="text-sm text-ink-faint">
              Kept on record and shown to the learner. The public check page shows only that it was revoked, and when.
            </p>
          )}
        </div>
        <button type="submit" disabled={pending} className={buttonClass("primary", "bg-danger hover:bg-danger")}>
          {pending ? "Revoking…" : "Revoke the certificate"}
        </button>
      </form>
    </details>
  );
}
