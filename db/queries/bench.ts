import { and, asc, count, desc, eq, exists, inArray, sql } from "drizzle-orm";
import { db } from "../client";
import type { Transaction } from "../connection";
import {
  benchPhotos,
  benchReviews,
  benchSubmissions,
  cohortMemberships,
  cohorts,
  users,
  type BenchPhoto,
  type BenchReview,
  type BenchReviewDecision,
  type BenchSubmission,
  type Role,
} from "../schema";

/** Statuses in which the learner may still change the work. */
export const editableBenchStatuses = ["draft", "returned"] as const;

const isEditable = (status: BenchSubmission["status"]) => (editableBenchStatuses as readonly string[]).includes(status);

export async function findBenchSubmissionByExercise(params: {
  learnerId: string;
  exerciseSlug: string;
}): Promise<BenchSubmission | undefined> {
  const [row] = await db
    .select()
    .from(benchSubmissions)
    .where(and(eq(benchSubmissions.learnerId, params.learnerId), eq(benchSubmissions.exerciseSlug, params.exerciseSlug)))
    .limit(1);
  return row;
}

/** The learner's submission for the exercise, created as a draft the first time. */
export async function ensureBenchDraft(params: {
  learnerId: string;
  cohortId: string;
  exerciseSlug: string;
}): Promise<BenchSubmission> {
  await db.insert(benchSubmissions).values(params).onConflictDoNothing({
    target: [benchSubmissions.learnerId, benchSubmissions.exerciseSlug],
  });
  const stored = await findBenchSubmissionByExercise(params);
  if (!stored) throw new Error("a bench draft was inserted but cannot be read back");
  return stored;
}

export async function findBenchSubmissionOfLearner(params: {
  submissionId: string;
  learnerId: string;
}): Promise<BenchSubmission | undefined> {
  const [row] = await db
    .select()
    .from(benchSubmissions)
    .where(and(eq(benchSubmissions.id, params.submissionId), eq(benchSubmissions.learnerId, params.learnerId)))
    .limit(1);
  return row;
}

export async function countBenchPhotos(params: { submissionId: string }): Promise<number> {
  const [row] = await db.select({ value: count() }).from(benchPhotos).where(eq(benchPhotos.submissionId, params.submissionId));
  return row?.value ?? 0;
}

export async function listBenchPhotos(params: { submissionId: string }): Promise<BenchPhoto[]> {
  return db
    .select()
    .from(benchPhotos)
    .where(eq(benchPhotos.submissionId, params.submissionId))
    .orderBy(asc(benchPhotos.createdAt), asc(benchPhotos.id));
}

/** Locks the learner's submission row for the rest of the transaction, so photo counts and status checks hold. */
async function lockSubmissionOfLearner(tx: Transaction, submissionId: string, learnerId: string) {
  const [row] = await tx
    .select()
    .from(benchSubmissions)
    .where(and(eq(benchSubmissions.id, submissionId), eq(benchSubmissions.learnerId, learnerId)))
    .for("update")
    .limit(1);
  return row;
}

async function countPhotosIn(tx: Transaction, submissionId: string): Promise<number> {
  const [row] = await tx.select({ value: count() }).from(benchPhotos).where(eq(benchPhotos.submissionId, submissionId));
  return row?.value ?? 0;
}

export type NewBenchPhoto = Pick<BenchPhoto, "fileKey" | "name" | "size" | "contentType" | "width" | "height">;

export type StoreBenchPhotoResult =
  | { status: "stored"; photo: BenchPhoto }
  | { status: "missing" | "locked" | "full" };

/**
 * Records a checked photo on the learner's editable submission, unless it already holds
 * `maxPhotos`. A repeated report of the same file returns the row stored the first time.
 */
export async function storeBenchPhoto(params: {
  submissionId: string;
  learnerId: string;
  photo: NewBenchPhoto;
  maxPhotos: number;
}): Promise<StoreBenchPhotoResult> {
  return db.transaction(async (tx) => {
    const submission = await lockSubmissionOfLearner(tx, params.submissionId, params.learnerId);
    if (!submission) return { status: "missing" };
    const [known] = await tx.select().from(benchPhotos).where(eq(benchPhotos.fileKey, params.photo.fileKey)).limit(1);
    if (known) return known.submissionId === submission.id ? { status: "stored", photo: known } : { status: "missing" };
    if (!isEditable(submission.status)) return { status: "locked" };
    if ((await countPhotosIn(tx, submission.id)) >= params.maxPhotos) return { status: "full" };
    const [photo] = await tx
      .insert(benchPhotos)
      .values({ submissionId: submission.id, ...params.photo })
      .returning();
    await tx.update(benchSubmissions).set({ updatedAt: new Date() }).where(eq(benchSubmissions.id, submission.id));
    return { status: "stored", photo: photo! };
  });
}

export type RemoveBenchPhotoResult = { status: "removed"; fileKey: string } | { status: "missing" | "locked" };

/** Deletes a photo of the learner's own submission while the work can still be changed. */
export async function removeBenchPhoto(params: { photoId: string; learnerId: string }): Promise<RemoveBenchPhotoResult> {
  return db.transaction(async (tx) => {
    const [photo] = await tx.select().from(benchPhotos).where(eq(benchPhotos.id, params.photoId)).limit(1);
    if (!photo) return { status: "missing" };
    const submission = await lockSubmissionOfLearner(tx, photo.submissionId, params.learnerId);
    if (!submission) return { status: "missing" };
    if (!isEditable(submission.status)) return { status: "locked" };
    await tx.delete(benchPhotos).where(eq(benchPhotos.id, photo.id));
    await tx.update(benchSubmissions).set({ updatedAt: new Date() }).where(eq(benchSubmissions.id, submission.id));
    return { status: "removed", fileKey: photo.fileKey };
  });
}

export type BenchStatedValues = Pick<
  BenchSubmission,
  "cableKind" | "lengthM" | "seriesResistanceOhm" | "driverVoltageV" | "riseTimeS" | "overshootV" | "textAnswers" | "note"
>;

export type SubmitBenchWorkResult =
  | { status: "submitted"; submission: BenchSubmission }
  | { status: "missing" | "locked" }
  | { status: "photo-count"; photos: number };

/** Saves the stated values and hands the work in for review, if it is editable and holds an allowed number of photos. */
export async function submitBenchWork(params: {
  submissionId: string;
  learnerId: string;
  values: BenchStatedValues;
  photoRange: { min: number; max: number };
  now: Date;
}): Promise<SubmitBenchWorkResult> {
  return db.transaction(async (tx) => {
    const submission = await lockSubmissionOfLearner(tx, params.submissionId, params.learnerId);
    if (!submission) return { status: "missing" };
    if (!isEditable(submission.status)) return { status: "locked" };
    const photos = await countPhotosIn(tx, submission.id);
    if (photos < params.photoRange.min || photos > params.photoRange.max) return { status: "photo-count", photos };
    const [updated] = await tx
      .update(benchSubmissions)
      .set({ ...params.values, status: "submitted", submittedAt: params.now, updatedAt: params.now })
      .where(eq(benchSubmissions.id, submission.id))
      .returning();
    return { status: "submitted", submission: updated! };
  });
}

/** True when the user teaches the cohort. Used inside queries so that the check and the read are one statement. */
const teachesCohort = (instructorId: string, cohortId: typeof benchSubmissions.cohortId) =>
  exists(
    db
      .select({ one: sql`1` })
      .from(cohortMemberships)
      .where(
        and(
          eq(cohortMemberships.cohortId, cohortId),
          eq(cohortMemberships.userId, instructorId),
          eq(cohortMemberships.role, "instructor"),
        ),
      ),
  );

/**
 * A photo the viewer may see: their own as a learner, or their cohorts' as an instructor.
 * Anyone else, admins included, gets nothing, exactly as for an id that does not exist.
 */
export async function findBenchPhotoForViewer(params: {
  photoId: string;
  viewer: { id: string; role: Role };
}): Promise<BenchPhoto | undefined> {
  const { viewer } = params;
  const visible =
    viewer.role === "learner"
      ? eq(benchSubmissions.learnerId, viewer.id)
      : viewer.role === "instructor"
        ? teachesCohort(viewer.id, benchSubmissions.cohortId)
        : undefined;
  if (!visible) return undefined;
  const [row] = await db
    .select({ photo: benchPhotos })
    .from(benchPhotos)
    .innerJoin(benchSubmissions, eq(benchSubmissions.id, benchPhotos.submissionId))
    .where(and(eq(benchPhotos.id, params.photoId), visible))
    .limit(1);
  return row?.photo;
}

export type BenchQueueEntry = {
  submissionId: string;
  exerciseSlug: string;
  learnerName: string;
  cohortName: string;
  submittedAt: Date;
  photoCount: number;
  reviewCount: number;
};

/** Work waiting for review in the instructor's cohorts, longest waiting first. */
export async function listBenchReviewQueue(params: { instructorId: string }): Promise<BenchQueueEntry[]> {
  const taught = db
    .select({ cohortId: cohortMemberships.cohortId })
    .from(cohortMemberships)
    .where(and(eq(cohortMemberships.userId, params.instructorId), eq(cohortMemberships.role, "instructor")));
  const rows = await db
    .select({
      submissionId: benchSubmissions.id,
      exerciseSlug: benchSubmissions.exerciseSlug,
      learnerName: users.name,
      cohortName: cohorts.name,
      submittedAt: benchSubmissions.submittedAt,
      photoCount: sql<number>`(select count(*)::int from ${benchPhotos} p where p.submission_id = ${benchSubmissions.id})`,
      reviewCount: sql<number>`(select count(*)::int from ${benchReviews} r where r.submission_id = ${benchSubmissions.id})`,
    })
    .from(benchSubmissions)
    .innerJoin(users, eq(users.id, benchSubmissions.learnerId))
    .innerJoin(cohorts, eq(cohorts.id, benchSubmissions.cohortId))
    .where(and(eq(benchSubmissions.status, "submitted"), inArray(benchSubmissions.cohortId, taught)))
    .orderBy(asc(benchSubmissions.submittedAt), asc(benchSubmissions.id));
  return rows.map((row) => ({ ...row, submittedAt: row.submittedAt ?? new Date(0) }));
}

export type BenchSubmissionForReview = BenchSubmission & {
  learnerName: string;
  learnerEmail: string;
  cohortName: string;
};

/** The submission, only when the instructor teaches its cohort. */
export async function findBenchSubmissionForReviewer(params: {
  submissionId: string;
  instructorId: string;
}): Promise<BenchSubmissionForReview | undefined> {
  const [row] = await db
    .select({ submission: benchSubmissions, learnerName: users.name, learnerEmail: users.email, cohortName: cohorts.name })
    .from(benchSubmissions)
    .innerJoin(users, eq(users.id, benchSubmissions.learnerId))
    .innerJoin(cohorts, eq(cohorts.id, benchSubmissions.cohortId))
    .where(and(eq(benchSubmissions.id, params.submissionId), teachesCohort(params.instructorId, benchSubmissions.cohortId)))
    .limit(1);
  return row && { ...row.submission, learnerName: row.learnerName, learnerEmail: row.learnerEmail, cohortName: row.cohortName };
}

export type BenchReviewWithReviewer = BenchReview & { reviewerName: string };

/** Reviews of a submission, newest first. */
export async function listBenchReviews(params: { submissionId: string }): Promise<BenchReviewWithReviewer[]> {
  const rows = await db
    .select({ review: benchReviews, reviewerName: users.name })
    .from(benchReviews)
    .innerJoin(users, eq(users.id, benchReviews.reviewerId))
    .where(eq(benchReviews.submissionId, params.submissionId))
    .orderBy(desc(benchReviews.createdAt), desc(benchReviews.id));
  return rows.map((row) => ({ ...row.review, reviewerName: row.reviewerName }));
}

export type RecordBenchReviewResult =
  | { status: "recorded"; review: BenchReview; submission: BenchSubmissionForReview }
  | { status: "missing" | "not-waiting" };

/**
 * Stores a review of work waiting for it and moves the work to accepted or returned, in one
 * transaction; the row lock makes two instructors reviewing at once record one review.
 */
export async function recordBenchReview(params: {
  submissionId: string;
  reviewerId: string;
  scores: Record<string, number>;
  total: number;
  maxTotal: number;
  feedback: string;
  decision: BenchReviewDecision;
  now: Date;
}): Promise<RecordBenchReviewResult> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ submission: benchSubmissions, learnerName: users.name, learnerEmail: users.email, cohortName: cohorts.name })
      .from(benchSubmissions)
      .innerJoin(users, eq(users.id, benchSubmissions.learnerId))
      .innerJoin(cohorts, eq(cohorts.id, benchSubmissions.cohortId))
      .where(and(eq(benchSubmissions.id, params.submissionId), teachesCohort(params.reviewerId, benchSubmissions.cohortId)))
      .for("update", { of: benchSubmissions })
      .limit(1);
    if (!row) return { status: "missing" };
    if (row.submission.status !== "submitted") return { status: "not-waiting" };
    const [review] = await tx
      .insert(benchReviews)
      .values({
        submissionId: params.submissionId,
        reviewerId: params.reviewerId,
        scores: params.scores,
        total: params.total,
        maxTotal: params.maxTotal,
        feedback: params.feedback,
        decision: params.decision,
        createdAt: params.now,
      })
      .returning();
    const [submission] = await tx
      .update(benchSubmissions)
      .set({ status: params.decision === "accept" ? "accepted" : "returned", updatedAt: params.now })
      .where(eq(benchSubmissions.id, params.submissionId))
      .returning();
    return {
      status: "recorded",
      review: review!,
      submission: { ...submission!, learnerName: row.learnerName, learnerEmail: row.learnerEmail, cohortName: row.cohortName },
    };
  });
}
