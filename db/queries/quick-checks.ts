import { and, desc, eq, sql } from "drizzle-orm";
import { db } from "../client";
import { quickCheckAnswers } from "../schema";

export async function recordQuickCheckAnswer(params: {
  userId: string;
  lessonSlug: string;
  checkId: string;
  entry: string;
  value: number | null;
  correct: boolean;
}): Promise<void> {
  await db.insert(quickCheckAnswers).values(params);
}

export type QuickCheckState = {
  checkId: string;
  answers: number;
  lastEntry: string;
  /** The most recent entry that was right, when there is one. */
  correctEntry: string | null;
};

/** Per check of one lesson: how often the learner answered, what they typed last, and their latest right answer. */
export async function listQuickCheckStatesByLesson(params: { userId: string; lessonSlug: string }): Promise<QuickCheckState[]> {
  const rows = await db
    .select({ checkId: quickCheckAnswers.checkId, entry: quickCheckAnswers.entry, correct: quickCheckAnswers.correct })
    .from(quickCheckAnswers)
    .where(and(eq(quickCheckAnswers.userId, params.userId), eq(quickCheckAnswers.lessonSlug, params.lessonSlug)))
    .orderBy(desc(quickCheckAnswers.createdAt), desc(quickCheckAnswers.id));
  const states = new Map<string, QuickCheckState>();
  for (const row of rows) {
    const state = states.get(row.checkId) ?? { checkId: row.checkId, answers: 0, lastEntry: row.entry, correctEntry: null };
    state.answers += 1;
    if (row.correct && state.correctEntry === null) state.correctEntry = row.entry;
    states.set(row.checkId, state);
  }
  return [...states.values()];
}

const asDate = (value: string | Date | null) => (value === null ? null : new Date(value));

export type QuickCheckResult = { lessonSlug: string; checkId: string; answers: number; firstCorrectAt: Date | null };

/** Every check the learner has answered, across the course. */
export async function listQuickCheckResultsByLearner(params: { userId: string }): Promise<QuickCheckResult[]> {
  return db
    .select({
      lessonSlug: quickCheckAnswers.lessonSlug,
      checkId: quickCheckAnswers.checkId,
      answers: sql<number>`count(*)::int`,
      firstCorrectAt: sql<Date | null>`min(${quickCheckAnswers.createdAt}) filter (where ${quickCheckAnswers.correct})`.mapWith(asDate),
    })
    .from(quickCheckAnswers)
    .where(eq(quickCheckAnswers.userId, params.userId))
    .groupBy(quickCheckAnswers.lessonSlug, quickCheckAnswers.checkId);
}
