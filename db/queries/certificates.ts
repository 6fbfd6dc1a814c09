import { and, desc, eq, isNull, sql } from "drizzle-orm";
import { db } from "../client";
import type { Executor } from "../connection";
import { findLearnerCohort } from "./cohorts";
import {
  benchReviews,
  benchSubmissions,
  certificates,
  labAttempts,
  schools,
  users,
  type Certificate,
  type CertificateCertification,
  type CertificateScoreSummary,
  type Role,
} from "../schema";

export type LearnerCertificateFacts = {
  learner: {
    id: string;
    name: string;
    email: string;
    role: Role;
    active: boolean;
    schoolId: string;
    schoolName: string;
    schoolSignatoryName: string | null;
    schoolSignatoryRole: string | null;
  };
  cohort: { id: string; name: string } | null;
  bestPassingScores: Map<string, number>;
  acceptedBenchWork: Map<string, { points: number; maxPoints: number }>;
};

async function findLearnerFacts(executor: Executor, params: { userId: string; courseSlug: string }): Promise<LearnerCertificateFacts | null> {
  const [learner] = await executor
    .select({
      id: users.id,
      name: users.name,
      email: users.email,
      role: users.role,
      active: users.active,
      schoolId: users.schoolId,
      schoolName: schools.name,
      schoolSignatoryName: schools.signatoryName,
      schoolSignatoryRole: schools.signatoryRole,
    })
    .from(users)
    .innerJoin(schools, eq(schools.id, users.schoolId))
    .where(eq(users.id, params.userId));
  if (!learner) return null;

  const cohort = await findLearnerCohort(params, executor);

  const scores = await executor
    .select({ labSlug: labAttempts.labSlug, best: sql<number>`max(${labAttempts.score})::int` })
    .from(labAttempts)
    .where(and(eq(labAttempts.userId, params.userId), eq(labAttempts.passed, true)))
    .groupBy(labAttempts.labSlug);

  // Accepted work with the points of its latest accepting review.
  const accepted = await executor
    .selectDistinctOn([benchSubmissions.exerciseSlug], {
      exerciseSlug: benchSubmissions.exerciseSlug,
      points: benchReviews.total,
      maxPoints: benchReviews.maxTotal,
    })
    .from(benchSubmissions)
    .innerJoin(benchReviews, and(eq(benchReviews.submissionId, benchSubmissions.id), eq(benchReviews.decision, "accept")))
    .where(and(eq(benchSubmissions.learnerId, params.userId), eq(benchSubmissions.status, "accepted")))
    .orderBy(benchSubmissions.exerciseSlug, desc(benchReviews.createdAt));

  return {
    learner,
    cohort,
    bestPassingScores: new Map(scores.map((row) => [row.labSlug, row.best])),
    acceptedBenchWork: new Map(accepted.map((row) => [row.exerciseSlug, { points: row.points, maxPoints: row.maxPoints }])),
  };
}

export async function findLearnerCertificateFacts(params: { userId: string; courseSlug: string }): Promise<LearnerCertificateFacts | null> {
  return findLearnerFacts(db, params);
}

export type CertificateContent = {
  code: string;
  learnerName: string;
  courseTitle: string;
  schoolName: string;
  cohortName: string | null;
  scoreSummary: CertificateScoreSummary;
  certification: CertificateCertification;
  signatoryName: string | null;
  signatoryRole: string | null;
};

export type IssueResult =
  | { status: "issued"; certificate: Certificate; learnerEmail: string }
  | { status: "existing"; certificate: Certificate }
  | { status: "not-met"; facts: LearnerCertificateFacts | null };

/**
 * In one transaction: the learner's existing certificate for the course, or else their results
 * read afresh and, when `decide` finds the rule met, a new certificate. Two calls at once insert
 * one row: the unique (learner, course) constraint makes the second insert wait for the first and
 * then do nothing, and the second call returns the first call's certificate as "existing".
 */
export async function issueCertificateOnce(params: {
  userId: string;
  courseSlug: string;
  decide: (facts: LearnerCertificateFacts) => CertificateContent | null;
}): Promise<IssueResult> {
  return db.transaction(async (tx) => {
    const existing = await findCertificateByLearner(tx, params);
    if (existing) return { status: "existing", certificate: existing };
    const facts = await findLearnerFacts(tx, params);
    const content = facts && params.decide(facts);
    if (!facts || !content) return { status: "not-met", facts };
    const [inserted] = await tx
      .insert(certificates)
      .values({
        ...content,
        userId: params.userId,
        courseSlug: params.courseSlug,
        schoolId: facts.learner.schoolId,
        cohortId: facts.cohort?.id ?? null,
      })
      .onConflictDoNothing({ target: [certificates.userId, certificates.courseSlug] })
      .returning();
    if (inserted) return { status: "issued", certificate: inserted, learnerEmail: facts.learner.email };
    const winner = await findCertificateByLearner(tx, params);
    if (!winner) throw new Error("A certificate insert was skipped but no certificate exists for the learner.");
    return { status: "existing", certificate: winner };
  });
}

async function findCertificateByLearner(executor: Executor, params: { userId: string; courseSlug: string }) {
  const [row] = await executor
    .select()
    .from(certificates)
    .where(and(eq(certificates.userId, params.userId), eq(certificates.courseSlug, params.courseSlug)));
  return row;
}

export async function findCertificateForLearner(params: { userId: string; courseSlug: string }): Promise<Certificate | undefined> {
  return findCertificateByLearner(db, params);
}

export async function findCertificateByCode(params: { code: string }): Promise<Certificate | undefined> {
  const [row] = await db.select().from(certificates).where(eq(certificates.code, params.code));
  return row;
}

export async function findCertificateById(params: { certificateId: string }): Promise<Certificate | undefined> {
  const [row] = await db.select().from(certificates).where(eq(certificates.id, params.certificateId));
  return row;
}

export type SchoolCertificateRow = Certificate & { revokedByName: string | null };

/** The school's certificates, newest first, with the name of whoever revoked one. */
export async function listCertificatesBySchool(params: { schoolId: string }): Promise<SchoolCertificateRow[]> {
  const rows = await db
    .select({ certificate: certificates, revokedByName: users.name })
    .from(certificates)
    .leftJoin(users, eq(users.id, certificates.revokedBy))
    .where(eq(certificates.schoolId, params.schoolId))
    .orderBy(desc(certificates.issuedAt));
  return rows.map((row) => ({ ...row.certificate, revokedByName: row.revokedByName }));
}

/** Revokes a certificate of the school that is not revoked yet; undefined when there is none such. */
export async function revokeCertificateInSchool(params: {
  certificateId: string;
  schoolId: string;
  reason: string;
  revokedBy: string;
  now: Date;
}): Promise<Certificate | undefined> {
  const [row] = await db
    .update(certificates)
    .set({ revokedAt: params.now, revokeReason: params.reason, revokedBy: params.revokedBy })
    .where(
      and(
        eq(certificates.id, params.certificateId),
        eq(certificates.schoolId, params.schoolId),
        isNull(certificates.revokedAt),
      ),
    )
    .returning();
  return row;
}
