"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { requirePermission } from "@/lib/auth/current-user";
import { reviewBenchWork } from "@/lib/bench/reviews";
import { failedFormState, readFormValues, unexpectedFormState, type FormState } from "@/lib/http/form-state";

export type ReviewFormState = FormState<string>;

const scorePrefix = "score-";

export async function submitReview(submissionId: string, _previous: ReviewFormState, formData: FormData): Promise<ReviewFormState> {
  const reviewer = await requirePermission("bench:review", { returnTo: `/reviews/${submissionId}` });
  const fields = [...new Set([...formData.keys()].filter((key) => key.startsWith(scorePrefix) || key === "feedback"))];
  const values = readFormValues(formData, fields);
  const scores = Object.fromEntries(
    [...formData.entries()].filter(([key]) => key.startsWith(scorePrefix)).map(([key, value]) => [key.slice(scorePrefix.length), value]),
  );
  let emailed: boolean;
  try {
    const outcome = await reviewBenchWork({
      reviewer,
      submissionId,
      input: { scores, feedback: formData.get("feedback"), decision: formData.get("decision") },
    });
    if (outcome.status === "invalid") return failedFormState("Give points for every part of the rubric and write feedback.", values, outcome.fieldErrors);
    if (outcome.status === "not-waiting") return failedFormState("This work has already been reviewed.", values);
    if (outcome.status !== "recorded") return failedFormState("This work is not in one of your cohorts.", values);
    emailed = outcome.emailed;
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  revalidatePath("/reviews");
  redirect(`/reviews?reviewed=${emailed ? "sent" : "unsent"}`);
}
