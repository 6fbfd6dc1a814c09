"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requirePermission } from "@/lib/auth/current-user";
import { emailSchema } from "@/lib/auth/fields";
import { issueInvitation } from "@/lib/auth/invitations";
import { isMailDeliveryError } from "@/lib/enrolment";
import {
  failedFormState,
  formDataOrEmpty,
  invalidFormState,
  readFormValues,
  unexpectedFormState,
  type FormState,
} from "@/lib/http/form-state";

export type InviteField = "email" | "role" | "cohortId";
export type InviteState = FormState<InviteField> | { status: "warning"; message: string };

const inviteSchema = z.object({
  email: emailSchema,
  role: z.enum(["learner", "instructor"], { error: "Choose learner or instructor." }),
  cohortId: z.union([z.literal("").transform(() => null), z.uuid("Choose a cohort from the list.")]),
});

export async function invitePerson(_previous: InviteState, formData: FormData): Promise<InviteState> {
  formData = formDataOrEmpty(formData);
  const admin = await requirePermission("invitations:create", { returnTo: "/admin" });
  const values = readFormValues(formData, ["email", "role", "cohortId"] as const);
  const parsed = inviteSchema.safeParse({ cohortId: "", ...Object.fromEntries(formData) });
  if (!parsed.success) return invalidFormState(parsed.error, values);

  try {
    const result = await issueInvitation({
      schoolId: admin.schoolId,
      email: parsed.data.email,
      role: parsed.data.role,
      cohortId: parsed.data.cohortId,
      inviter: { id: admin.id, name: admin.name },
    });
    if (!result.ok && result.reason === "already-registered") {
      return failedFormState("Someone at your school already has an account with that e-mail address.", values, {
        email: "This address already has an account at your school.",
      });
    }
    if (!result.ok) return failedFormState("That cohort is not part of your school.", values, { cohortId: "Choose a cohort from the list." });
  } catch (error) {
    // Sending is the last step of issuing, so the invitation is already saved.
    if (isMailDeliveryError(error)) {
      console.error(error);
      revalidatePath("/admin");
      return {
        status: "warning",
        message: `The invitation for ${parsed.data.email} is saved, but the e-mail was not sent because the mail server did not answer. Edgewise keeps trying to send it on its own; “Resend” in the list tries again at once.`,
      };
    }
    return unexpectedFormState(error, values);
  }
  revalidatePath("/admin");
  return { status: "success", message: `Invitation sent to ${parsed.data.email}.` };
}
