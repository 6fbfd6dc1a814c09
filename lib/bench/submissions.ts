import "server-only";
import {
  ensureBenchDraft,
  findBenchSubmissionByExercise,
  removeBenchPhoto,
  submitBenchWork,
} from "@/db/queries/bench";
import { findLearnerCohortId } from "@/db/queries/cohorts";
import { hasPermission } from "@/lib/auth/permissions";
import type { SessionUser } from "@/lib/auth/session-store";
import { deleteStoredFiles } from "@/lib/uploads/stored-files";
import { isBenchExerciseOpen } from "./exercise-lock";
import { findBenchExercise } from "./exercises";
import { benchPhotoLimits } from "./photo-limits";
import { parseBenchForm } from "./submission-form";

export type DraftOutcome =
  | { status: "ready"; submissionId: string }
  | { status: "forbidden" | "not-found" | "no-cohort" | "locked" | "lesson-locked" };

/**
 * The learner's editable submission for the exercise, created as a draft when they start on it;
 * refused while the exercise's lesson is still locked to them.
 */
export async function openBenchDraft(params: { learner: SessionUser; exerciseSlug: string }): Promise<DraftOutcome> {
  const { learner } = params;
  if (!hasPermission(learner.role, "bench:submit")) return { status: "forbidden" };
  const entry = findBenchExercise(params.exerciseSlug);
  if (!entry) return { status: "not-found" };
  if (!(await isBenchExerciseOpen({ userId: learner.id, exerciseSlug: entry.exercise.slug }))) return { status: "lesson-locked" };
  const existing = await findBenchSubmissionByExercise({ learnerId: learner.id, exerciseSlug: entry.exercise.slug });
  if (existing) {
    return existing.status === "draft" || existing.status === "returned"
      ? { status: "ready", submissionId: existing.id }
      : { status: "locked" };
  }
  const cohortId = await findLearnerCohortId({ userId: learner.id, courseSlug: entry.courseSlug });
  if (!cohortId) return { status: "no-cohort" };
  const draft = await ensureBenchDraft({ learnerId: learner.id, cohortId, exerciseSlug: entry.exercise.slug });
  return { status: "ready", submissionId: draft.id };
}

export type HandInOutcome =
  | { status: "submitted" }
  | { status: "invalid"; fieldErrors: Record<string, string>; entries: Record<string, string> }
  | { status: "photo-count"; photos: number; entries: Record<string, string> }
  | { status: "forbidden" | "not-found" | "no-cohort" | "locked" | "lesson-locked" };

/** Validates the form and hands the work in for review, with its photos as they are now. */
export async function handInBenchWork(params: {
  learner: SessionUser;
  exerciseSlug: string;
  formData: FormData;
  now?: Date;
}): Promise<HandInOutcome> {
  const draft = await openBenchDraft(params);
  if (draft.status !== "ready") return draft;
  const entry = findBenchExercise(params.exerciseSlug)!;
  const form = parseBenchForm(entry.exercise, params.formData);
  if (!form.ok) return { status: "invalid", fieldErrors: form.fieldErrors, entries: form.entries };
  const result = await submitBenchWork({
    submissionId: draft.submissionId,
    learnerId: params.learner.id,
    values: form.values,
    photoRange: { min: entry.exercise.photo.required ? benchPhotoLimits.minPhotos : 0, max: benchPhotoLimits.maxPhotos },
    now: params.now ?? new Date(),
  });
  if (result.status === "photo-count") {
    const entries = Object.fromEntries([...params.formData.entries()].filter((e): e is [string, string] => typeof e[1] === "string"));
    return { status: "photo-count", photos: result.photos, entries };
  }
  if (result.status === "missing") return { status: "not-found" };
  return result.status === "locked" ? { status: "locked" } : { status: "submitted" };
}

export type RemovePhotoOutcome = { status: "removed" | "forbidden" | "not-found" | "locked" };

/** Takes a photo off the learner's editable work, then deletes the stored file. */
export async function removeLearnerBenchPhoto(params: { learner: SessionUser; photoId: string }): Promise<RemovePhotoOutcome> {
  if (!hasPermission(params.learner.role, "bench:submit")) return { status: "forbidden" };
  const removed = await removeBenchPhoto({ photoId: params.photoId, learnerId: params.learner.id });
  if (removed.status !== "removed") return { status: removed.status === "missing" ? "not-found" : "locked" };
  // The row is gone first, so a file that fails to delete is unreachable, never a dangling row.
  await deleteStoredFiles([removed.fileKey]).catch((error: unknown) =>
    console.error(`Could not delete the stored file of removed bench photo ${params.photoId}`, error),
  );
  return { status: "removed" };
}
