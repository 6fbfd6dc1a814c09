"use client";

import { useActionState } from "react";
import { buttonClass } from "@/components/ui/button-class";
import { StatusNotice } from "../../status-notice";
import type { EntryState } from "../../entry-actions";
import { resendWaitingAction } from "./actions";

/** New links for everyone still waiting; what to press after the mail server was down. */
export function ResendWaitingButton({ cohortId, waiting }: { cohortId: string; waiting: number }) {
  const [state, formAction, pending] = useActionState<EntryState, FormData>(resendWaitingAction, { status: "idle" });
  return (
    <form action={formAction} className="space-y-2">
      <input type="hidden" name="cohortId" value={cohortId} />
      <button type="submit" disabled={pending || waiting === 0} className={buttonClass("secondary")}>
        {pending ? "Sending new links…" : `Resend all waiting (${waiting})`}
      </button>
      <StatusNotice tone={state.status === "idle" ? "success" : state.status} message={state.status === "idle" ? null : state.message} />
    </form>
  );
}
