/**
 * Certificates against the real database and mail sink: the completion rule issuing exactly one
 * certificate (also under two requests at once) and none while anything is missing; the public
 * check for valid, revoked, unknown and malformed codes and its per-address limit; revocation by
 * the school's admin only; and the PDF download read back, QR code included.
 */
import { randomBytes } from "node:crypto";
import { and, eq, like } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as getCertificatePdf } from "@/app/api/certificates/[certificateId]/pdf/route";
import { GET as getVerification } from "@/app/api/certificates/verify/[code]/route";
import { db } from "@/db/client";
import { certificates, rateLimits } from "@/db/schema";
import { getCourse } from "@/lessons";
import { createSession } from "@/lib/auth/session-store";
import { courseCertification } from "@/lib/certificates/certification";
import { encodeCertificateCode, formatCertificateCode } from "@/lib/certificates/code";
import { issueCertificateIfComplete } from "@/lib/certificates/issue";
import { revokeCertificate } from "@/lib/certificates/revoke";
import { setSchoolSignatory } from "@/lib/certificates/signatory-settings";
import { verifyCertificate } from "@/lib/certificates/verification";
import { readAppEnv } from "@/lib/env";
import { findLinks } from "@/lib/mail/sink";
import { validateSessionToken, type SessionUser } from "@/lib/auth/session-store";
import { readCertificatePdf } from "../unit/certificates/read-certificate-pdf";
import {
  createAccount,
  createCertificateCohort,
  createSchool,
  passingResults,
  recordLabAttempt,
  recordResults,
  type CourseResults,
} from "./certificate-fixtures";
import { countMessagesTo, waitForMessage } from "./support/mail-sink";
import { ruleOf } from "@/lib/rate-limit/limits";
import { fromAddress, uniqueAddress } from "./support/people";

const course = getCourse();
const lookupLimit = ruleOf("certificate-lookup", "address");
let cohort: { id: string; name: string };
let instructor: { id: string };

async function sessionOf(userId: string): Promise<{ user: SessionUser; cookie: string }> {
  const cookie = await createSession(userId);
  const { user } = await validateSessionToken(cookie.value);
  return { user: user!, cookie: `${cookie.name}=${cookie.value}` };
}

async function learnerWith(results: CourseResults, name = "Ines Calloway") {
  const learner = await createAccount({ role: "learner", name, cohortId: cohort.id });
  await recordResults({ learnerId: learner.id, cohortId: cohort.id, reviewerId: instructor.id, results });
  return learner;
}

const certificatesOf = (userId: string) => db.select().from(certificates).where(eq(certificates.userId, userId));

async function graduate(name?: string) {
  const learner = await learnerWith(passingResults(), name);
  const result = await issueCertificateIfComplete({ userId: learner.id });
  if (result.status !== "issued") throw new Error(`expected a new certificate, got ${result.status}`);
  return { learner, certificate: result.certificate };
}

const pdfRequest = (certificateId: string, cookie?: string) =>
  getCertificatePdf(new Request(`http://app.test/api/certificates/${certificateId}/pdf`, { headers: cookie ? { cookie } : {} }), {
    params: Promise.resolve({ certificateId }),
  });

beforeAll(async () => {
  cohort = await createCertificateCohort();
  instructor = await createAccount({ role: "instructor", name: "Orla Fenwick", cohortId: cohort.id });
});

describe("issuing", () => {
  it("issues exactly one certificate when the rule is met, even for two requests at once, and e-mails once", async () => {
    const learner = await learnerWith(passingResults(), "Ines Calloway");
    const results = await Promise.all([issueCertificateIfComplete({ userId: learner.id }), issueCertificateIfComplete({ userId: learner.id })]);
    expect(results.map((r) => r.status).sort()).toEqual(["existing", "issued"]);
    const rows = await certificatesOf(learner.id);
    expect(rows).toHaveLength(1);
    const [row] = rows;
    for (const result of results) expect(result.status !== "not-met" && result.certificate.id).toBe(row!.id);

    expect(row).toMatchObject({
      learnerName: "Ines Calloway",
      courseTitle: course.title,
      courseSlug: course.slug,
      schoolName: "Fernhallow Trades College",
      cohortName: cohort.name,
      cohortId: cohort.id,
      revokedAt: null,
    });
    expect(row!.code).toMatch(/^[0-9A-HJKMNP-TV-Z]{16}$/);
    expect(row!.scoreSummary.labs.map((lab) => [lab.slug, lab.bestScore])).toEqual(
      course.completion.labs.map(({ lab, minScore }) => [lab, Math.min(100, minScore + 10)]),
    );

    const again = await issueCertificateIfComplete({ userId: learner.id });
    expect(again.status).toBe("existing");

    const mail = await waitForMessage({ to: learner.email, subject: /certificate/i });
    const appUrl = readAppEnv().APP_URL;
    expect(findLinks(mail.text)).toEqual([`${appUrl}/certificate`, `${appUrl}/c/${formatCertificateCode(row!.code)}`]);
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(await countMessagesTo(learner.email)).toBe(1);
  });

  it("counts each lab's best passing attempt: a failed attempt's score and a lower earlier pass do not decide", async () => {
    const results = passingResults();
    const capstone = course.completion.labs.at(-1)!;
    results.labScores.set(capstone.lab, capstone.minScore - 20);
    const learner = await learnerWith(results);
    await recordLabAttempt({ userId: learner.id, cohortId: cohort.id, labSlug: capstone.lab, score: 100, passed: false });
    expect((await issueCertificateIfComplete({ userId: learner.id })).status).toBe("not-met");
    await recordLabAttempt({ userId: learner.id, cohortId: cohort.id, labSlug: capstone.lab, score: capstone.minScore, passed: true });
    const result = await issueCertificateIfComplete({ userId: learner.id });
    expect(result.status).toBe("issued");
    const summary = result.status === "issued" ? result.certificate.scoreSummary : null;
    expect(summary!.labs.find((lab) => lab.slug === capstone.lab)!.bestScore).toBe(capstone.minScore);
  });

  it("issues none while one lab's best passing score is under its minimum", async () => {
    const results = passingResults();
    const lab = course.completion.labs[2]!;
    results.labScores.set(lab.lab, lab.minScore - 1);
    const learner = await learnerWith(results);
    const result = await issueCertificateIfComplete({ userId: learner.id });
    expect(result.status).toBe("not-met");
    expect(await certificatesOf(learner.id)).toHaveLength(0);
  });

  it("issues none while a bench exercise is returned, and issues once it is accepted", async () => {
    const results = passingResults();
    const exercise = course.completion.benchExercises[0]!;
    results.benchDecisions.set(exercise, "return");
    const learner = await learnerWith(results);
    expect((await issueCertificateIfComplete({ userId: learner.id })).status).toBe("not-met");
    expect(await certificatesOf(learner.id)).toHaveLength(0);

    await recordResults({
      learnerId: learner.id,
      cohortId: cohort.id,
      reviewerId: instructor.id,
      results: { labScores: new Map(), benchDecisions: new Map([[exercise, "accept"]]) },
    });
    expect((await issueCertificateIfComplete({ userId: learner.id })).status).toBe("issued");
  });

  it("issues none to a learner who has done nothing, nor to an instructor", async () => {
    const idle = await createAccount({ role: "learner", name: "Idle Learner", cohortId: cohort.id });
    expect((await issueCertificateIfComplete({ userId: idle.id })).status).toBe("not-met");
    expect((await issueCertificateIfComplete({ userId: instructor.id })).status).toBe("not-met");
  });
});

describe("the school's signatory", () => {
  it("is set by the school's admin only, validated, and printed on certificates issued after it; earlier ones keep theirs", async () => {
    const school = await createSchool();
    const schoolCohort = await createCertificateCohort({ schoolId: school.id });
    const schoolInstructor = await createAccount({ role: "instructor", name: "Uma Sallow", cohortId: schoolCohort.id, schoolId: school.id });
    const admin = await sessionOf((await createAccount({ role: "admin", name: "Rhea Colt", schoolId: school.id })).id);
    const graduateHere = async (name: string) => {
      const learner = await createAccount({ role: "learner", name, cohortId: schoolCohort.id, schoolId: school.id });
      await recordResults({ learnerId: learner.id, cohortId: schoolCohort.id, reviewerId: schoolInstructor.id, results: passingResults() });
      const result = await issueCertificateIfComplete({ userId: learner.id });
      if (result.status !== "issued") throw new Error(`expected a new certificate, got ${result.status}`);
      return result.certificate;
    };
    const signatoryOnCheck = async (code: string) => {
      const result = await verifyCertificate({ code, clientAddress: uniqueAddress() });
      return result.status === "valid" ? result.signatory : `not valid: ${result.status}`;
    };

    const before = await graduateHere("Ivo Partridge");
    expect(await signatoryOnCheck(before.code)).toBeNull();

    const learnerSession = await sessionOf((await createAccount({ role: "learner", name: "Nell Agar", cohortId: schoolCohort.id, schoolId: school.id })).id);
    expect(await setSchoolSignatory({ admin: learnerSession.user, input: { signatoryName: "Nell Agar", signatoryRole: "Learner" } })).toEqual({ status: "forbidden" });
    const tooLong = await setSchoolSignatory({ admin: admin.user, input: { signatoryName: "x".repeat(81), signatoryRole: "Head of department" } });
    expect(tooLong.status).toBe("invalid");
    const missing = await setSchoolSignatory({ admin: admin.user, input: { signatoryName: "Rhea Colt", signatoryRole: null } });
    expect(missing.status).toBe("invalid");
    const controlled = await setSchoolSignatory({ admin: admin.user, input: { signatoryName: "Rhea\u0007 Colt", signatoryRole: "Principal" } });
    expect(controlled.status).toBe("invalid");

    expect(await setSchoolSignatory({ admin: admin.user, input: { signatoryName: "  Rhea   Colt ", signatoryRole: "Principal" } })).toEqual({ status: "saved" });
    const first = await graduateHere("Oskar Lind");
    expect(await signatoryOnCheck(first.code)).toEqual({ name: "Rhea Colt", role: "Principal" });

    expect(await setSchoolSignatory({ admin: admin.user, input: { signatoryName: "Tove Brandt", signatoryRole: "Head of electrical trades" } })).toEqual({ status: "saved" });
    const second = await graduateHere("Pia Nordal");
    expect(await signatoryOnCheck(second.code)).toEqual({ name: "Tove Brandt", role: "Head of electrical trades" });
    // Issued certificates keep what they were issued with.
    expect(await signatoryOnCheck(first.code)).toEqual({ name: "Rhea Colt", role: "Principal" });
    expect(await signatoryOnCheck(before.code)).toBeNull();
  });
});

describe("the public check", () => {
  it("shows a valid certificate's own words and nothing else", async () => {
    const { certificate } = await graduate("Bea Whitlock");
    const result = await verifyCertificate({ code: formatCertificateCode(certificate.code), clientAddress: uniqueAddress() });
    expect(result).toEqual({
      status: "valid",
      code: certificate.code,
      learnerName: "Bea Whitlock",
      courseTitle: course.title,
      schoolName: "Fernhallow Trades College",
      issuedAt: certificate.issuedAt,
      competences: course.competences.map((competence) => competence.statement),
      studyHours: courseCertification(course).studyHours,
      signatory: null,
    });
    const typed = await verifyCertificate({ code: certificate.code.toLowerCase(), clientAddress: uniqueAddress() });
    expect(typed.status).toBe("valid");
  });

  it("says a revoked certificate was revoked, with the date, without the learner's name or the reason", async () => {
    const { certificate } = await graduate("Cal Merriday");
    const admin = await sessionOf((await createAccount({ role: "admin", name: "Ada Quill" })).id);
    const revokedAt = new Date("2026-05-04T09:30:00Z");
    expect(await revokeCertificate({ admin: admin.user, input: { certificateId: certificate.id, reason: "Bench photos were not the learner's own work." }, now: revokedAt })).toEqual({
      status: "revoked",
    });
    const result = await verifyCertificate({ code: certificate.code, clientAddress: uniqueAddress() });
    expect(result).toEqual({ status: "revoked", code: certificate.code, courseTitle: course.title, schoolName: "Fernhallow Trades College", revokedAt });
    expect(JSON.stringify(result)).not.toContain("Cal Merriday");
  });

  it("answers not found for an unknown code and for malformed ones, asking the database nothing for the latter", async () => {
    const unknown = encodeCertificateCode(randomBytes(10));
    expect(await verifyCertificate({ code: unknown, clientAddress: uniqueAddress() })).toEqual({ status: "not-found" });
    const address = uniqueAddress();
    for (const code of ["", "hello", "7K2M-QX9P-4TDW-8HB", "7K2M-QX9P-4TDW-8HBU", "'; drop table certificates; --", "%00".repeat(20)]) {
      expect(await verifyCertificate({ code, clientAddress: address })).toEqual({ status: "not-found" });
    }
    // No count was even started for the address: the malformed codes never reached the database.
    expect(await db.$count(rateLimits, like(rateLimits.key, `%${address}`))).toBe(0);
  });

  it("limits look-ups per client address and leaves other addresses alone", async () => {
    const { certificate } = await graduate();
    const address = uniqueAddress();
    for (let i = 0; i < lookupLimit.points; i++) {
      expect((await verifyCertificate({ code: certificate.code, clientAddress: address })).status, `look-up ${i + 1}`).toBe("valid");
    }
    const refused = await verifyCertificate({ code: certificate.code, clientAddress: address });
    expect(refused.status).toBe("rate-limited");
    if (refused.status !== "rate-limited") return;
    expect(refused.retryAfterSeconds).toBeGreaterThan(lookupLimit.windowSeconds - 30);
    expect(refused.retryAfterSeconds).toBeLessThanOrEqual(lookupLimit.windowSeconds);
    expect((await verifyCertificate({ code: encodeCertificateCode(randomBytes(10)), clientAddress: address })).status).toBe("rate-limited");
    expect((await verifyCertificate({ code: certificate.code, clientAddress: uniqueAddress() })).status).toBe("valid");

    // Once the window is over the address starts afresh (its end is moved forward, not waited for).
    await db.update(rateLimits).set({ expire: Date.now() - 1 }).where(eq(rateLimits.key, `certificate-lookup:address:${address}`));
    expect((await verifyCertificate({ code: certificate.code, clientAddress: address })).status).toBe("valid");
  });
});

describe("the public check for programs", () => {
  const ask = (code: string, address: string) =>
    getVerification(new Request(`http://app.test/api/certificates/verify/${code}`, { headers: fromAddress(address) }), {
      params: Promise.resolve({ code }),
    });

  it("answers 200 with the certificate's words, 404 for unknown and malformed codes, 429 past the limit", async () => {
    const { certificate } = await graduate("Dara Millhouse");
    const address = uniqueAddress();
    const valid = await ask(formatCertificateCode(certificate.code), address);
    expect(valid.status).toBe(200);
    expect(await valid.json()).toEqual({
      status: "valid",
      code: formatCertificateCode(certificate.code),
      learnerName: "Dara Millhouse",
      courseTitle: course.title,
      schoolName: "Fernhallow Trades College",
      issuedAt: certificate.issuedAt.toISOString(),
      competences: course.competences.map((competence) => competence.statement),
      studyHours: courseCertification(course).studyHours,
      signatory: null,
    });
    expect((await ask(encodeCertificateCode(randomBytes(10)), address)).status).toBe(404);
    expect((await ask("not-a-code", address)).status).toBe(404);
    for (let i = 2; i < lookupLimit.points; i++) await ask(certificate.code, address);
    const limited = await ask(certificate.code, address);
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThan(lookupLimit.windowSeconds - 30);
    expect(await limited.json()).toEqual({
      error: { code: "rate-limited", message: expect.stringMatching(/^Too many checks from your network\. Wait \d+ minutes?, then try again\.$/) },
    });
    expect((await ask(certificate.code, uniqueAddress())).status).toBe(200);
  });
});

describe("revocation", () => {
  it("is for admins of the issuing school only, needs a reason, and happens once", async () => {
    const { learner, certificate } = await graduate();
    const otherSchool = await createSchool();
    const outsider = await sessionOf((await createAccount({ role: "admin", name: "Oswin Pell", schoolId: otherSchool.id })).id);
    const admin = await sessionOf((await createAccount({ role: "admin", name: "Ada Quill" })).id);
    const asLearner = await sessionOf(learner.id);
    const asInstructor = await sessionOf(instructor.id);
    const reason = "Issued to the wrong account by mistake.";

    expect(await revokeCertificate({ admin: asLearner.user, input: { certificateId: certificate.id, reason } })).toEqual({ status: "forbidden" });
    expect(await revokeCertificate({ admin: asInstructor.user, input: { certificateId: certificate.id, reason } })).toEqual({ status: "forbidden" });
    expect(await revokeCertificate({ admin: outsider.user, input: { certificateId: certificate.id, reason } })).toEqual({ status: "not-found" });
    const short = await revokeCertificate({ admin: admin.user, input: { certificateId: certificate.id, reason: "no" } });
    expect(short.status).toBe("invalid");
    expect(await revokeCertificate({ admin: admin.user, input: { certificateId: "not-a-uuid", reason } })).toMatchObject({ status: "invalid" });
    expect((await certificatesOf(learner.id))[0]!.revokedAt).toBeNull();

    expect(await revokeCertificate({ admin: admin.user, input: { certificateId: certificate.id, reason } })).toEqual({ status: "revoked" });
    const [row] = await certificatesOf(learner.id);
    expect(row).toMatchObject({ revokeReason: reason, revokedBy: admin.user.id });
    expect(row!.revokedAt).toBeInstanceOf(Date);
    expect(await revokeCertificate({ admin: admin.user, input: { certificateId: certificate.id, reason } })).toEqual({ status: "not-found" });

    // A revoked certificate stays the learner's one certificate: checking again does not issue another.
    expect((await issueCertificateIfComplete({ userId: learner.id })).status).toBe("existing");
    expect(await db.$count(certificates, and(eq(certificates.userId, learner.id)))).toBe(1);
  });
});

describe("the PDF download", () => {
  it("serves the learner their certificate, whose text and QR code read back", async () => {
    const { learner, certificate } = await graduate("Priya Castellanos-Ng");
    const owner = await sessionOf(learner.id);
    const response = await pdfRequest(certificate.id, owner.cookie);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    expect(response.headers.get("content-disposition")).toContain(`certificate-${formatCertificateCode(certificate.code)}.pdf`);
    const read = await readCertificatePdf(new Uint8Array(await response.arrayBuffer()));
    expect(read.text).toContain("Priya Castellanos-Ng");
    expect(read.text).toContain(formatCertificateCode(certificate.code));
    expect(read.qrText).toBe(`${readAppEnv().APP_URL}/c/${formatCertificateCode(certificate.code)}`);
  });

  it("serves the school's admins too, answers 404 to anyone else and 401 without a session", async () => {
    const { certificate } = await graduate();
    const admin = await sessionOf((await createAccount({ role: "admin", name: "Ada Quill" })).id);
    const otherLearner = await sessionOf((await createAccount({ role: "learner", name: "Nosy Learner", cohortId: cohort.id })).id);
    const otherSchool = await createSchool();
    const outsider = await sessionOf((await createAccount({ role: "admin", name: "Oswin Pell", schoolId: otherSchool.id })).id);
    const teacher = await sessionOf(instructor.id);

    expect((await pdfRequest(certificate.id, admin.cookie)).status).toBe(200);
    expect((await pdfRequest(certificate.id, otherLearner.cookie)).status).toBe(404);
    expect((await pdfRequest(certificate.id, outsider.cookie)).status).toBe(404);
    expect((await pdfRequest(certificate.id, teacher.cookie)).status).toBe(404);
    expect((await pdfRequest(certificate.id)).status).toBe(401);
    expect((await pdfRequest("not-a-uuid", admin.cookie)).status).toBe(404);
  });

  it("is not served once revoked: the request goes to the public page that says so", async () => {
    const { learner, certificate } = await graduate();
    const admin = await sessionOf((await createAccount({ role: "admin", name: "Ada Quill" })).id);
    await revokeCertificate({ admin: admin.user, input: { certificateId: certificate.id, reason: "Issued to the wrong account by mistake." } });
    const response = await pdfRequest(certificate.id, (await sessionOf(learner.id)).cookie);
    expect(response.status).toBe(303);
    expect(response.headers.get("location")).toBe(`/c/${formatCertificateCode(certificate.code)}`);
    expect(response.headers.get("content-type")).not.toBe("application/pdf");
  });
});
