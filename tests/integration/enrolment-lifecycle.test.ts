import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { listCohortRoster } from "@/db/queries/enrolment";
import { cohortMemberships, invitations, sessions, users } from "@/db/schema";
import { acceptInvitation, previewInvitation } from "@/lib/auth/invitations";
import { validateSessionToken } from "@/lib/auth/session-store";
import { signInWithPassword } from "@/lib/auth/sign-in";
import { hashToken } from "@/lib/auth/tokens";
import {
  buildRoster,
  deactivateLearner,
  enrolLearner,
  reactivateLearner,
  resendInvitation,
  resendWaitingInvitations,
  revokeInvitationLink,
  type RosterState,
} from "@/lib/enrolment";
import { createSchoolAccount, createTestSchool, type TestSchool } from "./enrolment-fixtures";
import { tokenFromLink, waitForMessage } from "./support/mail-sink";
import { uniqueAddress } from "./support/people";

// An enrolled learner's invitation from issue to sign-in, and every way it can be stopped:
// resend, revoke, expiry, switching the account off and on. Real database, real mail sink.

let school: TestSchool;
beforeAll(async () => {
  school = await createTestSchool("lifecycle");
});

let counter = 0;
function address(label: string): string {
  counter += 1;
  return `${label}.${counter}@${school.domain}`;
}

/** The newest invitation link e-mailed to `email` that differs from every link in `seen`. */
async function nextToken(email: string, seen: string[] = []): Promise<string> {
  const deadline = Date.now() + 10_000;
  for (;;) {
    const token = tokenFromLink(await waitForMessage({ to: email, subject: /invitation/i }), "/invitations/");
    if (!seen.includes(token)) return token;
    if (Date.now() > deadline) throw new Error(`No new invitation reached ${email}.`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

async function invitationIdOf(token: string): Promise<string> {
  const [row] = await db.select({ id: invitations.id }).from(invitations).where(eq(invitations.tokenHash, hashToken(token)));
  return row!.id;
}

async function stateOf(email: string, now = new Date()): Promise<RosterState | undefined> {
  const { members, invitations: latest } = await listCohortRoster({ schoolId: school.schoolId, cohortId: school.cohortId });
  return buildRoster(members, latest, now).find((line) => line.email === email)?.state;
}

async function enrol(email: string, now?: Date) {
  const result = await enrolLearner({ actor: school.admin, cohortId: school.cohortId, name: "Mirela Tanaka", email, now });
  expect(result).toEqual({ ok: true, outcome: "invited", letters: { sent: 1, unsent: 0 } });
}

describe("invitation lifecycle", () => {
  it("issue → resend → the old link is refused → accept → sign in", async () => {
    const email = address("resent");
    await enrol(email);
    const [account] = await db.select().from(users).where(eq(users.email, email));
    expect(account).toMatchObject({ name: "Mirela Tanaka", active: false, role: "learner" });
    expect((await signInWithPassword({ email, password: "anything at all here", clientAddress: uniqueAddress() })).ok).toBe(false);
    expect(await stateOf(email)).toBe("pending");

    const first = await nextToken(email);
    const resent = await resendInvitation({ actor: school.admin, invitationId: await invitationIdOf(first) });
    expect(resent).toEqual({ ok: true, letters: { sent: 1, unsent: 0 } });
    const second = await nextToken(email, [first]);

    expect(await previewInvitation({ token: first })).toEqual({ state: "revoked" });
    expect(await acceptInvitation({ token: first, name: "Old Link", password: "old link password" })).toEqual({ ok: false, reason: "revoked" });

    const accepted = await acceptInvitation({ token: second, name: "Mirela K. Tanaka", password: "probe ground spring" });
    if (!accepted.ok) throw new Error(accepted.reason);
    expect(accepted.userId).toBe(account!.id);
    const [after] = await db.select().from(users).where(eq(users.email, email));
    expect(after).toMatchObject({ name: "Mirela K. Tanaka", active: true });
    expect(await db.select().from(cohortMemberships).where(eq(cohortMemberships.userId, account!.id))).toHaveLength(1);
    expect(await stateOf(email)).toBe("accepted");

    const signedIn = await signInWithPassword({ email, password: "probe ground spring", clientAddress: uniqueAddress() });
    expect(signedIn.ok && signedIn.user.id).toBe(account!.id);
    expect(await acceptInvitation({ token: second, name: "Again", password: "again password" })).toEqual({ ok: false, reason: "used" });
    expect(await resendInvitation({ actor: school.admin, invitationId: await invitationIdOf(second) })).toEqual({
      ok: false,
      reason: "accepted",
    });
  });

  it("revoke → the link is refused; a later resend works again", async () => {
    const email = address("revoked");
    await enrol(email);
    const token = await nextToken(email);
    expect(await revokeInvitationLink({ actor: school.admin, invitationId: await invitationIdOf(token) })).toBe(true);
    expect(await revokeInvitationLink({ actor: school.admin, invitationId: await invitationIdOf(token) })).toBe(false);
    expect(await stateOf(email)).toBe("revoked");
    expect(await acceptInvitation({ token, name: "Revoked", password: "revoked password" })).toEqual({ ok: false, reason: "revoked" });
    expect((await db.select().from(users).where(eq(users.email, email)))[0]?.active).toBe(false);

    await resendInvitation({ actor: school.admin, invitationId: await invitationIdOf(token) });
    const fresh = await nextToken(email, [token]);
    expect((await acceptInvitation({ token: fresh, name: "Second Chance", password: "second chance pass" })).ok).toBe(true);
  });

  it("expiry → the link is refused; resending every waiting invitation gives a working one", async () => {
    const email = address("expired");
    const eightDaysAgo = new Date(Date.now() - 8 * 24 * 60 * 60_000);
    await enrol(email, eightDaysAgo);
    const token = await nextToken(email);
    expect(await stateOf(email)).toBe("expired");
    expect(await acceptInvitation({ token, name: "Too Late", password: "too late password" })).toEqual({ ok: false, reason: "expired" });

    const resent = await resendWaitingInvitations({ actor: school.admin, cohortId: school.cohortId });
    if (!resent.ok) throw new Error(resent.reason);
    expect(resent.reissued).toBeGreaterThanOrEqual(1);
    expect(resent.letters.unsent).toBe(0);
    const fresh = await nextToken(email, [token]);
    expect(await stateOf(email)).toBe("pending");
    expect((await acceptInvitation({ token: fresh, name: "On Time", password: "on time password" })).ok).toBe(true);
  });

  it("resending every waiting invitation skips accepted and revoked ones", async () => {
    const revokedEmail = address("skip-revoked");
    await enrol(revokedEmail);
    const revokedToken = await nextToken(revokedEmail);
    await revokeInvitationLink({ actor: school.admin, invitationId: await invitationIdOf(revokedToken) });
    const waitingEmail = address("waiting");
    await enrol(waitingEmail);
    const waitingToken = await nextToken(waitingEmail);

    await resendWaitingInvitations({ actor: school.admin, cohortId: school.cohortId });
    await nextToken(waitingEmail, [waitingToken]);
    expect(await stateOf(revokedEmail)).toBe("revoked");
    expect(await db.select().from(invitations).where(eq(invitations.email, revokedEmail))).toHaveLength(1);
  });
});

describe("switching a learner's account off and on", () => {
  it("stops sign-in and ends sessions while keeping the learner's records, then lets them back", async () => {
    const email = address("switched");
    await enrol(email);
    const accepted = await acceptInvitation({ token: await nextToken(email), name: "Kofi Lindahl", password: "scope probe ground" });
    if (!accepted.ok) throw new Error(accepted.reason);

    expect(await deactivateLearner({ actor: school.admin, userId: accepted.userId })).toBe("done");
    expect((await validateSessionToken(accepted.cookie.value)).user).toBeNull();
    expect(await db.select().from(sessions).where(eq(sessions.userId, accepted.userId))).toEqual([]);
    expect(await signInWithPassword({ email, password: "scope probe ground", clientAddress: uniqueAddress() })).toEqual({
      ok: false,
      reason: "invalid-credentials",
    });
    expect(await db.select().from(cohortMemberships).where(eq(cohortMemberships.userId, accepted.userId))).toHaveLength(1);
    expect(await stateOf(email)).toBe("deactivated");

    expect(await reactivateLearner({ actor: school.admin, userId: accepted.userId })).toBe("done");
    expect((await signInWithPassword({ email, password: "scope probe ground", clientAddress: uniqueAddress() })).ok).toBe(true);
    expect(await stateOf(email)).toBe("accepted");
  });

  it("switching off an enrolled learner who never accepted also stops their link; switching on asks for a new invitation", async () => {
    const email = address("never-joined");
    await enrol(email);
    const token = await nextToken(email);
    const [account] = await db.select().from(users).where(eq(users.email, email));
    expect(await deactivateLearner({ actor: school.admin, userId: account!.id })).toBe("done");
    expect(await acceptInvitation({ token, name: "Switched Off", password: "switched off pass" })).toEqual({ ok: false, reason: "revoked" });
    expect(await reactivateLearner({ actor: school.admin, userId: account!.id })).toBe("awaiting");
  });

  it("switches only learners of the admin's own school", async () => {
    const instructor = await createSchoolAccount({ schoolId: school.schoolId, role: "instructor", name: "Hal Okafor", email: address("instructor") });
    expect(await deactivateLearner({ actor: school.admin, userId: instructor.id })).toBe("not-found");
    const other = await createTestSchool("lifecycle-other");
    const learner = await createSchoolAccount({ schoolId: school.schoolId, role: "learner", name: "Lia Brook", email: address("learner") });
    expect(await deactivateLearner({ actor: other.admin, userId: learner.id })).toBe("not-found");
    expect((await db.select().from(users).where(eq(users.id, learner.id)))[0]?.active).toBe(true);
  });
});

describe("enrolling one person", () => {
  it("adds a learner the school already has, refuses duplicates and staff, and never touches another school's account", async () => {
    const learner = await createSchoolAccount({ schoolId: school.schoolId, role: "learner", name: "Noa Pike", email: address("existing") });
    const enrolExisting = () => enrolLearner({ actor: school.admin, cohortId: school.cohortId, name: "Noa Pike", email: learner.email });
    expect(await enrolExisting()).toEqual({ ok: true, outcome: "added-existing" });
    expect(await enrolExisting()).toEqual({ ok: false, reason: "already-in-cohort" });

    const instructor = await createSchoolAccount({ schoolId: school.schoolId, role: "instructor", name: "Ira Quist", email: address("staff") });
    expect(await enrolLearner({ actor: school.admin, cohortId: school.cohortId, name: "Ira", email: instructor.email })).toEqual({
      ok: false,
      reason: "not-a-learner",
    });

    // Another school enrols the address as it would a new one; the account here stays as it was
    // (tests/integration/admin-lookups-across-schools.test.ts follows the rest).
    const other = await createTestSchool("lifecycle-elsewhere");
    expect(await enrolLearner({ actor: other.admin, cohortId: other.cohortId, name: "Noa Pike", email: learner.email })).toEqual({
      ok: true,
      outcome: "invited",
      letters: { sent: 1, unsent: 0 },
    });
    const [own] = await db.select().from(users).where(eq(users.id, learner.id));
    expect(own).toMatchObject({ schoolId: school.schoolId, active: true, name: "Noa Pike" });
    expect(await enrolLearner({ actor: other.admin, cohortId: school.cohortId, name: "Noa Pike", email: address("stray") })).toEqual({
      ok: false,
      reason: "unknown-cohort",
    });
  });
});
