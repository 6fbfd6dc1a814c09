import { and, desc, eq, lt, max, sql } from "drizzle-orm";
import { db } from "../client";
import { labAttempts, type LabAttempt } from "../schema";

export type AttemptScore = { outcome: unknown; score: number; passed: boolean };

/** "replayed": the key was seen before for this lab; "key-taken": it was used for another lab. */
export type RecordedAttempt = { status: "created" | "replayed" | "key-taken"; attempt: LabAttempt };

/**
 * Stores a graded attempt as the learner's next attempt at the lab, once per idempotency key.
 * The score depends on the attempt's number (later attempts carry a penalty), so `score` is
 * called inside the transaction once the number is known. Attempts of one learner at one lab
 * are numbered under a transaction-scoped advisory lock, so two submissions at once cannot
 * both take the same number; a key seen before returns the stored attempt unchanged.
 */
export async function recordLabAttempt(params: {
  userId: string;
  labSlug: string;
  cohortId: string | null;
  idempotencyKey: string;
  variantSeed: string;
  choices: unknown;
  score: (attemptNumber: number) => AttemptScore;
}): Promise<RecordedAttempt> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`lab-attempt:${params.userId}:${params.labSlug}`}, 0))`);
    const findByKey = async () => {
      const [row] = await tx
        .select()
        .from(labAttempts)
        .where(and(eq(labAttempts.userId, params.userId), eq(labAttempts.idempotencyKey, params.idempotencyKey)))
        .limit(1);
      return row;
    };
    const replayed = await findByKey();
    if (replayed) return sameLab(replayed, params.labSlug);

    const [previous] = await tx
      .select({ last: max(labAttempts.attemptNumber) })
      .from(labAttempts)
      .where(and(eq(labAttempts.userId, params.userId), eq(labAttempts.labSlug, params.labSlug)));
    const attemptNumber = (previous?.last ?? 0) + 1;
    const { outcome, score, passed } = params.score(attemptNumber);

    const [inserted] = await tx
      .insert(labAttempts)
      .values({
        userId: params.userId,
        labSlug: params.labSlug,
        cohortId: params.cohortId,
        idempotencyKey: params.idempotencyKey,
        attemptNumber,
        variantSeed: params.variantSeed,
        choices: params.choices,
        outcome,
        score,
        passed,
      })
      .onConflictDoNothing({ target: [labAttempts.userId, labAttempts.idempotencyKey] })
      .returning();
    if (inserted) return { status: "created", attempt: inserted };
    // The same key arrived for another lab at the same moment (that lab's lock is not ours).
    const stored = await findByKey();
    if (!stored) throw new Error("an attempt conflicted on its idempotency key but cannot be read back");
    return sameLab(stored, params.labSlug);
  });
}

function sameLab(attempt: LabAttempt, labSlug: string): RecordedAttempt {
  return { status: attempt.labSlug === labSlug ? "replayed" : "key-taken", attempt };
}

/** The learner's attempts at a lab, newest first. */
/**
 * Up to `limit` of the learner's attempts at the lab, newest first, numbered below `beforeNumber`
 * when given (read along the user, lab and number unique index).
 */
export async function listLabAttemptsByLearner(params: {
  userId: string;
  labSlug: string;
  limit: number;
  beforeNumber?: number;
}): Promise<LabAttempt[]> {
  return db
    .select()
    .from(labAttempts)
    .where(
      and(
        eq(labAttempts.userId, params.userId),
        eq(labAttempts.labSlug, params.labSlug),
        params.beforeNumber === undefined ? undefined : lt(labAttempts.attemptNumber, params.beforeNumber),
      ),
    )
    .orderBy(desc(labAttempts.attemptNumber))
    .limit(params.limit);
}

/** One attempt, only when it is the learner's own attempt at that lab. */
export async function findLabAttemptOfLearner(params: {
  attemptId: string;
  userId: string;
  labSlug: string;
}): Promise<LabAttempt | undefined> {
  const [row] = await db
    .select()
    .from(labAttempts)
    .where(
      and(eq(labAttempts.id, params.attemptId), eq(labAttempts.userId, params.userId), eq(labAttempts.labSlug, params.labSlug)),
    )
    .limit(1);
  return row;
}
