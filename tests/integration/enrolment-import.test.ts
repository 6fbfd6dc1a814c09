import { randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { insertEnrolments } from "@/db/queries/enrolment";
import { cohortMemberships, invitations, unsetPasswordHash, users } from "@/db/schema";
import { importRoster, previewRoster } from "@/lib/enrolment";
import { hashToken } from "@/lib/auth/tokens";
import {
  countSchoolRows,
  createSchoolAccount,
  createTestSchool,
  csvFile,
  rosterCsv,
  type TestSchool,
} from "./enrolment-fixtures";
import { tokenFromLink, waitForMessage } from "./support/mail-sink";

// CSV rosters from preview to committed rows and caught e-mails, against the real database and
// mail sink, in a school made for this file.

let school: TestSchool;
let existingLearner: { email: string };
beforeAll(async () => {
  school = await createTestSchool("import");
  existingLearner = await createSchoolAccount({
    schoolId: school.schoolId,
    role: "learner",
    name: "Tove Aldridge",
    email: `tove@${school.domain}`,
  });
});

const mixedRoster = () =>
  [
    "\uFEFFFull name;E-mail address",
    `Ines Varga;ines@${school.domain}`,
    `"Brandt; Ole";OLE@${school.domain}`,
    `Ines again;ines@${school.domain}`,
    `Tove Aldridge;${existingLearner.email}`,
    `Nameless;not-an-address`,
    `;lost@${school.domain}`,
    `Eve Lund;eve@${school.domain};extra`,
  ].join("\r\n");

describe("previewing a roster", () => {
  it("classifies every row and writes nothing", async () => {
    const before = await countSchoolRows({ ...school, emails: [] });
    const result = await previewRoster({ actor: school.admin, cohortId: school.cohortId, file: csvFile(mixedRoster()) });
    if (!result.ok) throw new Error(result.problem);
    expect(result.preview.counts).toEqual({ valid: 2, duplicate: 2, invalid: 3, total: 7 });
    expect(result.preview.rows.map((row) => [row.row, row.status, row.email])).toEqual([
      [2, "valid", `ines@${school.domain}`],
      [3, "valid", `ole@${school.domain}`],
      [4, "duplicate", `ines@${school.domain}`],
      [5, "duplicate", existingLearner.email],
      [6, "invalid", "not-an-address"],
      [7, "invalid", `lost@${school.domain}`],
      [8, "invalid", `eve@${school.domain}`],
    ]);
    expect(result.preview.rows[1]!.name).toBe("Brandt; Ole");
    expect(result.preview.rows[3]!.reason).toMatch(/already has an account at this school/i);
    expect(await countSchoolRows({ ...school, emails: [] })).toEqual(before);
  });

  it("refuses a file that is not a roster, with the reason", async () => {
    const result = await previewRoster({
      actor: school.admin,
      cohortId: school.cohortId,
      file: new File([new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2])], "roster.xlsx", { type: "application/vnd.ms-excel" }),
    });
    expect(result).toEqual({ ok: false, problem: expect.stringMatching(/spreadsheet file/) });
  });
});

describe("importing a roster", () => {
  it("enrols exactly the valid rows, each with an account waiting, a membership and a caught invitation", async () => {
    const result = await importRoster({ actor: school.admin, cohortId: school.cohortId, file: csvFile(mixedRoster()), expectedValid: 2 });
    if (!result.ok) throw new Error(result.problem);
    expect(result).toMatchObject({ imported: 2, letters: { sent: 2, unsent: 0 } });

    const emails = [`ines@${school.domain}`, `ole@${school.domain}`];
    const accounts = await db.select().from(users).where(inArray(users.email, emails)).orderBy(users.email);
    expect(accounts.map((a) => [a.email, a.name, a.role, a.active, a.passwordHash, a.schoolId])).toEqual([
      [emails[0], "Ines Varga", "learner", false, unsetPasswordHash, school.schoolId],
      [emails[1], "Brandt; Ole", "learner", false, unsetPasswordHash, school.schoolId],
    ]);
    const memberships = await db
      .select({ userId: cohortMemberships.userId, role: cohortMemberships.role })
      .from(cohortMemberships)
      .where(and(eq(cohortMemberships.cohortId, school.cohortId), inArray(cohortMemberships.userId, accounts.map((a) => a.id))));
    expect(memberships.map((m) => m.role)).toEqual(["learner", "learner"]);

    for (const email of emails) {
      const message = await waitForMessage({ to: email, subject: /invitation/i });
      expect(message.text).toContain(school.cohortName);
      const token = tokenFromLink(message, "/invitations/");
      const [stored] = await db.select().from(invitations).where(eq(invitations.tokenHash, hashToken(token)));
      expect(stored).toMatchObject({ email, cohortId: school.cohortId, role: "learner", usedAt: null, revokedAt: null });
    }
    // Nothing was written for the duplicate and invalid rows.
    expect(await db.select().from(users).where(inArray(users.email, [`lost@${school.domain}`, `eve@${school.domain}`]))).toEqual([]);
  });

  it("classifies the same file again afterwards: the imported people are now duplicates", async () => {
    const result = await previewRoster({ actor: school.admin, cohortId: school.cohortId, file: csvFile(mixedRoster()) });
    if (!result.ok) throw new Error(result.problem);
    expect(result.preview.counts).toMatchObject({ valid: 0, duplicate: 4, invalid: 3 });
    expect(result.preview.rows[0]!.reason).toBe("Already in this cohort.");
  });

  it("refuses to import when the file no longer gives what the admin was shown, writing nothing", async () => {
    const fresh = [
      { name: "Pia Stone", email: `pia.${randomUUID().slice(0, 6)}@${school.domain}` },
      { name: "Rune Hale", email: `rune.${randomUUID().slice(0, 6)}@${school.domain}` },
    ];
    const file = csvFile(rosterCsv(fresh));
    const preview = await previewRoster({ actor: school.admin, cohortId: school.cohortId, file });
    if (!preview.ok) throw new Error(preview.problem);
    expect(preview.preview.counts.valid).toBe(2);
    // Someone else enrols one of them between the preview and the import.
    await createSchoolAccount({ schoolId: school.schoolId, role: "learner", name: "Pia Stone", email: fresh[0]!.email });

    const result = await importRoster({ actor: school.admin, cohortId: school.cohortId, file, expectedValid: 2 });
    expect(result).toMatchObject({ ok: false, problem: expect.stringMatching(/changed since you checked/) });
    if (result.ok) return;
    expect(result.preview?.counts).toMatchObject({ valid: 1, duplicate: 1 });
    expect(await db.select().from(users).where(eq(users.email, fresh[1]!.email))).toEqual([]);
  });

  it("rolls the whole import back when a statement fails part-way, leaving no row of it", async () => {
    const tag = randomUUID().slice(0, 8);
    const people = Array.from({ length: 2_500 }, (_, i) => ({
      name: `Partial ${i}`,
      email: `partial.${i}.${tag}@${school.domain}`,
      tokenHash: hashToken(`${tag}-${i}`),
    }));
    // The last invitation repeats an earlier link digest: the third batch's invitation insert
    // fails after two full batches and the third batch's accounts and memberships went in.
    people[2_499]!.tokenHash = people[0]!.tokenHash;
    const before = await countSchoolRows({ ...school, emails: [] });

    await expect(
      insertEnrolments({ schoolId: school.schoolId, cohortId: school.cohortId, invitedById: school.admin.id, expiresAt: new Date(Date.now() + 86_400_000), people }),
    ).rejects.toThrow();

    expect(await countSchoolRows({ ...school, emails: people.map((p) => p.email) })).toEqual({ ...before, users: 0 });
  });

  it("does not let an admin import into a cohort of another school", async () => {
    const other = await createTestSchool("import-other");
    const file = csvFile(rosterCsv([{ name: "Stray Person", email: `stray@${school.domain}` }]));
    expect(await previewRoster({ actor: other.admin, cohortId: school.cohortId, file })).toEqual({
      ok: false,
      problem: "That cohort is not part of your school.",
    });
    expect(await importRoster({ actor: other.admin, cohortId: school.cohortId, file, expectedValid: 1 })).toEqual({
      ok: false,
      problem: "That cohort is not part of your school.",
    });
    await expect(
      insertEnrolments({
        schoolId: other.schoolId,
        cohortId: school.cohortId,
        invitedById: other.admin.id,
        expiresAt: new Date(),
        people: [{ name: "Stray Person", email: `stray@${school.domain}`, tokenHash: hashToken("stray") }],
      }),
    ).rejects.toThrow(/not part of school/);
    expect(await db.select().from(users).where(eq(users.email, `stray@${school.domain}`))).toEqual([]);
  });
});
