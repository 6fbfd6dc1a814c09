"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requirePermission } from "@/lib/auth/current-user";
import { emailSchema, personNameSchema } from "@/lib/auth/fields";
import { describeUnsent, enrolLearner, resendWaitingInvitations, type EnrolLearnerResult } from "@/lib/enrolment";
import { describeError } from "@/lib/http/errors";
import type { EntryState } from "../../entry-actions";
import { failedFormState, formDataOrEmpty, invalidFormState, readFormValues, unexpectedFormState, type FormState } from "@/lib/http/form-state";

/** A result that is not an error but that the admin must read: the e-mail did not go out. */
type Warning = { status: "warning"; message: string };

export type EnrolField = "cohortId" | "name" | "email";
export type EnrolState = FormState<EnrolField> | Warning;

const enrolSchema = z.object({ cohortId: z.uuid("This cohort is not part of your school."), name: personNameSchema, email: emailSchema });

const enrolRefusals: Record<Exclude<EnrolLearnerResult, { ok: true }>["reason"], { message: string; field?: EnrolField }> = {
  "unknown-cohort": { message: "This cohort is not part of your school." },
  "already-in-cohort": { message: "This person is already in this cohort.", field: "email" },
  "not-a-learner": { message: "This address belongs to an instructor or admin of your school.", field: "email" },
  "enrolled-meanwhile": { message: "Someone at your school enrolled this address a moment ago; reload the page to see where.", field: "email" },
  "already-invited": { message: "This address already has an open invitation to your school; resend it from the school page.", field: "email" },
};

function cohortPath(cohortId: string): string {
  return `/admin/cohorts/${cohortId}`;
}

export async function enrolLearnerAction(_previous: EnrolState, formData: FormData): Promise<EnrolState> {
  formData = formDataOrEmpty(formData);
  const admin = await requirePermission("learners:manage", { returnTo: "/admin" });
  const values = readFormValues(formData, ["cohortId", "name", "email"] as const);
  const parsed = enrolSchema.safeParse(Object.fromEntries(formData));
  if (!parsed.success) return invalidFormState(parsed.error, values);

  let result: EnrolLearnerResult;
  try {
    result = await enrolLearner({ actor: admin, ...parsed.data });
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  if (!result.ok) {
    const refusal = enrolRefusals[result.reason];
    return failedFormState(refusal.message, values, refusal.field ? { [refusal.field]: refusal.message } : {});
  }
  revalidatePath(cohortPath(parsed.data.cohortId));
  revalidatePath("/admin");
  if (result.outcome === "added-existing") {
    return { status: "success", message: `${parsed.data.email} already had an account at your school and is now in this cohort.` };
  }
  const unsent = describeUnsent(result.letters);
  if (unsent) return { status: "warning", message: `${parsed.data.name} is enrolled. ${unsent}` };
  return { status: "success", message: `${parsed.data.name} is enrolled and an invitation was sent to ${parsed.data.email}.` };
}

export async function resendWaitingAction(_previous: EntryState, formData: FormData): Promise<EntryState> {
  formData = formDataOrEmpty(formData);
  const admin = await requirePermission("learners:manage", { returnTo: "/admin" });
  const cohortId = z.uuid().safeParse(formData.get("cohortId"));
  if (!cohortId.success) return { status: "error", message: "This cohort is not part of your school." };
  try {
    const result = await resendWaitingInvitations({ actor: admin, cohortId: cohortId.data });
    if (!result.ok) return { status: "error", message: "This cohort is not part of your school." };
    revalidatePath(cohortPath(cohortId.data));
    if (result.reissued === 0) return { status: "success", message: "Nobody in this cohort is waiting for an invitation." };
    const unsent = describeUnsent(result.letters);
    if (unsent) return { status: "warning", message: `${result.reissued} new links are saved. ${unsent}` };
    return { status: "success", message: `New links sent to ${result.reissued} ${result.reissued === 1 ? "person" : "people"}; their old links no longer work.` };
  } catch (error) {
    return { status: "error", message: describeError(error).body.error.message };
  }
}
