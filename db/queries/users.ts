import { and, asc, eq, sql, type SQL } from "drizzle-orm";
import { db } from "../client";
import { unsetPasswordHash, users, type User } from "../schema";

/**
 * An account its owner has set a password for, as opposed to one enrolment made that waits for
 * its invitation. Written as the unique index's own predicate, so lookups by address use it.
 */
export function hasOwnPassword(): SQL {
  return sql`${users.passwordHash} <> ${sql.raw(`'${unsetPasswordHash}'`)}`;
}

/** The account that signs in with this address, if any: accounts waiting for an invitation never do. */
export async function findUserByEmail(params: { email: string }): Promise<User | undefined> {
  const [user] = await db.select().from(users).where(and(eq(users.email, params.email), hasOwnPassword())).limit(1);
  return user;
}

/** The school's account with this address, whether its owner has signed in yet or not. */
export async function findSchoolUserByEmail(params: { schoolId: string; email: string }): Promise<User | undefined> {
  const [user] = await db
    .select()
    .from(users)
    .where(and(eq(users.schoolId, params.schoolId), eq(users.email, params.email)))
    .limit(1);
  return user;
}

export type SchoolPerson = Pick<User, "id" | "name" | "email" | "role" | "active">;

export async function listUsersBySchool(params: { schoolId: string }): Promise<SchoolPerson[]> {
  return db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, active: users.active })
    .from(users)
    .where(eq(users.schoolId, params.schoolId))
    .orderBy(asc(users.role), asc(users.name));
}
