"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requirePermission } from "@/lib/auth/current-user";
import { deactivateLearner, describeUnsent, reactivateLearner, resendInvitation, revokeInvitationLink } from "@/lib/enrolment";
import { describeError } from "@/lib/http/errors";
import { formDataOrEmpty } from "@/lib/http/form-state";

export type EntryState = { status: "idle" } | { status: "success" | "warning" | "error"; message: string };

const entrySchema = z.discriminatedUnion("intent", [
  z.object({ intent: z.enum(["resend", "revoke"]), cohortId: z.uuid().optional(), invitationId: z.uuid() }),
  z.object({ intent: z.enum(["deactivate", "reactivate"]), cohortId: z.uuid().optional(), userId: z.uuid() }),
]);

async function runEntryAction(admin: { id: string; schoolId: string; name: string }, entry: z.infer<typeof entrySchema>): Promise<EntryState> {
  switch (entry.intent) {
    case "resend": {
      const result = await resendInvitation({ actor: admin, invitationId: entry.invitationId });
      if (!result.ok) {
        return { status: "error", message: result.reason === "accepted" ? "This invitation was already accepted." : "This invitation is not part of your school." };
      }
      const unsent = describeUnsent(result.letters);
      return unsent
        ? { status: "warning", message: `A new link is saved and the old one no longer works. ${unsent}` }
        : { status: "success", message: "A new link was sent; the old one no longer works." };
    }
    case "revoke":
      return (await revokeInvitationLink({ actor: admin, invitationId: entry.invitationId }))
        ? { status: "success", message: "Invitation revoked: its link no longer works." }
        : { status: "error", message: "This invitation is no longer open." };
    case "deactivate": {
      const result = await deactivateLearner({ actor: admin, userId: entry.userId });
      return result === "done"
        ? { status: "success", message: "Deactivated: they can no longer sign in. Their work is kept." }
        : { status: "error", message: "This learner is not part of your school." };
    }
    case "reactivate": {
      const result = await reactivateLearner({ actor: admin, userId: entry.userId });
      if (result === "awaiting") return { status: "error", message: "They never accepted their invitation: resend it instead." };
      return result === "done"
        ? { status: "success", message: "Reactivated: they can sign in again." }
        : { status: "error", message: "This learner is not part of your school." };
    }
  }
}

/** Resend, revoke, deactivate or reactivate one line of a list (a cohort's, or the school's open invitations). */
export async function rosterEntryAction(_previous: EntryState, formData: FormData): Promise<EntryState> {
  formData = formDataOrEmpty(formData);
  const admin = await requirePermission("learners:manage", { returnTo: "/admin" });
  const parsed = entrySchema.safeParse({ ...Object.fromEntries(formData), cohortId: formData.get("cohortId") || undefined });
  if (!parsed.success) return { status: "error", message: "That request could not be read. Reload the page and try again." };
  try {
    const state = await runEntryAction(admin, parsed.data);
    if (parsed.data.cohortId) revalidatePath(`/admin/cohorts/${parsed.data.cohortId}`);
    revalidatePath("/admin");
    return state;
  } catch (error) {
    return { status: "error", message: describeError(error).body.error.message };
  }
}

