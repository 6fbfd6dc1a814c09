import { and, desc, eq, gt, lt, max } from "drizzle-orm";
import { db } from "../client";
import { signInAttempts } from "../schema";

export async function recordSignInAttempt(params: {
  email: string;
  clientAddress: string;
  succeeded: boolean;
}): Promise<void> {
  await db.insert(signInAttempts).values(params);
}

/** Times of the newest failures for an e-mail since its last success, newest first. */
export async function listRecentSignInFailuresByEmail(params: {
  email: string;
  since: Date;
  limit: number;
}): Promise<Date[]> {
  const [lastSuccess] = await db
    .select({ at: max(signInAttempts.createdAt) })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, params.email), eq(signInAttempts.succeeded, true)));
  const since = lastSuccess?.at && lastSuccess.at > params.since ? lastSuccess.at : params.since;
  const rows = await db
    .select({ at: signInAttempts.createdAt })
    .from(signInAttempts)
    .where(
      and(eq(signInAttempts.email, params.email), eq(signInAttempts.succeeded, false), gt(signInAttempts.createdAt, since)),
    )
    .orderBy(desc(signInAttempts.createdAt))
    .limit(params.limit);
  return rows.map((row) => row.at);
}

/** Times of the newest failures from one client address, newest first. */
export async function listRecentSignInFailuresByAddress(params: {
  clientAddress: string;
  since: Date;
  limit: number;
}): Promise<Date[]> {
  const rows = await db
    .select({ at: signInAttempts.createdAt })
    .from(signInAttempts)
    .where(
      and(
        eq(signInAttempts.clientAddress, params.clientAddress),
        eq(signInAttempts.succeeded, false),
        gt(signInAttempts.createdAt, params.since),
      ),
    )
    .orderBy(desc(signInAttempts.createdAt))
    .limit(params.limit);
  return rows.map((row) => row.at);
}

export async function deleteSignInAttemptsBefore(params: { before: Date }): Promise<void> {
  await db.delete(signInAttempts).where(lt(signInAttempts.createdAt, params.before));
}
