import { and, count, desc, eq, inArray, isNull, ne, sql } from "drizzle-orm";
import { db } from "../client";
import type { Transaction } from "../connection";
import { cohortMemberships, cohorts, invitations, sessions, unsetPasswordHash, users, type Invitation, type Role } from "../schema";
import { isOpenInvitation, isUsableInvitation } from "./invitation-conditions";
import { awaitingFirstSend } from "./invitation-mail";

// Learners in cohorts as the school admin manages them: enrolment (one or thousands at once),
// invitation links and whether an account may sign in. Every statement is scoped to the admin's
// school; ids from another school match nothing, and accounts of another school are never looked
// at, so no answer tells an admin whether an address has an account elsewhere.

// 1,000 rows of at most 8 columns stay far below PostgreSQL's 65,535 bind parameters per statement;
// lookups by address take one parameter per address, and a roster has at most 10,000.
const insertBatchSize = 1_000;

function inBatches<T>(items: readonly T[]): T[][] {
  const batches: T[][] = [];
  for (let start = 0; start < items.length; start += insertBatchSize) batches.push(items.slice(start, start + insertBatchSize));
  return batches;
}

export type RosterConflicts = { inCohort: string[]; inSchool: string[]; invited: string[] };

/** Which of `emails` the school already knows, and how, in two queries whatever the count. */
export async function findRosterConflicts(params: {
  schoolId: string;
  cohortId: string;
  emails: string[];
  now: Date;
}): Promise<RosterConflicts> {
  const conflicts: RosterConflicts = { inCohort: [], inSchool: [], invited: [] };
  if (params.emails.length === 0) return conflicts;
  const [accounts, invited] = await Promise.all([
    db
      .select({
        email: users.email,
        inCohort: sql<boolean>`exists (
          select 1 from ${cohortMemberships} m where m.user_id = ${users.id} and m.cohort_id = ${params.cohortId}
        )`,
      })
      .from(users)
      .where(and(eq(users.schoolId, params.schoolId), inArray(users.email, params.emails))),
    db
      .selectDistinct({ email: invitations.email })
      .from(invitations)
      .where(
        and(
          eq(invitations.schoolId, params.schoolId),
          inArray(invitations.email, params.emails),
          isUsableInvitation(params.now),
        ),
      ),
  ]);
  for (const account of accounts) (account.inCohort ? conflicts.inCohort : conflicts.inSchool).push(account.email);
  conflicts.invited = invited.map((row) => row.email);
  return conflicts;
}

export type NewEnrolment = { name: string; email: string; tokenHash: string };

/**
 * Enrols learners in one transaction: an account that cannot sign in until its invitation is
 * accepted, the cohort membership, and the invitation. A batch of statements per thousand people;
 * any failure (an address the school enrolled meanwhile, say) leaves nothing behind. Returns each address's
 * invitation id; the invitations wait for their e-mail (see ./invitation-mail).
 */
export async function insertEnrolments(params: {
  schoolId: string;
  cohortId: string;
  invitedById: string | null;
  expiresAt: Date;
  people: NewEnrolment[];
}): Promise<{ invitationIds: Map<string, string> }> {
  const mailState = awaitingFirstSend(new Date());
  return db.transaction(async (tx) => {
    const [cohort] = await tx
      .select({ id: cohorts.id })
      .from(cohorts)
      .where(and(eq(cohorts.id, params.cohortId), eq(cohorts.schoolId, params.schoolId)))
      .for("share");
    if (!cohort) throw new Error(`Cohort ${params.cohortId} is not part of school ${params.schoolId}.`);

    const invitationIds = new Map<string, string>();
    for (const batch of inBatches(params.people)) {
      const created = await tx
        .insert(users)
        .values(
          batch.map((person) => ({
            schoolId: params.schoolId,
            email: person.email,
            name: person.name,
            role: "learner" as const,
            passwordHash: unsetPasswordHash,
            active: false,
          })),
        )
        .returning({ id: users.id });
      await tx
        .insert(cohortMemberships)
        .values(created.map((user) => ({ cohortId: params.cohortId, userId: user.id, role: "learner" as const })));
      const issued = await tx
        .insert(invitations)
        .values(
          batch.map((person) => ({
            schoolId: params.schoolId,
            email: person.email,
            role: "learner" as const,
            cohortId: params.cohortId,
            tokenHash: person.tokenHash,
            invitedById: params.invitedById,
            expiresAt: params.expiresAt,
            ...mailState,
          })),
        )
        .returning({ id: invitations.id, email: invitations.email });
      for (const row of issued) invitationIds.set(row.email, row.id);
    }
    return { invitationIds };
  });
}

export type SchoolAccount = { id: string; role: Role; awaiting: boolean; inCohort: boolean };

/** The account at this school with that address, if any, and whether it is in the cohort. */
export async function findSchoolAccount(params: { schoolId: string; cohortId: string; email: string }): Promise<SchoolAccount | undefined> {
  const [row] = await db
    .select({
      id: users.id,
      role: users.role,
      awaiting: sql<boolean>`${users.passwordHash} = ${unsetPasswordHash}`,
      inCohort: sql<boolean>`exists (
        select 1 from ${cohortMemberships} m where m.user_id = ${users.id} and m.cohort_id = ${params.cohortId}
      )`,
    })
    .from(users)
    .where(and(eq(users.email, params.email), eq(users.schoolId, params.schoolId)))
    .limit(1);
  return row;
}

/** Adds a learner who already has an account at the school; false when the cohort or learner is not there. */
export async function addLearnerToCohort(params: { schoolId: string; cohortId: string; userId: string }): Promise<boolean> {
  const inserted = await db.execute(sql`
    insert into ${cohortMemberships} (cohort_id, user_id, role)
    select c.id, u.id, 'learner' from ${cohorts} c, ${users} u
    where c.id = ${params.cohortId} and c.school_id = ${params.schoolId}
      and u.id = ${params.userId} and u.school_id = ${params.schoolId} and u.role = 'learner'
    on conflict do nothing
  `);
  return (inserted.rowCount ?? 0) > 0;
}

export type RosterMember = { userId: string; name: string; email: string; active: boolean; awaiting: boolean };
export type RosterInvitation = Pick<Invitation, "id" | "email" | "expiresAt" | "usedAt" | "revokedAt" | "createdAt" | "mailPendingSince"> & {
  hasAccount: boolean;
};

/** The cohort's learners and, per address, the newest invitation that concerns the cohort. */
export async function listCohortRoster(params: {
  schoolId: string;
  cohortId: string;
}): Promise<{ members: RosterMember[]; invitations: RosterInvitation[] }> {
  const memberEmails = sql`(
    select u.email from ${cohortMemberships} m join ${users} u on u.id = m.user_id
    where m.cohort_id = ${params.cohortId} and m.role = 'learner'
  )`;
  const [members, latest] = await Promise.all([
    db
      .select({
        userId: users.id,
        name: users.name,
        email: users.email,
        active: users.active,
        awaiting: sql<boolean>`${users.passwordHash} = ${unsetPasswordHash}`,
      })
      .from(cohortMemberships)
      .innerJoin(users, eq(users.id, cohortMemberships.userId))
      .where(
        and(
          eq(cohortMemberships.cohortId, params.cohortId),
          eq(cohortMemberships.role, "learner"),
          eq(users.schoolId, params.schoolId),
        ),
      )
      .orderBy(users.name),
    db
      .selectDistinctOn([invitations.email], {
        id: invitations.id,
        email: invitations.email,
        expiresAt: invitations.expiresAt,
        usedAt: invitations.usedAt,
        revokedAt: invitations.revokedAt,
        createdAt: invitations.createdAt,
        mailPendingSince: invitations.mailPendingSince,
        // Qualified by hand: in a select list without joins the columns would be printed bare, and
        // inside the subquery a bare name means the users table's own column.
        hasAccount: sql<boolean>`exists (
          select 1 from ${users} u where u.email = ${invitations}.email and u.school_id = ${invitations}.school_id
        )`,
      })
      .from(invitations)
      .where(
        and(
          eq(invitations.schoolId, params.schoolId),
          eq(invitations.role, "learner"),
          sql`(${invitations.cohortId} = ${params.cohortId} or ${invitations.email} in ${memberEmails})`,
        ),
      )
      .orderBy(invitations.email, desc(invitations.createdAt)),
  ]);
  return { members, invitations: latest };
}

export type InvitationInSchool = Invitation & { cohortName: string | null; accountJoined: boolean };

export async function findInvitationInSchool(params: { schoolId: string; invitationId: string }): Promise<InvitationInSchool | undefined> {
  const [row] = await db
    .select({
      invitation: invitations,
      cohortName: cohorts.name,
      accountJoined: sql<boolean>`exists (
        select 1 from ${users} u
        where u.email = ${invitations}.email and u.school_id = ${invitations}.school_id and u.password_hash <> ${unsetPasswordHash}
      )`,
    })
    .from(invitations)
    .leftJoin(cohorts, eq(cohorts.id, invitations.cohortId))
    .where(and(eq(invitations.id, params.invitationId), eq(invitations.schoolId, params.schoolId)))
    .limit(1);
  return row && { ...row.invitation, cohortName: row.cohortName, accountJoined: row.accountJoined };
}

export type ReissuedInvitation = { email: string; role: Role; cohortId: string | null; tokenHash: string };

/**
 * New links for these addresses; every earlier open link for them stops working, in one
 * transaction. Returns each address's new invitation id; they wait for their e-mail.
 */
export async function reissueInvitations(params: {
  schoolId: string;
  invitedById: string | null;
  expiresAt: Date;
  now: Date;
  items: ReissuedInvitation[];
}): Promise<Map<string, string>> {
  const invitationIds = new Map<string, string>();
  if (params.items.length === 0) return invitationIds;
  await db.transaction(async (tx) => {
    for (const batch of inBatches(params.items)) {
      await revokeOpenInvitations(tx, { schoolId: params.schoolId, emails: batch.map((item) => item.email), now: params.now });
      const issued = await tx
        .insert(invitations)
        .values(
          batch.map((item) => ({
            schoolId: params.schoolId,
            email: item.email,
            role: item.role,
            cohortId: item.cohortId,
            tokenHash: item.tokenHash,
            invitedById: params.invitedById,
            expiresAt: params.expiresAt,
            ...awaitingFirstSend(params.now),
          })),
        )
        .returning({ id: invitations.id, email: invitations.email });
      for (const row of issued) invitationIds.set(row.email, row.id);
    }
  });
  return invitationIds;
}

async function revokeOpenInvitations(tx: Transaction, params: { schoolId: string; emails: string[]; now: Date }) {
  await tx
    .update(invitations)
    .set({ revokedAt: params.now })
    .where(
      and(
        eq(invitations.schoolId, params.schoolId),
        inArray(invitations.email, params.emails),
        isOpenInvitation(),
      ),
    );
}

/** The newest invitation of each address in the cohort that was neither accepted nor revoked. */
export async function listWaitingInvitations(params: {
  schoolId: string;
  cohortId: string;
}): Promise<Omit<ReissuedInvitation, "tokenHash">[]> {
  const latest = db
    .selectDistinctOn([invitations.email], {
      email: invitations.email,
      role: invitations.role,
      cohortId: invitations.cohortId,
      usedAt: invitations.usedAt,
      revokedAt: invitations.revokedAt,
    })
    .from(invitations)
    .where(and(eq(invitations.schoolId, params.schoolId), eq(invitations.cohortId, params.cohortId)))
    .orderBy(invitations.email, desc(invitations.createdAt))
    .as("latest");
  return db
    .select({ email: latest.email, role: latest.role, cohortId: latest.cohortId })
    .from(latest)
    .where(
      and(
        isNull(latest.usedAt),
        isNull(latest.revokedAt),
        sql`not exists (
          select 1 from ${users} u
          where u.email = ${latest.email} and u.school_id = ${params.schoolId} and u.password_hash <> ${unsetPasswordHash}
        )`,
      ),
    );
}

export async function revokeInvitation(params: { schoolId: string; invitationId: string; now: Date }): Promise<boolean> {
  const revoked = await db
    .update(invitations)
    .set({ revokedAt: params.now })
    .where(
      and(
        eq(invitations.id, params.invitationId),
        eq(invitations.schoolId, params.schoolId),
        isOpenInvitation(),
      ),
    )
    .returning({ id: invitations.id });
  return revoked.length > 0;
}

export type SetActiveResult = "done" | "not-found" | "awaiting";

/**
 * Switches a learner's account on or off; their attempts, photos and memberships stay. Switching
 * off also ends their sessions and any open invitation link. An enrolled learner who never
 * accepted has no password to sign in with, so they are invited again rather than switched on.
 */
export async function setLearnerActive(params: {
  schoolId: string;
  userId: string;
  active: boolean;
  now: Date;
}): Promise<SetActiveResult> {
  return db.transaction(async (tx) => {
    const [learner] = await tx
      .select({ id: users.id, email: users.email, passwordHash: users.passwordHash })
      .from(users)
      .where(and(eq(users.id, params.userId), eq(users.schoolId, params.schoolId), eq(users.role, "learner")))
      .for("update");
    if (!learner) return "not-found";
    if (params.active && learner.passwordHash === unsetPasswordHash) return "awaiting";
    await tx.update(users).set({ active: params.active, updatedAt: params.now }).where(eq(users.id, learner.id));
    if (!params.active) {
      await tx.delete(sessions).where(eq(sessions.userId, learner.id));
      await revokeOpenInvitations(tx, { schoolId: params.schoolId, emails: [learner.email], now: params.now });
    }
    return "done";
  });
}

export type OpenInvitation = Pick<Invitation, "id" | "email" | "role" | "expiresAt"> & { cohortName: string | null };

/** The newest open invitations of the school and how many there are in all. */
export async function listOpenInvitationsBySchool(params: {
  schoolId: string;
  now: Date;
  limit: number;
}): Promise<{ invitations: OpenInvitation[]; total: number }> {
  const open = and(
    eq(invitations.schoolId, params.schoolId),
    isUsableInvitation(params.now),
  );
  const [rows, [total]] = await Promise.all([
    db
      .select({
        id: invitations.id,
        email: invitations.email,
        role: invitations.role,
        expiresAt: invitations.expiresAt,
        cohortName: cohorts.name,
      })
      .from(invitations)
      .leftJoin(cohorts, eq(cohorts.id, invitations.cohortId))
      .where(open)
      .orderBy(desc(invitations.createdAt))
      .limit(params.limit),
    db.select({ value: count() }).from(invitations).where(open),
  ]);
  return { invitations: rows, total: total?.value ?? 0 };
}

export type SchoolHeadcount = { learners: number; awaiting: number; deactivated: number };

export async function countLearnersBySchool(params: { schoolId: string }): Promise<SchoolHeadcount> {
  const [row] = await db
    .select({
      learners: count(),
      awaiting: sql<number>`count(*) filter (where ${users.passwordHash} = ${unsetPasswordHash})::int`,
      deactivated: sql<number>`count(*) filter (where not ${users.active} and ${users.passwordHash} <> ${unsetPasswordHash})::int`,
    })
    .from(users)
    .where(and(eq(users.schoolId, params.schoolId), eq(users.role, "learner")));
  return row ?? { learners: 0, awaiting: 0, deactivated: 0 };
}

export type StaffMember = { id: string; name: string; email: string; role: Role; active: boolean };

export async function listStaffBySchool(params: { schoolId: string }): Promise<StaffMember[]> {
  return db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, active: users.active })
    .from(users)
    .where(and(eq(users.schoolId, params.schoolId), ne(users.role, "learner")))
    .orderBy(users.role, users.name);
}
