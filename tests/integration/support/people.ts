import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { demoAdmin, demoCohorts, demoSchool } from "@/db/demo-data";
import { cohorts, schools, users, type Role } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { peerHeader, peerStamp } from "@/lib/client-address/peer-address";

// Rows for integration tests, made in the seeded demo school with addresses no other test uses.

export function uniqueEmail(label: string): string {
  return `${label}.${randomUUID().slice(0, 8)}@integration.example`;
}

/**
 * A client address from the IPv6 documentation range (RFC 3849), in a /64 network of its own for
 * every call, since IPv6 clients are limited by their /64 (lib/client-address).
 */
export function uniqueAddress(): string {
  const hex = randomUUID().replaceAll("-", "");
  return `2001:db8:${hex.slice(0, 4)}:${hex.slice(4, 8)}::${hex.slice(8, 12)}`;
}

/** Headers of a request that came over a connection from `address`, as the server stamps them. */
export function fromAddress(address: string, headers: Record<string, string> = {}): Record<string, string> {
  return { ...headers, [peerHeader]: peerStamp(address) };
}

export async function findDemoSchoolId(): Promise<string> {
  const [school] = await db.select({ id: schools.id }).from(schools).where(eq(schools.slug, demoSchool.slug));
  if (!school) throw new Error("The demo school is missing: run the seed before the integration tests.");
  return school.id;
}

export async function findDemoCohortId(): Promise<string> {
  const [cohort] = await db.select({ id: cohorts.id }).from(cohorts).where(eq(cohorts.name, demoCohorts[0].name));
  if (!cohort) throw new Error("The demo cohort is missing: run the seed before the integration tests.");
  return cohort.id;
}

export async function findDemoAdmin(): Promise<{ id: string; name: string }> {
  const [admin] = await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.email, demoAdmin.email));
  if (!admin) throw new Error("The demo admin is missing: run the seed before the integration tests.");
  return admin;
}

export async function createPerson(params: { role: Role; password: string; active?: boolean; label?: string }) {
  const email = uniqueEmail(params.label ?? params.role);
  const [user] = await db
    .insert(users)
    .values({
      schoolId: await findDemoSchoolId(),
      email,
      name: `Test ${params.role}`,
      role: params.role,
      passwordHash: await hashPassword(params.password),
      active: params.active ?? true,
    })
    .returning();
  return user!;
}
