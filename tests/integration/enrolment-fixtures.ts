import { randomUUID } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { cohortMemberships, cohorts, invitations, schools, users, type Role } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { Actor } from "@/lib/enrolment";

// A school of its own for each enrolment test, so counts are exact and the seeded demo school
// (which the browser tests read) is never changed. Every name is invented.

export type TestSchool = { schoolId: string; admin: Actor; cohortId: string; cohortName: string; domain: string };

let hashed: Promise<string> | undefined;
export const staffPassword = "signal bench ground clip";

export async function createSchoolAccount(params: { schoolId: string; role: Role; name: string; email: string }) {
  hashed ??= hashPassword(staffPassword);
  const [user] = await db
    .insert(users)
    .values({ ...params, passwordHash: await hashed })
    .returning({ id: users.id, name: users.name, email: users.email });
  return user!;
}

export async function createTestSchool(label: string): Promise<TestSchool> {
  const tag = randomUUID().slice(0, 8);
  const domain = `${label}-${tag}.example`;
  const [school] = await db
    .insert(schools)
    .values({ slug: `${label}-${tag}`, name: `Wrenfield ${label} institute ${tag}` })
    .returning({ id: schools.id });
  const admin = await createSchoolAccount({ schoolId: school!.id, role: "admin", name: "Orla Fenwick", email: `admin@${domain}` });
  const cohortName = "Pixel runs — spring";
  const [cohort] = await db
    .insert(cohorts)
    .values({ schoolId: school!.id, name: cohortName, courseSlug: "data-runs", startsOn: "2026-03-02", endsOn: "2026-06-26" })
    .returning({ id: cohorts.id });
  return { schoolId: school!.id, admin: { id: admin.id, schoolId: school!.id, name: admin.name }, cohortId: cohort!.id, cohortName, domain };
}

export function csvFile(text: string, name = "roster.csv"): File {
  return new File([text], name, { type: "text/csv" });
}

export function rosterCsv(rows: { name: string; email: string }[], separator = ","): string {
  return ["name" + separator + "email", ...rows.map((row) => `${row.name}${separator}${row.email}`)].join("\n") + "\n";
}

export async function countSchoolRows(params: { schoolId: string; cohortId: string; emails: string[] }) {
  const found = params.emails.length === 0 ? [] : await db.select({ id: users.id }).from(users).where(inArray(users.email, params.emails));
  const memberships = await db.select({ userId: cohortMemberships.userId }).from(cohortMemberships).where(eq(cohortMemberships.cohortId, params.cohortId));
  const issued = await db.select({ id: invitations.id }).from(invitations).where(eq(invitations.schoolId, params.schoolId));
  return { users: found.length, memberships: memberships.length, invitations: issued.length };
}
