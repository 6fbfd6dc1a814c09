import { and, asc, eq, inArray, notInArray, sql } from "drizzle-orm";
import { db } from "../client";
import type { Transaction } from "../connection";
import { cohortMemberships, cohorts, users, type Cohort } from "../schema";

// Cohorts as the school admin edits them. Every statement is scoped to the admin's school, so a
// cohort or instructor id from another school matches nothing.

export type CohortFields = { name: string; courseSlug: string; startsOn: string; endsOn: string };

export type SaveCohortResult =
  | { ok: true; cohortId: string }
  | { ok: false; reason: "name-taken" | "unknown-instructor" | "not-found" };

class UnknownInstructorError extends Error {}

export function isUniqueViolation(error: unknown, constraint: string): boolean {
  for (let current = error, depth = 0; current instanceof Error && depth < 4; current = current.cause, depth += 1) {
    const { code, constraint: name } = current as { code?: unknown; constraint?: unknown };
    if (code === "23505" && name === constraint) return true;
  }
  return false;
}

/** Makes the cohort's instructors exactly `instructorIds`, all of whom must teach at the school. */
async function replaceInstructors(tx: Transaction, params: { schoolId: string; cohortId: string; instructorIds: string[] }) {
  const ids = [...new Set(params.instructorIds)];
  const removeCondition = and(eq(cohortMemberships.cohortId, params.cohortId), eq(cohortMemberships.role, "instructor"));
  await tx
    .delete(cohortMemberships)
    .where(ids.length > 0 ? and(removeCondition, notInArray(cohortMemberships.userId, ids)) : removeCondition);
  if (ids.length === 0) return;
  const eligible = await tx
    .select({ id: users.id })
    .from(users)
    .where(and(inArray(users.id, ids), eq(users.schoolId, params.schoolId), eq(users.role, "instructor")));
  if (eligible.length !== ids.length) throw new UnknownInstructorError();
  await tx
    .insert(cohortMemberships)
    .values(ids.map((userId) => ({ cohortId: params.cohortId, userId, role: "instructor" as const })))
    .onConflictDoNothing();
}

async function saveCohort(run: (tx: Transaction) => Promise<string | null>): Promise<SaveCohortResult> {
  try {
    const cohortId = await db.transaction(run);
    return cohortId ? { ok: true, cohortId } : { ok: false, reason: "not-found" };
  } catch (error) {
    if (error instanceof UnknownInstructorError) return { ok: false, reason: "unknown-instructor" };
    if (isUniqueViolation(error, "cohorts_school_name_unique")) return { ok: false, reason: "name-taken" };
    throw error;
  }
}

export function createCohort(params: { schoolId: string; fields: CohortFields; instructorIds: string[] }): Promise<SaveCohortResult> {
  return saveCohort(async (tx) => {
    const [cohort] = await tx
      .insert(cohorts)
      .values({ schoolId: params.schoolId, ...params.fields })
      .returning({ id: cohorts.id });
    await replaceInstructors(tx, { schoolId: params.schoolId, cohortId: cohort!.id, instructorIds: params.instructorIds });
    return cohort!.id;
  });
}

export function updateCohort(params: {
  schoolId: string;
  cohortId: string;
  fields: CohortFields;
  instructorIds: string[];
}): Promise<SaveCohortResult> {
  return saveCohort(async (tx) => {
    const [cohort] = await tx
      .update(cohorts)
      .set(params.fields)
      .where(and(eq(cohorts.id, params.cohortId), eq(cohorts.schoolId, params.schoolId)))
      .returning({ id: cohorts.id });
    if (!cohort) return null;
    await replaceInstructors(tx, { schoolId: params.schoolId, cohortId: cohort.id, instructorIds: params.instructorIds });
    return cohort.id;
  });
}

export type AdminCohort = Cohort & { instructorIds: string[] };

export async function findCohortForAdmin(params: { schoolId: string; cohortId: string }): Promise<AdminCohort | undefined> {
  const [row] = await db
    .select({
      cohort: cohorts,
      instructorIds: sql<string[]>`coalesce((
        select array_agg(m.user_id::text order by m.created_at) from ${cohortMemberships} m
        where m.cohort_id = ${cohorts}.id and m.role = 'instructor'
      ), '{}')`,
    })
    .from(cohorts)
    .where(and(eq(cohorts.id, params.cohortId), eq(cohorts.schoolId, params.schoolId)))
    .limit(1);
  return row && { ...row.cohort, instructorIds: row.instructorIds };
}

export type SchoolInstructor = { id: string; name: string; email: string; active: boolean };

export async function listInstructorsBySchool(params: { schoolId: string }): Promise<SchoolInstructor[]> {
  return db
    .select({ id: users.id, name: users.name, email: users.email, active: users.active })
    .from(users)
    .where(and(eq(users.schoolId, params.schoolId), eq(users.role, "instructor")))
    .orderBy(asc(users.name));
}
