import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { benchReviews, benchSubmissions, cohortMemberships, cohorts, labAttempts, schools, users } from "@/db/schema";
import { getCourse } from "@/lessons";
import { hashPassword } from "@/lib/auth/password";
import { findDemoSchoolId, uniqueEmail } from "./support/people";

// Course results written straight into the tables the completion rule reads, so certificate tests
// do not depend on grading runs or the bench upload flow (they have their own tests).

const course = getCourse();

export async function createCertificateCohort(params: { schoolId?: string } = {}): Promise<{ id: string; name: string }> {
  const name = `Certificates ${randomUUID().slice(0, 8)}`;
  const [cohort] = await db
    .insert(cohorts)
    .values({
      schoolId: params.schoolId ?? (await findDemoSchoolId()),
      name,
      courseSlug: course.slug,
      startsOn: "2026-01-05",
      endsOn: "2026-06-26",
    })
    .returning({ id: cohorts.id });
  return { id: cohort!.id, name };
}

export async function createSchool(): Promise<{ id: string; name: string }> {
  const slug = `cert-${randomUUID().slice(0, 8)}`;
  const [school] = await db.insert(schools).values({ slug, name: `Ridgeback Institute ${slug}` }).returning();
  return { id: school!.id, name: school!.name };
}

export async function createAccount(params: {
  role: "learner" | "instructor" | "admin";
  name: string;
  cohortId?: string;
  schoolId?: string;
  password?: string;
}): Promise<{ id: string; email: string; name: string }> {
  const email = uniqueEmail(`certificate-${params.role}`);
  const [user] = await db
    .insert(users)
    .values({
      schoolId: params.schoolId ?? (await findDemoSchoolId()),
      email,
      name: params.name,
      role: params.role,
      passwordHash: await hashPassword(params.password ?? "certificate test password"),
    })
    .returning();
  if (params.cohortId && params.role !== "admin") {
    await db.insert(cohortMemberships).values({ cohortId: params.cohortId, userId: user!.id, role: params.role });
  }
  return { id: user!.id, email, name: params.name };
}

export async function recordLabAttempt(params: { userId: string; cohortId: string; labSlug: string; score: number; passed: boolean }) {
  const earlier = await db.$count(labAttempts, and(eq(labAttempts.userId, params.userId), eq(labAttempts.labSlug, params.labSlug)));
  await db.insert(labAttempts).values({
    userId: params.userId,
    labSlug: params.labSlug,
    cohortId: params.cohortId,
    idempotencyKey: randomUUID(),
    attemptNumber: earlier + 1,
    variantSeed: "certificate-test",
    choices: {},
    outcome: {},
    score: params.score,
    passed: params.passed,
  });
}

export async function recordBenchWork(params: {
  learnerId: string;
  cohortId: string;
  reviewerId: string;
  exerciseSlug: string;
  decision: "accept" | "return";
  points: number;
  maxPoints: number;
}) {
  const [submission] = await db
    .insert(benchSubmissions)
    .values({
      learnerId: params.learnerId,
      cohortId: params.cohortId,
      exerciseSlug: params.exerciseSlug,
      status: params.decision === "accept" ? "accepted" : "returned",
      submittedAt: new Date(),
    })
    .onConflictDoUpdate({
      target: [benchSubmissions.learnerId, benchSubmissions.exerciseSlug],
      set: { status: params.decision === "accept" ? "accepted" : "returned" },
    })
    .returning({ id: benchSubmissions.id });
  await db.insert(benchReviews).values({
    submissionId: submission!.id,
    reviewerId: params.reviewerId,
    scores: {},
    total: params.points,
    maxTotal: params.maxPoints,
    feedback: "Reviewed for the certificate tests.",
    decision: params.decision,
  });
}

export type CourseResults = {
  /** Score of the passing attempt per lab; a lab left out has no passing attempt. */
  labScores: Map<string, number>;
  benchDecisions: Map<string, "accept" | "return">;
};

/** Results that meet the completion rule: every lab ten points over its minimum, all bench work accepted. */
export function passingResults(): CourseResults {
  return {
    labScores: new Map(course.completion.labs.map(({ lab, minScore }) => [lab, Math.min(100, minScore + 10)])),
    benchDecisions: new Map(course.completion.benchExercises.map((slug) => [slug, "accept" as const])),
  };
}

export async function recordResults(params: { learnerId: string; cohortId: string; reviewerId: string; results: CourseResults }) {
  for (const [labSlug, score] of params.results.labScores) {
    await recordLabAttempt({ userId: params.learnerId, cohortId: params.cohortId, labSlug, score, passed: true });
  }
  for (const [exerciseSlug, decision] of params.results.benchDecisions) {
    await recordBenchWork({
      learnerId: params.learnerId,
      cohortId: params.cohortId,
      reviewerId: params.reviewerId,
      exerciseSlug,
      decision,
      points: 8,
      maxPoints: 9,
    });
  }
}
