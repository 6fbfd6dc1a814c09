import { and, desc, eq, or } from "drizzle-orm";
import { db } from "../client";
import { cohortMemberships, cohorts, invitations, schools, unsetPasswordHash, users, type Invitation, type Role } from "../schema";
import { isUniqueViolation } from "./admin-cohorts";
import { isOpenInvitation, isUsableInvitation } from "./invitation-conditions";
import { awaitingFirstSend } from "./invitation-mail";
import { hasOwnPassword } from "./users";

/**
 * Issues an invitation and revokes any earlier pending one for the same address, so one link is
 * live. The invitation waits for its e-mail (see ./invitation-mail).
 */
export async function createInvitation(params: {
  schoolId: string;
  email: string;
  role: Role;
  cohortId: string | null;
  invitedById: string | null;
  tokenHash: string;
  expiresAt: Date;
}): Promise<Invitation> {
  return db.transaction(async (tx) => {
    await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(
        and(
          eq(invitations.schoolId, params.schoolId),
          eq(invitations.email, params.email),
          isOpenInvitation(),
        ),
      );
    const [invitation] = await tx
      .insert(invitations)
      .values({ ...params, ...awaitingFirstSend(new Date()) })
      .returning();
    return invitation!;
  });
}

export type InvitationDetails = Invitation & { schoolName: string; cohortName: string | null };

export async function findInvitationByTokenHash(params: { tokenHash: string }): Promise<InvitationDetails | undefined> {
  const [row] = await db
    .select({ invitation: invitations, schoolName: schools.name, cohortName: cohorts.name })
    .from(invitations)
    .innerJoin(schools, eq(schools.id, invitations.schoolId))
    .leftJoin(cohorts, eq(cohorts.id, invitations.cohortId))
    .where(eq(invitations.tokenHash, params.tokenHash))
    .limit(1);
  return row && { ...row.invitation, schoolName: row.schoolName, cohortName: row.cohortName };
}

export type InvitationState = "usable" | "unknown" | "used" | "revoked" | "expired";

export function describeInvitationState(invitation: Invitation | undefined, now: Date): InvitationState {
  if (!invitation) return "unknown";
  if (invitation.usedAt) return "used";
  if (invitation.revokedAt) return "revoked";
  if (invitation.expiresAt <= now) return "expired";
  return "usable";
}

export type AcceptInvitationResult =
  | { ok: true; userId: string }
  | { ok: false; reason: Exclude<InvitationState, "usable"> | "already-registered" };

/**
 * Creates the account (or completes the one enrolment made), adds it to the invited cohort and
 * spends the invitation in one transaction; the row lock makes a double submit of the same link
 * create one account. An address that already signs in to an account, at this school or another,
 * gets no second one: its owner is told to sign in.
 */
export async function acceptInvitation(params: {
  tokenHash: string;
  name: string;
  passwordHash: string;
  now: Date;
}): Promise<AcceptInvitationResult> {
  try {
    return await acceptInTransaction(params);
  } catch (error) {
    // Another school's invitation to the same address was accepted at the same moment.
    if (isUniqueViolation(error, "users_sign_in_email_unique")) return { ok: false, reason: "already-registered" };
    throw error;
  }
}

function acceptInTransaction(params: { tokenHash: string; name: string; passwordHash: string; now: Date }): Promise<AcceptInvitationResult> {
  return db.transaction(async (tx) => {
    const [invitation] = await tx
      .select()
      .from(invitations)
      .where(eq(invitations.tokenHash, params.tokenHash))
      .for("update")
      .limit(1);
    const state = describeInvitationState(invitation, params.now);
    if (state !== "usable" || !invitation) return { ok: false, reason: state === "usable" ? "unknown" : state };

    // The address's account at the inviting school (enrolment may have made one, waiting for
    // this link) and the one it signs in with, wherever that is.
    const accounts = await tx
      .select({ id: users.id, schoolId: users.schoolId, passwordHash: users.passwordHash })
      .from(users)
      .where(and(eq(users.email, invitation.email), or(eq(users.schoolId, invitation.schoolId), hasOwnPassword())))
      .for("update");
    if (accounts.some((account) => account.passwordHash !== unsetPasswordHash)) return { ok: false, reason: "already-registered" };
    const existing = accounts.find((account) => account.schoolId === invitation.schoolId);

    const [user] = existing
      ? await tx
          .update(users)
          .set({ name: params.name, passwordHash: params.passwordHash, active: true, updatedAt: params.now })
          .where(eq(users.id, existing.id))
          .returning({ id: users.id })
      : await tx
          .insert(users)
          .values({
            schoolId: invitation.schoolId,
            email: invitation.email,
            name: params.name,
            role: invitation.role,
            passwordHash: params.passwordHash,
          })
          .returning({ id: users.id });
    if (invitation.cohortId && invitation.role !== "admin") {
      await tx
        .insert(cohortMemberships)
        .values({ cohortId: invitation.cohortId, userId: user!.id, role: invitation.role })
        .onConflictDoNothing();
    }
    await tx.update(invitations).set({ usedAt: params.now }).where(eq(invitations.id, invitation.id));
    return { ok: true, userId: user!.id };
  });
}

export type PendingInvitation = Pick<Invitation, "id" | "email" | "role" | "expiresAt" | "createdAt"> & {
  cohortName: string | null;
};

export async function listPendingInvitationsBySchool(params: { schoolId: string; now: Date }): Promise<PendingInvitation[]> {
  return db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      createdAt: invitations.createdAt,
      cohortName: cohorts.name,
    })
    .from(invitations)
    .leftJoin(cohorts, eq(cohorts.id, invitations.cohortId))
    .where(
      and(
        eq(invitations.schoolId, params.schoolId),
        isUsableInvitation(params.now),
      ),
    )
    .orderBy(desc(invitations.createdAt));
}
