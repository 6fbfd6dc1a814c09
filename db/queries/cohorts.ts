import { and, asc, desc, eq, getTableColumns, sql } from "drizzle-orm";
import { db } from "../client";
import type { Executor } from "../connection";
import { cohortMemberships, cohorts, users, type Cohort, type CohortRole } from "../schema";

export type CohortSummary = Cohort & { learnerCount: number; instructorNames: string[] };

// "cohorts".id spelled out: in a single-table select the column would render unqualified, and
// inside the subquery a bare "id" binds to the joined users row instead of the cohort.
const learnerCount = sql<number>`(
  select count(*)::int from ${cohortMemberships} m
  where m.cohort_id = ${cohorts}.id and m.role = 'learner'
)`;
const instructorNames = sql<string[]>`coalesce((
  select array_agg(u.name order by u.name) from ${cohortMemberships} m
  join ${users} u on u.id = m.user_id
  where m.cohort_id = ${cohorts}.id and m.role = 'instructor'
), '{}')`;

export async function listCohortsBySchool(params: { schoolId: string }): Promise<CohortSummary[]> {
  return db
    .select({ ...getTableColumns(cohorts), learnerCount, instructorNames })
    .from(cohorts)
    .where(eq(cohorts.schoolId, params.schoolId))
    .orderBy(asc(cohorts.startsOn), asc(cohorts.name));
}

export async function listCohortsByMember(params: { userId: string; role: CohortRole }): Promise<CohortSummary[]> {
  return db
    .select({ ...getTableColumns(cohorts), learnerCount, instructorNames })
    .from(cohorts)
    .innerJoin(cohortMemberships, eq(cohortMemberships.cohortId, cohorts.id))
    .where(and(eq(cohortMemberships.userId, params.userId), eq(cohortMemberships.role, params.role)))
    .orderBy(asc(cohorts.startsOn), asc(cohorts.name));
}

/** The cohort, only if the user is one of its instructors. */
export async function findCohortTaughtBy(params: { cohortId: string; instructorId: string }): Promise<Cohort | undefined> {
  const [row] = await db
    .select(getTableColumns(cohorts))
    .from(cohorts)
    .innerJoin(cohortMemberships, eq(cohortMemberships.cohortId, cohorts.id))
    .where(
      and(
        eq(cohorts.id, params.cohortId),
        eq(cohortMemberships.userId, params.instructorId),
        eq(cohortMemberships.role, "instructor"),
      ),
    )
    .limit(1);
  return row;
}

export async function findCohortInSchool(params: { cohortId: string; schoolId: string }): Promise<Cohort | undefined> {
  const [row] = await db
    .select()
    .from(cohorts)
    .where(and(eq(cohorts.id, params.cohortId), eq(cohorts.schoolId, params.schoolId)))
    .limit(1);
  return row;
}

export type CohortMember = { userId: string; name: string; email: string; role: CohortRole; active: boolean };

export async function listCohortMembers(params: { cohortId: string; role: CohortRole }): Promise<CohortMember[]> {
  return db
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      role: cohortMemberships.role,
      active: users.active,
    })
    .from(cohortMemberships)
    .innerJoin(users, eq(users.id, cohortMemberships.userId))
    .where(and(eq(cohortMemberships.cohortId, params.cohortId), eq(cohortMemberships.role, params.role)))
    .orderBy(asc(users.name));
}

/** The learner's cohort for a course: the latest-starting one when they were moved between cohorts. */
/** The learner's cohort for a course: the latest-starting one when they were moved between cohorts. */
export async function findLearnerCohort(
  params: { userId: string; courseSlug: string },
  executor: Executor = db,
): Promise<{ id: string; name: string } | null> {
  const [row] = await executor
    .select({ id: cohorts.id, name: cohorts.name })
    .from(cohortMemberships)
    .innerJoin(cohorts, eq(cohorts.id, cohortMemberships.cohortId))
    .where(
      and(
        eq(cohortMemberships.userId, params.userId),
        eq(cohortMemberships.role, "learner"),
        eq(cohorts.courseSlug, params.courseSlug),
      ),
    )
    .orderBy(desc(cohorts.startsOn))
    .limit(1);
  return row ?? null;
}

export async function findLearnerCohortId(params: { userId: string; courseSlug: string }): Promise<string | null> {
  return (await findLearnerCohort(params))?.id ?? null;
}
