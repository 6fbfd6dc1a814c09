import { eq, isNull, sql } from "drizzle-orm";
import { db } from "../client";
import { benchSubmissions, labAttempts, lessonProgress } from "../schema";

export type LabResult = { labSlug: string; attempts: number; bestScore: number; bestPassingScore: number | null; firstPassedAt: Date | null };

const asDate = (value: string | Date | null) => (value === null ? null : new Date(value));

/** Per lab the learner has tried: attempts, best score (overall and among passes) and when it was first passed. */
export async function listLabResultsByLearner(params: { userId: string }): Promise<LabResult[]> {
  return db
    .select({
      labSlug: labAttempts.labSlug,
      attempts: sql<number>`count(*)::int`,
      bestScore: sql<number>`max(${labAttempts.score})::int`,
      bestPassingScore: sql<number | null>`(max(${labAttempts.score}) filter (where ${labAttempts.passed}))::int`,
      firstPassedAt: sql<Date | null>`min(${labAttempts.createdAt}) filter (where ${labAttempts.passed})`.mapWith(asDate),
    })
    .from(labAttempts)
    .where(eq(labAttempts.userId, params.userId))
    .groupBy(labAttempts.labSlug);
}

export async function listLessonProgressByLearner(params: { userId: string }) {
  return db
    .select({ lessonSlug: lessonProgress.lessonSlug, startedAt: lessonProgress.startedAt, completedAt: lessonProgress.completedAt })
    .from(lessonProgress)
    .where(eq(lessonProgress.userId, params.userId));
}

/** The first time the learner opens a lesson; later visits leave the row as it is. */
export async function markLessonStarted(params: { userId: string; lessonSlug: string }): Promise<void> {
  await db.insert(lessonProgress).values(params).onConflictDoNothing();
}

/**
 * Stamps lessons that have become done. A lesson finished without ever being opened (its lab
 * passed from the workbench first) gets a row whose start is its completion. An existing
 * completion is never moved.
 */
export async function markLessonsCompleted(params: { userId: string; completions: { lessonSlug: string; completedAt: Date }[] }) {
  for (const { lessonSlug, completedAt } of params.completions) {
    await db
      .insert(lessonProgress)
      .values({ userId: params.userId, lessonSlug, startedAt: completedAt, completedAt })
      .onConflictDoUpdate({
        target: [lessonProgress.userId, lessonProgress.lessonSlug],
        set: { completedAt },
        setWhere: isNull(lessonProgress.completedAt),
      });
  }
}

/** The status of each bench exercise the learner has started on. */
export async function listBenchStatusesByLearner(params: { userId: string }) {
  return db
    .select({ exerciseSlug: benchSubmissions.exerciseSlug, status: benchSubmissions.status })
    .from(benchSubmissions)
    .where(eq(benchSubmissions.learnerId, params.userId));
}
