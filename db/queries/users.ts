import { asc, eq } from "drizzle-orm";
import { db } from "../client";
import { users, type User } from "../schema";

export async function findUserByEmail(params: { email: string }): Promise<User | undefined> {
  const [user] = await db.select().from(users).where(eq(users.email, params.email)).limit(1);
  return user;
}

/**
 * The password hash of an account made by enrolment before its owner accepted the invitation. It
 * is no valid hash, so no password matches it; accepting the invitation replaces it.
 */
export const unsetPasswordHash = "!unset";

export type SchoolPerson = Pick<User, "id" | "name" | "email" | "role" | "active">;

export async function listUsersBySchool(params: { schoolId: string }): Promise<SchoolPerson[]> {
  return db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, active: users.active })
    .from(users)
    .where(eq(users.schoolId, params.schoolId))
    .orderBy(asc(users.role), asc(users.name));
}
