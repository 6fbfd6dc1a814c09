import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { invitations, users } from "@/db/schema";
import { acceptInvitation, issueInvitation } from "@/lib/auth/invitations";
import { describeUnsent, enrolLearner, importRoster, isMailDeliveryError, resendWaitingInvitations } from "@/lib/enrolment";
import { findLinks } from "@/lib/mail/sink";
import { createTestSchool, csvFile, freePort, rosterCsv, startPrivateMailSink, type PrivateMailSink, type TestSchool } from "./enrolment-fixtures";

// The mail server is down while learners are enrolled: the invitations must be kept and reported
// as not sent, and once a mail server answers on that port, "resend all waiting" delivers them.
// This file points the app's SMTP settings at a port nothing listens on, then starts the real
// sink script there.

let school: TestSchool;
let smtpPort: number;
let sink: PrivateMailSink | undefined;
const savedPort = process.env.SMTP_PORT;

beforeAll(async () => {
  smtpPort = await freePort();
  // Read on the first e-mail this file sends, so it must be set before any is sent.
  process.env.SMTP_PORT = String(smtpPort);
  school = await createTestSchool("outage");
});

afterAll(() => {
  sink?.process.kill();
  process.env.SMTP_PORT = savedPort;
});

describe("enrolling while the mail server is down", () => {
  const roster = () => [
    { name: "Asha Verne", email: `asha@${school.domain}` },
    { name: "Bram Ostrova", email: `bram@${school.domain}` },
    { name: "Cleo Marchetti", email: `cleo@${school.domain}` },
  ];

  it("keeps the invitation of a single enrolment and says the e-mail was not sent", async () => {
    const result = await enrolLearner({ actor: school.admin, cohortId: school.cohortId, name: "Dina Ferro", email: `dina@${school.domain}` });
    expect(result).toEqual({ ok: true, outcome: "invited", letters: { sent: 0, unsent: 1 } });
    if (result.ok && result.outcome === "invited") expect(describeUnsent(result.letters)).toMatch(/^1 invitation e-mail was not sent.*Resend/);
    expect(await db.select().from(invitations).where(eq(invitations.email, `dina@${school.domain}`))).toHaveLength(1);
  });

  it("tells a failed send of the school-wide invite form apart from other failures, with the row kept", async () => {
    const email = `eli@${school.domain}`;
    const failure = await issueInvitation({ schoolId: school.schoolId, email, role: "instructor", cohortId: null, inviter: null }).then(
      () => null,
      (error: unknown) => error,
    );
    expect(isMailDeliveryError(failure)).toBe(true);
    expect(isMailDeliveryError(Object.assign(new Error("database"), { code: "ECONNREFUSED" }))).toBe(false);
    expect(await db.select().from(invitations).where(eq(invitations.email, email))).toHaveLength(1);
  });

  it("commits an import and reports every letter as not sent", async () => {
    const result = await importRoster({ actor: school.admin, cohortId: school.cohortId, file: csvFile(rosterCsv(roster())), expectedValid: 3 });
    if (!result.ok) throw new Error(result.problem);
    expect(result.imported).toBe(3);
    expect(result.letters).toEqual({ sent: 0, unsent: 3 });
    expect(describeUnsent(result.letters)).toMatch(/^3 invitation e-mails were not sent/);
    const emails = roster().map((person) => person.email);
    expect(await db.select().from(users).where(inArray(users.email, emails))).toHaveLength(3);
    expect(await db.select().from(invitations).where(inArray(invitations.email, emails))).toHaveLength(3);
  });

  it("delivers every waiting invitation once a mail server answers, with links that work", async () => {
    sink = await startPrivateMailSink(smtpPort);

    const resent = await resendWaitingInvitations({ actor: school.admin, cohortId: school.cohortId });
    // The school-wide instructor invitation has no cohort, so it is not among the cohort's waiting.
    expect(resent).toEqual({ ok: true, reissued: 4, letters: { sent: 4, unsent: 0 } });

    const response = await fetch(`${sink.listUrl}?to=${encodeURIComponent(school.domain)}`, { headers: sink.headers });
    const caught = (await response.json()) as { to: string; text: string }[];
    expect(caught.map((message) => message.to).sort()).toEqual([...roster().map((p) => p.email), `dina@${school.domain}`].sort());

    const link = findLinks(caught.find((message) => message.to === `asha@${school.domain}`)!.text).find((l) => l.includes("/invitations/"));
    const token = new URL(link!).pathname.split("/").pop()!;
    expect((await acceptInvitation({ token, name: "Asha Verne", password: "ground lead probe" })).ok).toBe(true);
  });
});
