"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { z } from "zod";
import { requirePermission } from "@/lib/auth/current-user";
import { reviewBenchWork } from "@/lib/bench/reviews";
import { failedFormState, formDataOrEmpty, readFormValues, unexpectedFormState, type FormState } from "@/lib/http/form-state";

export type ReviewFormState = FormState<string>;

const scorePrefix = "score-";
const notInYourCohorts = "This work is not in one of your cohorts.";

export async function submitReview(sentSubmissionId: string, _previous: ReviewFormState, formData: FormData): Promise<ReviewFormState> {
  // Bound in the page, but sent back by the browser: anyone may send anything in its place.
  const submissionId = z.uuid().catch("").parse(sentSubmissionId);
  const reviewer = await requirePermission("bench:review", { returnTo: submissionId ? `/reviews/${submissionId}` : "/reviews" });
  formData = formDataOrEmpty(formData);
  const fields = [...new Set([...formData.keys()].filter((key) => key.startsWith(scorePrefix) || key === "feedback"))];
  const values = readFormValues(formData, fields);
  const scores = Object.fromEntries(
    [...formData.entries()].filter(([key]) => key.startsWith(scorePrefix)).map(([key, value]) => [key.slice(scorePrefix.length), value]),
  );
  if (!submissionId) return failedFormState(notInYourCohorts, values);
  let emailed: boolean;
  try {
    const outcome = await reviewBenchWork({
      reviewer,
      submissionId,
      input: { scores, feedback: formData.get("feedback"), decision: formData.get("decision") },
    });
    if (outcome.status === "invalid") return failedFormState("Give points for every part of the rubric and write feedback.", values, outcome.fieldErrors);
    if (outcome.status === "not-waiting") return failedFormState("This work has already been reviewed.", values);
    if (outcome.status !== "recorded") return failedFormState(notInYourCohorts, values);
    emailed = outcome.emailed;
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  revalidatePath("/reviews");
  redirect(`/reviews?reviewed=${emailed ? "sent" : "unsent"}`);
}
