"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requirePermission } from "@/lib/auth/current-user";
import { benchExercisePath } from "@/lib/bench/exercises";
import { handInBenchWork, openBenchDraft, removeLearnerBenchPhoto } from "@/lib/bench/submissions";
import { describeError } from "@/lib/http/errors";
import { failedFormState, formDataOrEmpty, unexpectedFormState, type FormState } from "@/lib/http/form-state";

export type BenchFormState = FormState<string>;

const draftProblems = {
  forbidden: "Only learners hand in bench work.",
  "not-found": "This bench exercise does not exist.",
  "no-cohort": "You are not in a cohort of this course yet, so there is no instructor to review your work. Ask your school's admin to add you.",
  locked: "This work is with your instructor now, so it cannot change.",
  "lesson-locked": "This bench exercise opens with its lesson. Finish the lessons before it first.",
} as const;

// Bound arguments come from the browser like form fields do: anyone may send anything in their place.
// An exercise name that is not text reads as no exercise; a photo id that is not a UUID names no photo.
const readExerciseSlug = (value: unknown): string => z.string().max(200).catch("").parse(value);
const readPhotoId = (value: unknown): string | null => z.uuid().nullable().catch(null).parse(value);

export type DraftResult = { ok: true; submissionId: string } | { ok: false; message: string };

/** Called by the uploader before the first photo goes up: the draft the photos belong to. */
export async function startBenchDraft(sentSlug: string): Promise<DraftResult> {
  const exerciseSlug = readExerciseSlug(sentSlug);
  const learner = await requirePermission("bench:submit", { returnTo: benchExercisePath(exerciseSlug) });
  try {
    const draft = await openBenchDraft({ learner, exerciseSlug });
    return draft.status === "ready" ? { ok: true, submissionId: draft.submissionId } : { ok: false, message: draftProblems[draft.status] };
  } catch (error) {
    return { ok: false, message: describeError(error).body.error.message };
  }
}

export async function submitBenchWork(sentSlug: string, _previous: BenchFormState, formData: FormData): Promise<BenchFormState> {
  const exerciseSlug = readExerciseSlug(sentSlug);
  formData = formDataOrEmpty(formData);
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

const alreadyRemoved = "That photo was already removed.";

export async function deleteBenchPhoto(sentSlug: string, sentPhotoId: string): Promise<RemovePhotoResult> {
  const exerciseSlug = readExerciseSlug(sentSlug);
  const learner = await requirePermission("bench:submit", { returnTo: benchExercisePath(exerciseSlug) });
  const photoId = readPhotoId(sentPhotoId);
  if (!photoId) return { ok: false, message: alreadyRemoved };
  try {
    const outcome = await removeLearnerBenchPhoto({ learner, photoId });
    if (outcome.status === "removed") {
      revalidatePath(benchExercisePath(exerciseSlug));
      return { ok: true, message: "Photo removed." };
    }
    return { ok: false, message: outcome.status === "locked" ? draftProblems.locked : alreadyRemoved };
  } catch (error) {
    return { ok: false, message: describeError(error).body.error.message };
  }
}
