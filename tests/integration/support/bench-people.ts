import { randomUUID } from "node:crypto";
import { db } from "@/db/client";
import { markLessonsCompleted } from "@/db/queries/progress";
import { cohortMemberships, cohorts, schools, users, type Role } from "@/db/schema";
import { getCourse } from "@/lessons";
import { hashPassword } from "@/lib/auth/password";
import { createSession, validateSessionToken, type SessionUser } from "@/lib/auth/session-store";
import { findDemoSchoolId, uniqueEmail } from "./people";

// Bench tests work in a school of their own, with two cohorts of the course, an instructor each,
// learners and an admin, so they never depend on or change what the demo school shows.

export type SignedIn = { user: SessionUser; cookie: string };

/**
 * Bench exercises open with their lessons: the lessons before the last one holding an exercise
 * are recorded as done, so every bench exercise is open to the learner.
 */
export async function openBenchExercises(userId: string): Promise<void> {
  const lessons = getCourse().lessons;
  const last = Math.max(...lessons.flatMap((lesson) => (lesson.bench ? [lesson.number] : [])));
  const earlier = lessons.filter((lesson) => lesson.number < last);
  await markLessonsCompleted({ userId, completions: earlier.map((lesson) => ({ lessonSlug: lesson.slug, completedAt: new Date() })) });
}

const password = "bench test password";
let passwordHash: Promise<string> | undefined;

export async function signIn(userId: string): Promise<SignedIn> {
  const cookie = await createSession(userId);
  const { user } = await validateSessionToken(cookie.value);
  if (!user) throw new Error("a fresh session did not validate");
  return { user, cookie: `${cookie.name}=${cookie.value}` };
}

async function insertUser(schoolId: string, role: Role, label: string, name: string) {
  const [user] = await db
    .insert(users)
    .values({ schoolId, email: uniqueEmail(label), name, role, passwordHash: await (passwordHash ??= hashPassword(password)) })
    .returning();
  return user!;
}

export type BenchSchool = Awaited<ReturnType<typeof createBenchSchool>>;

export async function createBenchSchool() {
  const suffix = randomUUID().slice(0, 8);
  const [school] = await db.insert(schools).values({ slug: `bench-${suffix}`, name: `Bench test school ${suffix}` }).returning();
  const schoolId = school!.id;
  const createCohort = async (label: string) => {
    const [cohort] = await db
      .insert(cohorts)
      .values({ schoolId, name: `Bench ${label}`, courseSlug: "data-runs", startsOn: "2026-01-05", endsOn: "2026-06-26" })
      .returning({ id: cohorts.id });
    return cohort!.id;
  };
  const homeCohortId = await createCohort("home");
  const otherCohortId = await createCohort("other");

  /** A signed-in member of the school; in `cohortId` when given. A learner has the lessons up to the bench exercises done. */
  const createMember = async (cohortId: string | null, role: Role, label: string): Promise<SignedIn> => {
    const user = await insertUser(schoolId, role, label, `Test ${role}`);
    if (cohortId && role !== "admin") await db.insert(cohortMemberships).values({ cohortId, userId: user.id, role });
    if (role === "learner") await openBenchExercises(user.id);
    return signIn(user.id);
  };

  return {
    homeCohortId,
    otherCohortId,
    createMember,
    homeInstructor: await createMember(homeCohortId, "instructor", "bench-instructor"),
    otherInstructor: await createMember(otherCohortId, "instructor", "bench-other-instructor"),
    otherLearner: await createMember(homeCohortId, "learner", "bench-other-learner"),
    admin: await createMember(null, "admin", "bench-admin"),
  };
}

/** A learner of the demo school with a name no other test uses, who signs in with `password`, with every bench exercise open. */
export async function createNamedLearner(params: { cohortId: string; name: string; password: string }) {
  const [user] = await db
    .insert(users)
    .values({
      schoolId: await findDemoSchoolId(),
      email: uniqueEmail("bench-learner"),
      name: params.name,
      role: "learner",
      passwordHash: await hashPassword(params.password),
    })
    .returning();
  await db.insert(cohortMemberships).values({ cohortId: params.cohortId, userId: user!.id, role: "learner" });
  await openBenchExercises(user!.id);
  return user!;
}
