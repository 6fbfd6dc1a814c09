import "server-only";
import { z } from "zod";
import { findBenchSubmissionForReviewer, recordBenchReview } from "@/db/queries/bench";
import type { BenchExercise } from "@/lessons";
import { hasPermission } from "@/lib/auth/permissions";
import type { SessionUser } from "@/lib/auth/session-store";
import { readAppEnv } from "@/lib/env";
import { checkCertificateAfterCourseWork } from "@/lib/certificates";
import { sendReviewDoneEmail } from "@/lib/mail/review-done";
import { benchExercisePath, findBenchExercise, rubricMaximum } from "./exercises";

export const maxFeedbackLength = 4000;

export const scoreFieldName = (criterionId: string) => `score-${criterionId}`;

function reviewSchema(exercise: BenchExercise) {
  const scores: Record<string, z.ZodType<number>> = {};
  for (const criterion of exercise.rubric) {
    scores[criterion.id] = z.coerce
      .number({ error: `Give 0 to ${criterion.points} points.` })
      .int(`Give a whole number of points, 0 to ${criterion.points}.`)
      .min(0, `Give 0 to ${criterion.points} points.`)
      .max(criterion.points, `At most ${criterion.points} points here.`);
  }
  return z.object({
    scores: z.object(scores),
    feedback: z
      .string({ error: "Write feedback for the learner." })
      .trim()
      .min(1, "Write feedback for the learner: what was good, and what to change.")
      .max(maxFeedbackLength, `Keep the feedback under ${maxFeedbackLength} characters.`),
    decision: z.enum(["accept", "return"], { error: "Choose accept or return." }),
  });
}

export type ReviewInput = { scores: Record<string, unknown>; feedback: unknown; decision: unknown };

export type ReviewOutcome =
  | { status: "recorded"; decision: "accept" | "return"; total: number; maxTotal: number; emailed: boolean }
  | { status: "forbidden" | "not-found" | "not-waiting" }
  | { status: "invalid"; fieldErrors: Record<string, string> };

/**
 * An instructor's review of work waiting in one of their cohorts: stored with the work's new
 * status, then the learner is e-mailed a link to the exercise page. Work outside the reviewer's
 * cohorts is "not-found", as if it did not exist. A mail failure does not undo the review.
 */
export async function reviewBenchWork(params: {
  reviewer: SessionUser;
  submissionId: string;
  input: ReviewInput;
  now?: Date;
}): Promise<ReviewOutcome> {
  const { reviewer } = params;
  if (!hasPermission(reviewer.role, "bench:review")) return { status: "forbidden" };
  if (!z.uuid().safeParse(params.submissionId).success) return { status: "not-found" };
  const submission = await findBenchSubmissionForReviewer({ submissionId: params.submissionId, instructorId: reviewer.id });
  const entry = submission && findBenchExercise(submission.exerciseSlug);
  if (!submission || !entry) return { status: "not-found" };

  const parsed = reviewSchema(entry.exercise).safeParse(params.input);
  if (!parsed.success) {
    const fieldErrors: Record<string, string> = {};
    for (const issue of parsed.error.issues) {
      const [first, second] = issue.path.map(String);
      const field = first === "scores" && second ? scoreFieldName(second) : (first ?? "");
      fieldErrors[field] ??= issue.message;
    }
    return { status: "invalid", fieldErrors };
  }
  const { scores, feedback, decision } = parsed.data;
  const total = Object.values(scores).reduce((sum, points) => sum + points, 0);
  const maxTotal = rubricMaximum(entry.exercise);
  const recorded = await recordBenchReview({
    submissionId: submission.id,
    reviewerId: reviewer.id,
    scores,
    total,
    maxTotal,
    feedback,
    decision,
    now: params.now ?? new Date(),
  });
  if (recorded.status !== "recorded") return { status: recorded.status === "missing" ? "not-found" : "not-waiting" };
  if (decision === "accept") await checkCertificateAfterCourseWork({ userId: recorded.submission.learnerId });

  const emailed = await sendReviewDoneEmail({
    // The work was found in one of the reviewer's cohorts, so the learner is of the reviewer's school.
    schoolId: reviewer.schoolId,
    to: recorded.submission.learnerEmail,
    learnerName: recorded.submission.learnerName,
    exerciseTitle: entry.exercise.title,
    reviewerName: reviewer.name,
    decision,
    total,
    maxTotal,
    exerciseUrl: `${readAppEnv().APP_URL}${benchExercisePath(entry.exercise.slug)}`,
  }).then(
    () => true,
    (error: unknown) => {
      console.error(`Could not e-mail the review of bench submission ${submission.id}`, error);
      return false;
    },
  );
  return { status: "recorded", decision, total, maxTotal, emailed };
}
