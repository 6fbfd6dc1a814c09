"use client";

import { useActionState, useState } from "react";
import { buttonClass } from "@/components/ui/button-class";
import type { RosterState } from "@/lib/enrolment/roster-status";
import { rosterEntryAction, type EntryState } from "./entry-actions";
import { StatusNotice } from "./status-notice";

type Intent = "resend" | "revoke" | "deactivate" | "reactivate";

const labels: Record<Intent, { button: string; pending: string; confirm?: string }> = {
  resend: { button: "Resend", pending: "Sending…" },
  revoke: { button: "Revoke", pending: "Revoking…", confirm: "Revoke the link?" },
  deactivate: { button: "Deactivate", pending: "Deactivating…", confirm: "Stop their sign-in?" },
  reactivate: { button: "Reactivate", pending: "Reactivating…" },
};

function intentsFor(state: RosterState, hasInvitation: boolean, hasAccount: boolean): Intent[] {
  switch (state) {
    case "accepted":
      return hasAccount ? ["deactivate"] : [];
    case "deactivated":
      return ["reactivate"];
    case "unsent":
    case "pending":
      return ["resend", "revoke"];
    case "expired":
    case "revoked":
      return hasInvitation ? ["resend"] : [];
    case "not-invited":
      return [];
  }
}

/** The buttons of one line of the cohort list; the two that stop something ask once more. */
export function EntryButtons({
  cohortId,
  state,
  userId,
  invitationId,
  who,
}: {
  cohortId: string | null;
  state: RosterState;
  userId: string | null;
  invitationId: string | null;
  who: string;
}) {
  const [result, formAction, pending] = useActionState<EntryState, FormData>(rosterEntryAction, { status: "idle" });
  const [confirming, setConfirming] = useState<Intent | null>(null);
  const [running, setRunning] = useState<Intent | null>(null);
  const intents = intentsFor(state, invitationId !== null, userId !== null);

  const submitButton = (intent: Intent, variant: "secondary" | "primary" = "secondary") => (
    <button
      type="submit"
      name="intent"
      value={intent}
      disabled={pending}
      onClick={() => {
        setRunning(intent);
        setConfirming(null);
      }}
      aria-label={`${labels[intent].button} ${who}`}
      className={buttonClass(variant, "px-3 py-1.5 text-xs")}
    >
      {pending && running === intent ? labels[intent].pending : labels[intent].button}
    </button>
  );

  return (
    <form action={formAction} className="flex flex-col items-start gap-2 sm:items-end">
      {cohortId ? <input type="hidden" name="cohortId" value={cohortId} /> : null}
      {userId ? <input type="hidden" name="userId" value={userId} /> : null}
      {invitationId ? <input type="hidden" name="invitationId" value={invitationId} /> : null}
      <div className="flex flex-wrap gap-2 sm:justify-end">
        {intents.map((intent) => {
          const confirm = labels[intent].confirm;
          if (!confirm) return <span key={intent}>{submitButton(intent)}</span>;
          if (confirming !== intent) {
            return (
              <button
                key={intent}
                type="button"
                disabled={pending}
                onClick={() => setConfirming(intent)}
                aria-label={`${labels[intent].button} ${who}`}
                className={buttonClass("secondary", "px-3 py-1.5 text-xs")}
              >
                {pending && running === intent ? labels[intent].pending : labels[intent].button}
              </button>
            );
          }
          return (
            <span key={intent} className="flex items-center gap-2 rounded-lg bg-danger-soft px-2 py-1 text-xs text-danger">
              {confirm}
              <button
                type="submit"
                name="intent"
                value={intent}
                onClick={() => {
                  setRunning(intent);
                  setConfirming(null);
                }}
                className="rounded-md bg-danger px-2 py-1 font-semibold text-white"
              >
                Yes, {labels[intent].button.toLowerCase()}
              </button>
              <button type="button" onClick={() => setConfirming(null)} className="rounded-md px-2 py-1 font-medium text-ink-soft">
                Keep
              </button>
            </span>
          );
        })}
      </div>
      <StatusNotice
        tone={result.status === "idle" ? "success" : result.status}
        message={result.status === "idle" ? null : result.message}
        className="max-w-xs text-left sm:text-right"
      />
    </form>
  );
}
