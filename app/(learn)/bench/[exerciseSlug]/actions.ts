"use server";

import { revalidatePath } from "next/cache";
import { requirePermission } from "@/lib/auth/current-user";
import { benchExercisePath } from "@/lib/bench/exercises";
import { handInBenchWork, openBenchDraft, removeLearnerBenchPhoto } from "@/lib/bench/submissions";
import { describeError } from "@/lib/http/errors";
import { failedFormState, unexpectedFormState, type FormState } from "@/lib/http/form-state";

export type BenchFormState = FormState<string>;

const draftProblems = {
  forbidden: "Only learners hand in bench work.",
  "not-found": "This bench exercise does not exist.",
  "no-cohort": "You are not in a cohort of this course yet, so there is no instructor to review your work. Ask your school's admin to add you.",
  locked: "This work is with your instructor now, so it cannot change.",
} as const;

export type DraftResult = { ok: true; submissionId: string } | { ok: false; message: string };

/** Called by the uploader before the first photo goes up: the draft the photos belong to. */
export async function startBenchDraft(exerciseSlug: string): Promise<DraftResult> {
  const learner = await requirePermission("bench:submit", { returnTo: benchExercisePath(exerciseSlug) });
  try {
    const draft = await openBenchDraft({ learner, exerciseSlug });
    return draft.status === "ready" ? { ok: true, submissionId: draft.submissionId } : { ok: false, message: draftProblems[draft.status] };
  } catch (error) {
    return { ok: false, message: describeError(error).body.error.message };
  }
}

export async function submitBenchWork(exerciseSlug: string, _previous: BenchFormState, formData: FormData): Promise<BenchFormState> {
  const learner = await requirePermission("bench:submit", { returnTo: benchExercisePath(exerciseSlug) });
  const typed = Object.fromEntries([...formData.entries()].filter((e): e is [string, string] => typeof e[1] === "string"));
  try {
    const outcome = await handInBenchWork({ learner, exerciseSlug, formData });
    if (outcome.status === "invalid") return failedFormState("Check the highlighted values.", outcome.entries, outcome.fieldErrors);
    if (outcome.status === "photo-count") {
      return failedFormState("Add at least one photo of the scope screen before you hand the work in.", outcome.entries);
    }
    if (outcome.status !== "submitted") return failedFormState(draftProblems[outcome.status], typed);
  } catch (error) {
    return unexpectedFormState(error, typed);
  }
  revalidatePath(benchExercisePath(exerciseSlug));
  return { status: "success", message: "Handed in. Your instructor has been asked to review it." };
}

export type RemovePhotoResult = { ok: boolean; message: string };

export async function deleteBenchPhoto(exerciseSlug: string, photoId: string): Promise<RemovePhotoResult> {
  const learner = await requirePermission("bench:submit", { returnTo: benchExercisePath(exerciseSlug) });
  try {
    const outcome = await removeLearnerBenchPhoto({ learner, photoId });
    if (outcome.status === "removed") {
      revalidatePath(benchExercisePath(exerciseSlug));
      return { ok: true, message: "Photo removed." };
    }
    return { ok: false, message: outcome.status === "locked" ? draftProblems.locked : "That photo was already removed." };
  } catch (error) {
    return { ok: false, message: describeError(error).body.error.message };
  }
}
