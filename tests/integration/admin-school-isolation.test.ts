import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { listCohortRoster, listOpenInvitationsBySchool, listStaffBySchool } from "@/db/queries/enrolment";
import { cohortMemberships, invitations, users } from "@/db/schema";
import {
  deactivateLearner,
  enrolLearner,
  importRoster,
  previewRoster,
  reactivateLearner,
  resendInvitation,
  resendWaitingInvitations,
  revokeInvitationLink,
} from "@/lib/enrolment";
import { createSchoolAccount, createTestSchool, csvFile, rosterCsv, type TestSchool } from "./enrolment-fixtures";

// Two schools side by side: every enrolment operation the admin of one can call is tried on the
// other's cohort, invitation and learner, and must see nothing and change nothing.

let home: TestSchool;
let intruder: TestSchool;
let invitationId: string;
let learnerId: string;

beforeAll(async () => {
  home = await createTestSchool("isolation-home");
  intruder = await createTestSchool("isolation-intruder");
  const enrolled = await enrolLearner({ actor: home.admin, cohortId: home.cohortId, name: "Sela Morrow", email: `sela@${home.domain}` });
  expect(enrolled.ok).toBe(true);
  const [invitation] = await db.select().from(invitations).where(eq(invitations.email, `sela@${home.domain}`));
  invitationId = invitation!.id;
  const learner = await createSchoolAccount({ schoolId: home.schoolId, role: "learner", name: "Taro Wilde", email: `taro@${home.domain}` });
  learnerId = learner.id;
  await db.insert(cohortMemberships).values({ cohortId: home.cohortId, userId: learnerId, role: "learner" });
});

async function snapshot() {
  const homeUsers = await db.select().from(users).where(eq(users.schoolId, home.schoolId)).orderBy(users.email);
  const homeInvitations = await db.select().from(invitations).where(eq(invitations.schoolId, home.schoolId)).orderBy(invitations.id);
  const homeMembers = await db.select().from(cohortMemberships).where(eq(cohortMemberships.cohortId, home.cohortId)).orderBy(cohortMemberships.userId);
  return { homeUsers, homeInvitations, homeMembers };
}

describe("an admin of one school", () => {
  it("sees none of another school's people, cohorts or invitations", async () => {
    expect(await listCohortRoster({ schoolId: intruder.schoolId, cohortId: home.cohortId })).toEqual({ members: [], invitations: [] });
    const open = await listOpenInvitationsBySchool({ schoolId: intruder.schoolId, now: new Date(), limit: 50 });
    expect(open).toEqual({ invitations: [], total: 0 });
    expect((await listStaffBySchool({ schoolId: intruder.schoolId })).map((person) => person.email)).toEqual([`admin@${intruder.domain}`]);
    const preview = await previewRoster({ actor: intruder.admin, cohortId: home.cohortId, file: csvFile(rosterCsv([{ name: "X", email: `sela@${home.domain}` }])) });
    expect(preview.ok).toBe(false);
  });

  it("changes nothing in another school through any enrolment action", async () => {
    const before = await snapshot();
    const actor = intruder.admin;
    expect(await enrolLearner({ actor, cohortId: home.cohortId, name: "Planted", email: `planted@${intruder.domain}` })).toEqual({
      ok: false,
      reason: "unknown-cohort",
    });
    expect(
      await importRoster({ actor, cohortId: home.cohortId, file: csvFile(rosterCsv([{ name: "Planted", email: `p@${intruder.domain}` }])), expectedValid: 1 }),
    ).toMatchObject({ ok: false });
    expect(await resendInvitation({ actor, invitationId })).toEqual({ ok: false, reason: "not-found" });
    expect(await revokeInvitationLink({ actor, invitationId })).toBe(false);
    expect(await resendWaitingInvitations({ actor, cohortId: home.cohortId })).toEqual({ ok: false, reason: "not-found" });
    expect(await deactivateLearner({ actor, userId: learnerId })).toBe("not-found");
    expect(await reactivateLearner({ actor, userId: learnerId })).toBe("not-found");
    expect(await snapshot()).toEqual(before);
  });

  it("while the home admin can do each of those things", async () => {
    const actor = home.admin;
    expect(await revokeInvitationLink({ actor, invitationId })).toBe(true);
    expect(await deactivateLearner({ actor, userId: learnerId })).toBe("done");
    expect((await listCohortRoster({ schoolId: home.schoolId, cohortId: home.cohortId })).members.map((m) => m.email).sort()).toEqual([
      `sela@${home.domain}`,
      `taro@${home.domain}`,
    ]);
  });
});
