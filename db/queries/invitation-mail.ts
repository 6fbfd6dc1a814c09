import { and, asc, eq, inArray, isNotNull, lte, sql } from "drizzle-orm";
import { db } from "../client";
import { cohorts, invitations, schools, users } from "../schema";
import { isUsableInvitation } from "./invitation-conditions";

// The invitation e-mail outbox. A new link is marked as waiting for its e-mail; the request that
// made it sends the e-mail at once and records the outcome, and a background job takes over what
// is still waiting once its next try is due.

/** How long the request that created a link has to send it before the background job may take over. */
export const firstSendLeaseMs = 10 * 60_000;

/** Columns for a link whose e-mail is about to be sent by the request that made it. */
export function awaitingFirstSend(now: Date) {
  return { mailPendingSince: now, mailAttempts: 0, mailNextTryAt: new Date(now.getTime() + firstSendLeaseMs) };
}

export async function markInvitationMailSent(invitationIds: string[]): Promise<void> {
  if (invitationIds.length === 0) return;
  await db
    .update(invitations)
    .set({ mailPendingSince: null, mailNextTryAt: null })
    .where(inArray(invitations.id, invitationIds));
}

/** Counts a failed try and moves the next one back: base, twice base, four times… up to the cap. */
export async function deferInvitationMail(params: { invitationIds: string[]; now: Date; baseDelayMs: number; maxDelayMs: number }): Promise<void> {
  if (params.invitationIds.length === 0) return;
  const delayMs = sql`least(${params.baseDelayMs}::float8 * power(2, least(${invitations.mailAttempts}, 30)), ${params.maxDelayMs}::float8)`;
  await db
    .update(invitations)
    .set({
      mailAttempts: sql`${invitations.mailAttempts} + 1`,
      mailNextTryAt: sql`${params.now.toISOString()}::timestamptz + ${delayMs} * interval '1 millisecond'`,
    })
    .where(and(inArray(invitations.id, params.invitationIds), isNotNull(invitations.mailPendingSince)));
}

export type DueInvitationMail = {
  invitationId: string;
  email: string;
  schoolId: string;
  schoolName: string;
  cohortName: string | null;
  inviterName: string | null;
  expiresAt: Date;
  /** The new link secret; only its digest is stored. */
  token: string;
};

/**
 * Takes up to `limit` open links whose e-mail is due, gives each a new secret and a full lifetime
 * (the old secret was never delivered), and holds them for `leaseMs` so that no other server
 * process sends them meanwhile. Rows another process holds are skipped, not waited for.
 */
export async function claimDueInvitationMail(params: {
  now: Date;
  limit: number;
  leaseMs: number;
  expiresAt: Date;
  issueToken: () => { token: string; tokenHash: string };
}): Promise<DueInvitationMail[]> {
  return db.transaction(async (tx) => {
    const due = await tx
      .select({
        invitationId: invitations.id,
        email: invitations.email,
        schoolId: invitations.schoolId,
        schoolName: schools.name,
        cohortName: cohorts.name,
        inviterName: users.name,
      })
      .from(invitations)
      .innerJoin(schools, eq(schools.id, invitations.schoolId))
      .leftJoin(cohorts, eq(cohorts.id, invitations.cohortId))
      .leftJoin(users, eq(users.id, invitations.invitedById))
      .where(
        and(
          isNotNull(invitations.mailPendingSince),
          lte(invitations.mailNextTryAt, params.now),
          isUsableInvitation(params.now),
        ),
      )
      .orderBy(asc(invitations.mailNextTryAt))
      .limit(params.limit)
      .for("update", { of: invitations, skipLocked: true });
    const leaseEnd = new Date(params.now.getTime() + params.leaseMs);
    const claimed: DueInvitationMail[] = [];
    for (const row of due) {
      const { token, tokenHash } = params.issueToken();
      await tx
        .update(invitations)
        .set({ tokenHash, expiresAt: params.expiresAt, mailNextTryAt: leaseEnd })
        .where(eq(invitations.id, row.invitationId));
      claimed.push({ ...row, expiresAt: params.expiresAt, token });
    }
    return claimed;
  });
}
