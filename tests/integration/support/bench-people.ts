import { randomUUID } from "node:crypto";
import { db } from "@/db/client";
import { cohortMemberships, cohorts, users, type Role } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { createSession, validateSessionToken, type SessionUser } from "@/lib/auth/session-store";
import { createPerson, findDemoSchoolId, uniqueEmail } from "./people";

// Two fresh cohorts of the course, each with its instructor and learners, so bench tests never
// depend on what the seed or another test left behind.

export type SignedIn = { user: SessionUser; cookie: string };

export async function signIn(userId: string): Promise<SignedIn> {
  const cookie = await createSession(userId);
  const { user } = await validateSessionToken(cookie.value);
  if (!user) throw new Error("a fresh session did not validate");
  return { user, cookie: `${cookie.name}=${cookie.value}` };
}

async function createCohort(label: string): Promise<string> {
  const [cohort] = await db
    .insert(cohorts)
    .values({
      schoolId: await findDemoSchoolId(),
      name: `Bench ${label} ${randomUUID().slice(0, 8)}`,
      courseSlug: "data-runs",
      startsOn: "2026-01-05",
      endsOn: "2026-06-26",
    })
    .returning({ id: cohorts.id });
  return cohort!.id;
}

export async function createMember(cohortId: string | null, role: Role, label: string): Promise<SignedIn> {
  const person = await createPerson({ role, password: "bench test password", label });
  if (cohortId && role !== "admin") await db.insert(cohortMemberships).values({ cohortId, userId: person.id, role });
  return signIn(person.id);
}

export async function createBenchCohorts() {
  const [home, other] = [await createCohort("home"), await createCohort("other")];
  return {
    homeCohortId: home,
    otherCohortId: other,
    homeInstructor: await createMember(home, "instructor", "bench-instructor"),
    otherInstructor: await createMember(other, "instructor", "bench-other-instructor"),
    otherLearner: await createMember(home, "learner", "bench-other-learner"),
    admin: await createMember(null, "admin", "bench-admin"),
  };
}

/** A learner with a name no other test uses, in the given cohort, who signs in with `password`. */
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
  return user!;
}
