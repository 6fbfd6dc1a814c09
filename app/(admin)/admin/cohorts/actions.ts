"use server";

import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { createCohort, updateCohort, type SaveCohortResult } from "@/db/queries/admin-cohorts";
import { requirePermission } from "@/lib/auth/current-user";
import { cohortInputSchema } from "@/lib/enrolment";
import { failedFormState, formDataOrEmpty, invalidFormState, readFormValues, unexpectedFormState, type FormState } from "@/lib/http/form-state";

export type CohortField = "name" | "courseSlug" | "startsOn" | "endsOn" | "instructorIds";
export type CohortFormState = FormState<CohortField>;

const cohortIdSchema = z.union([z.literal(""), z.uuid()]);

/** Creates a cohort (no id) or saves an existing one of the admin's school, then opens it. */
export async function saveCohortAction(_previous: CohortFormState, formData: FormData): Promise<CohortFormState> {
  formData = formDataOrEmpty(formData);
  const admin = await requirePermission("cohorts:manage", { returnTo: "/admin" });
  const instructorIds = formData.getAll("instructorIds").map(String);
  const values = { ...readFormValues(formData, ["name", "courseSlug", "startsOn", "endsOn"] as const), instructorIds: instructorIds.join(",") };
  const cohortId = cohortIdSchema.safeParse(formData.get("cohortId") ?? "");
  if (!cohortId.success) return failedFormState("This cohort is not part of your school.", values);
  const parsed = cohortInputSchema.safeParse({ ...Object.fromEntries(formData), instructorIds });
  if (!parsed.success) return invalidFormState(parsed.error, values);

  const { instructorIds: chosen, ...fields } = parsed.data;
  let result: SaveCohortResult;
  try {
    result = cohortId.data
      ? await updateCohort({ schoolId: admin.schoolId, cohortId: cohortId.data, fields, instructorIds: chosen })
      : await createCohort({ schoolId: admin.schoolId, fields, instructorIds: chosen });
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  if (!result.ok && result.reason === "name-taken") {
    return failedFormState("Another cohort at your school already has this name.", values, {
      name: "Choose a name no other cohort of your school uses.",
    });
  }
  if (!result.ok && result.reason === "unknown-instructor") {
    return failedFormState("One of the chosen instructors is not an instructor at your school.", values, {
      instructorIds: "Choose instructors from the list.",
    });
  }
  if (!result.ok) return failedFormState("This cohort is not part of your school.", values);

  revalidatePath("/admin");
  revalidatePath(`/admin/cohorts/${result.cohortId}`);
  redirect(`/admin/cohorts/${result.cohortId}?notice=${cohortId.data ? "saved" : "created"}`);
}
