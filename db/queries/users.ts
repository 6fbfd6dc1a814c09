import { asc, eq } from "drizzle-orm";
import { db } from "../client";
import { users, type User } from "../schema";

export async function findUserByEmail(params: { email: string }): Promise<User | undefined> {
  const [user] = await db.select().from(users).where(eq(users.email, params.email)).limit(1);
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
