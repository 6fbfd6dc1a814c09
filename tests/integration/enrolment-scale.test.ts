import { and, count, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { cohortMemberships, invitations, unsetPasswordHash, users } from "@/db/schema";
import { importRoster, previewRoster } from "@/lib/enrolment";
import { createTestSchool, csvFile, freePort, rosterCsv, startPrivateMailSink, type PrivateMailSink, type TestSchool } from "./enrolment-fixtures";

// Five thousand learners in one file, in one go: one preview, one transaction, one letter each.
// Timings are printed for the record, not asserted (speed targets belong in benchmarks). The
// letters go to a sink of this file's own, so the shared one (and its page) is not flooded.

const size = 5_000;
let school: TestSchool;
let sink: PrivateMailSink;
const savedPort = process.env.SMTP_PORT;
beforeAll(async () => {
  const smtpPort = await freePort();
  sink = await startPrivateMailSink(smtpPort);
  // Read on the first e-mail this file sends, so it must be set before any is sent.
  process.env.SMTP_PORT = String(smtpPort);
  school = await createTestSchool("scale");
});
afterAll(() => {
  sink?.process.kill();
  process.env.SMTP_PORT = savedPort;
});

describe(`a roster of ${size.toLocaleString("en-GB")} learners`, () => {
  it("imports every row with exactly one account, membership, invitation and e-mail each", { timeout: 300_000 }, async () => {
    const people = Array.from({ length: size }, (_, i) => ({ name: `Learner ${String(i).padStart(4, "0")} Quill`, email: `learner.${i}@${school.domain}` }));
    const file = csvFile(rosterCsv(people, ";"));

    const previewStarted = performance.now();
    const preview = await previewRoster({ actor: school.admin, cohortId: school.cohortId, file });
    const previewMs = performance.now() - previewStarted;
    if (!preview.ok) throw new Error(preview.problem);
    expect(preview.preview.counts).toEqual({ valid: size, duplicate: 0, invalid: 0, total: size });

    const result = await importRoster({ actor: school.admin, cohortId: school.cohortId, file, expectedValid: size });
    if (!result.ok) throw new Error(result.problem);
    expect(result.imported).toBe(size);
    expect(result.letters).toEqual({ sent: size, unsent: 0 });
    console.info(
      `${size} rows: preview ${previewMs.toFixed(0)} ms, import transaction ${result.timings.writeMs.toFixed(0)} ms, ` +
        `invitation e-mails ${(result.timings.mailMs / 1000).toFixed(1)} s`,
    );

    const emails = people.map((person) => person.email);
    const accounts = await db
      .select({ id: users.id, email: users.email, name: users.name, active: users.active, passwordHash: users.passwordHash })
      .from(users)
      .where(eq(users.schoolId, school.schoolId));
    const learners = accounts.filter((account) => account.email !== `admin@${school.domain}`);
    expect(learners).toHaveLength(size);
    expect(new Set(learners.map((l) => l.email))).toEqual(new Set(emails));
    expect(learners.every((l) => !l.active && l.passwordHash === unsetPasswordHash)).toBe(true);
    expect(learners.find((l) => l.email === `learner.4321@${school.domain}`)?.name).toBe("Learner 4321 Quill");

    const [members] = await db
      .select({ value: count() })
      .from(cohortMemberships)
      .where(and(eq(cohortMemberships.cohortId, school.cohortId), eq(cohortMemberships.role, "learner")));
    expect(members!.value).toBe(size);
    const issued = await db.select({ email: invitations.email, cohortId: invitations.cohortId }).from(invitations).where(inArray(invitations.email, emails));
    expect(issued).toHaveLength(size);
    expect(issued.every((invitation) => invitation.cohortId === school.cohortId)).toBe(true);

    const caught = (await (await fetch(`${sink.listUrl}?to=${encodeURIComponent(school.domain)}`, { headers: sink.headers })).json()) as { to: string }[];
    expect(caught).toHaveLength(size);
    expect(new Set(caught.map((message) => message.to))).toEqual(new Set(emails));
  });
});
