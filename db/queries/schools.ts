import { and, eq, sql } from "drizzle-orm";
import { db } from "../client";
import { invitations, schools, users, type School } from "../schema";

export async function findSchoolById(params: { schoolId: string }): Promise<School | undefined> {
  const [school] = await db.select().from(schools).where(eq(schools.id, params.schoolId)).limit(1);
  return school;
}

/** Which of `emails` (lower-case) belong to the school's accounts or were invited by the school. */
export async function findAddressesKnownToSchool(params: { schoolId: string; emails: string[] }): Promise<Set<string>> {
  if (params.emails.length === 0) return new Set();
  // One array parameter, however many addresses a long-running sink has caught.
  const listed = sql`any(${sql.param(params.emails)}::text[])`;
  const rows = await db
    .select({ email: users.email })
    .from(users)
    .where(and(eq(users.schoolId, params.schoolId), sql`${users.email} = ${listed}`))
    .union(
      db
        .select({ email: invitations.email })
        .from(invitations)
        .where(and(eq(invitations.schoolId, params.schoolId), sql`${invitations.email} = ${listed}`)),
    );
  return new Set(rows.map((row) => row.email));
}

/** Names who signs the school's certificates from now on; certificates already issued keep theirs. */
export async function updateSchoolSignatory(params: { schoolId: string; signatoryName: string; signatoryRole: string }): Promise<void> {
  await db
    .update(schools)
    .set({ signatoryName: params.signatoryName, signatoryRole: params.signatoryRole })
    .where(eq(schools.id, params.schoolId));
}
