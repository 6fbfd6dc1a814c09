/**
 * One school's admin learns nothing about another school's people. Every look-up an admin makes
 * by e-mail address (the school-wide invitation, enrolling one learner, a CSV roster's preview and
 * import, the cohort's roster, resending links, the headcount) answers for an address with an
 * account at another school exactly as for an address nobody has used, and that account is never
 * touched. The caught-mail page's reader shows a school's admin its own mail only: not the other
 * school's password-reset link, even to an address the admin has invited.
 * Real database and the shared mail sink.
 */
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { countLearnersBySchool, listCohortRoster } from "@/db/queries/enrolment";
import { users } from "@/db/schema";
import { acceptInvitation, issueInvitation } from "@/lib/auth/invitations";
import { requestPasswordReset } from "@/lib/auth/password-reset";
import { signInWithPassword } from "@/lib/auth/sign-in";
import { buildRoster, enrolLearner, importRoster, previewRoster, resendInvitation, resendWaitingInvitations } from "@/lib/enrolment";
import { findLinks, listSchoolCaughtMessages } from "@/lib/mail/sink";
import { deliverMail } from "@/lib/mail/transport";
import { createSchoolAccount, createTestSchool, csvFile, rosterCsv, staffPassword, type TestSchool } from "./enrolment-fixtures";
import { tokenFromLink, waitForMessage } from "./support/mail-sink";

let asking: TestSchool;
let holding: TestSchool;

beforeAll(async () => {
  asking = await createTestSchool("lookup-asking");
  holding = await createTestSchool("lookup-holding");
});

let counter = 0;
/** Two addresses for one look-up: one with an account at the holding school, one nobody has used. */
async function addressPair(label: string): Promise<{ taken: string; fresh: string }> {
  counter += 1;
  const taken = `${label}.taken.${counter}@${holding.domain}`;
  await createSchoolAccount({ schoolId: holding.schoolId, role: "learner", name: "Rhea Caldwell", email: taken });
  return { taken, fresh: `${label}.fresh.${counter}@${holding.domain}` };
}

const idPattern = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/g;

/** The answer as the admin reads it, with the address, ids and moments taken out. */
function asSeen(answer: unknown, address: string): string {
  return JSON.stringify(answer, (_key, value: unknown) => (value instanceof Date ? "<moment>" : value))
    .replaceAll(address, "<address>")
    .replace(idPattern, "<id>")
    .replace(/\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z/g, "<moment>");
}

async function rosterLineOf(email: string) {
  const { members, invitations } = await listCohortRoster({ schoolId: asking.schoolId, cohortId: asking.cohortId });
  const line = buildRoster(members, invitations, new Date()).find((entry) => entry.email === email);
  expect(line, email).toBeDefined();
  return line!;
}

/** The holding school's account is as it was: same school, still signs in with its password. */
async function expectAccountUntouched(email: string): Promise<void> {
  const accounts = await db.select({ schoolId: users.schoolId, active: users.active }).from(users).where(eq(users.email, email));
  expect(accounts).toContainEqual({ schoolId: holding.schoolId, active: true });
  const signIn = await signInWithPassword({ email, password: staffPassword, clientAddress: "203.0.113.60" });
  expect(signIn.ok && signIn.user.schoolId).toBe(holding.schoolId);
}

describe("an admin's look-ups by address", () => {
  it("the school-wide invitation answers alike, lists alike, and its link makes no second account", async () => {
    const { taken, fresh } = await addressPair("invite");
    const invite = (email: string) =>
      issueInvitation({ schoolId: asking.schoolId, email, role: "learner", cohortId: asking.cohortId, inviter: { id: asking.admin.id, name: asking.admin.name } });
    const [forTaken, forFresh] = [await invite(taken), await invite(fresh)];
    expect(forTaken.ok).toBe(true);
    expect(asSeen(forTaken, taken)).toBe(asSeen(forFresh, fresh));
    expect(asSeen(await rosterLineOf(taken), taken)).toBe(asSeen(await rosterLineOf(fresh), fresh));

    // Resending each link answers the same, and the resent links are listed the same.
    const resend = async (email: string) => resendInvitation({ actor: asking.admin, invitationId: (await rosterLineOf(email)).invitationId! });
    expect(asSeen(await resend(taken), taken)).toBe(asSeen(await resend(fresh), fresh));
    expect(asSeen(await rosterLineOf(taken), taken)).toBe(asSeen(await rosterLineOf(fresh), fresh));

    // The owner of the taken address opens the link and is told to sign in instead.
    const link = tokenFromLink(await waitForMessage({ to: taken, subject: /invitation/i }), "/invitations/");
    expect(await acceptInvitation({ token: link, name: "Someone Else", password: "not their password at all" })).toEqual({
      ok: false,
      reason: "already-registered",
    });
    await expectAccountUntouched(taken);
  });

  it("enrolling one learner answers alike, lists and counts alike, and refuses a second enrolment alike", async () => {
    const { taken, fresh } = await addressPair("enrol");
    const before = await countLearnersBySchool({ schoolId: asking.schoolId });
    const enrol = (email: string) => enrolLearner({ actor: asking.admin, cohortId: asking.cohortId, name: "Rhea Caldwell", email });
    const [forTaken, forFresh] = [await enrol(taken), await enrol(fresh)];
    expect(forTaken).toEqual({ ok: true, outcome: "invited", letters: { sent: 1, unsent: 0 } });
    expect(forFresh).toEqual(forTaken);
    expect(await countLearnersBySchool({ schoolId: asking.schoolId })).toEqual({ ...before, learners: before.learners + 2, awaiting: before.awaiting + 2 });
    expect(asSeen(await rosterLineOf(taken), taken)).toBe(asSeen(await rosterLineOf(fresh), fresh));
    expect(await enrol(taken)).toEqual(await enrol(fresh));

    const waiting = await resendWaitingInvitations({ actor: asking.admin, cohortId: asking.cohortId });
    expect(waiting.ok).toBe(true);
    for (const email of [taken, fresh]) expect((await rosterLineOf(email)).state).toBe("pending");

    const link = tokenFromLink(await waitForMessage({ to: taken, subject: /invitation/i }), "/invitations/");
    expect(await acceptInvitation({ token: link, name: "Someone Else", password: "not their password at all" })).toEqual({
      ok: false,
      reason: "already-registered",
    });
    await expectAccountUntouched(taken);
  });

  it("a CSV roster's preview and import treat both addresses as new", async () => {
    const { taken, fresh } = await addressPair("roster");
    const file = () => csvFile(rosterCsv([{ name: "Rhea Caldwell", email: taken }, { name: "Rhea Caldwell", email: fresh }]));
    const preview = await previewRoster({ actor: asking.admin, cohortId: asking.cohortId, file: file() });
    if (!preview.ok) throw new Error(preview.problem);
    const [takenRow, freshRow] = preview.preview.rows;
    expect(takenRow).toMatchObject({ status: "valid", reason: null });
    expect({ ...takenRow, row: 0, email: "" }).toEqual({ ...freshRow, row: 0, email: "" });

    const imported = await importRoster({ actor: asking.admin, cohortId: asking.cohortId, file: file(), expectedValid: 2 });
    expect(imported).toMatchObject({ ok: true, imported: 2, letters: { sent: 2, unsent: 0 } });
    expect(asSeen(await rosterLineOf(taken), taken)).toBe(asSeen(await rosterLineOf(fresh), fresh));
    await expectAccountUntouched(taken);
  });
});

describe("the caught-mail page's reader", () => {
  it("shows an admin their own school's mail, never another school's reset link, even to an address they invited", async () => {
    const target = `reset.target.${Date.now()}@${holding.domain}`;
    await createSchoolAccount({ schoolId: holding.schoolId, role: "admin", name: "Piet Ashdown", email: target });
    // The asking school's admin invites the address, so that mail to it is mail of both schools.
    const invited = await issueInvitation({ schoolId: asking.schoolId, email: target, role: "instructor", cohortId: null, inviter: null });
    expect(invited.ok).toBe(true);
    const invitation = await waitForMessage({ to: target, subject: /invitation/i });
    await requestPasswordReset({ email: target });
    const reset = await waitForMessage({ to: target, subject: /reset/i });
    const resetLink = findLinks(reset.text).find((link) => link.includes("/reset-password/"))!;
    expect(resetLink).toBeDefined();

    const askingSees = await listSchoolCaughtMessages({ schoolId: asking.schoolId });
    expect(askingSees.map((message) => message.id)).toContain(invitation.id);
    expect(askingSees.map((message) => message.id)).not.toContain(reset.id);
    expect(JSON.stringify(askingSees)).not.toContain(resetLink);

    const holdingSees = await listSchoolCaughtMessages({ schoolId: holding.schoolId });
    expect(holdingSees.map((message) => message.id)).toContain(reset.id);
    expect(holdingSees.map((message) => message.id)).not.toContain(invitation.id);
  });

  it("shows a school's mail only to addresses the school knows", async () => {
    const outsider = `outsider.${Date.now()}@${holding.domain}`;
    const mail = (subject: string) => ({ subject, text: `${subject}: nothing to click.`, html: `<p>${subject}</p>` });
    await deliverMail({ schoolId: asking.schoolId, to: outsider, mail: mail(`Stray note ${counter}`) });
    await deliverMail({ schoolId: asking.schoolId, to: `admin@${asking.domain}`, mail: mail(`Staff note ${counter}`) });
    const stray = await waitForMessage({ to: outsider, subject: /Stray note/ });
    const staff = await waitForMessage({ to: `admin@${asking.domain}`, subject: /Staff note/ });

    const seen = (await listSchoolCaughtMessages({ schoolId: asking.schoolId })).map((message) => message.id);
    expect(seen).toContain(staff.id);
    expect(seen).not.toContain(stray.id);
  });
});
