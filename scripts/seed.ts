// Demo data for development and tests: one fictional school, its admin, two instructors, two
// cohorts and twelve learners, all with the same documented password. Running it again adds
// only what is missing and never changes a password someone has since set.
import { and, eq } from "drizzle-orm";
import { createDatabase, createPool, type Database } from "../db/connection";
import { seedDemoActivity } from "../db/demo-activity";
import { demoAdmin, demoCohorts, demoLearnerEmail, demoPassword, demoSchool } from "../db/demo-data";
import { cohortMemberships, cohorts, schools, users, type Role } from "../db/schema";
import { hashPassword } from "../lib/auth/password";
import { describeDatabaseFailure } from "../db/describe-failure";
import { readDatabaseEnv } from "../lib/env";

type Account = { role: Role; name: string; email: string; cohort?: string };

async function ensureSchool(db: Database): Promise<string> {
  await db.insert(schools).values(demoSchool).onConflictDoNothing({ target: schools.slug });
  const [school] = await db.select({ id: schools.id }).from(schools).where(eq(schools.slug, demoSchool.slug));
  return school!.id;
}

async function ensureUser(db: Database, schoolId: string, account: Account, passwordHash: () => Promise<string>) {
  // The demo school's own account: another school may have enrolled the same address.
  const [existing] = await db
    .select({ id: users.id })
    .from(users)
    .where(and(eq(users.schoolId, schoolId), eq(users.email, account.email)));
  if (existing) return { id: existing.id, created: false };
  const [created] = await db
    .insert(users)
    .values({ schoolId, email: account.email, name: account.name, role: account.role, passwordHash: await passwordHash() })
    .returning({ id: users.id });
  return { id: created!.id, created: true };
}

async function ensureCohort(db: Database, schoolId: string, cohort: (typeof demoCohorts)[number]): Promise<string> {
  const { name, courseSlug, startsOn, endsOn } = cohort;
  await db.insert(cohorts).values({ schoolId, name, courseSlug, startsOn, endsOn }).onConflictDoNothing();
  const [row] = await db
    .select({ id: cohorts.id })
    .from(cohorts)
    .where(and(eq(cohorts.schoolId, schoolId), eq(cohorts.name, name)));
  return row!.id;
}

async function seed(db: Database): Promise<{ accounts: Account[]; created: number }> {
  let hashed: Promise<string> | undefined;
  const passwordHash = () => (hashed ??= hashPassword(demoPassword));
  const schoolId = await ensureSchool(db);
  const accounts: Account[] = [{ role: "admin", ...demoAdmin }];
  let created = 0;

  const admin = await ensureUser(db, schoolId, accounts[0]!, passwordHash);
  created += Number(admin.created);

  for (const cohort of demoCohorts) {
    const cohortId = await ensureCohort(db, schoolId, cohort);
    const members: Account[] = [
      { role: "instructor", ...cohort.instructor, cohort: cohort.name },
      ...cohort.learners.map((name): Account => ({ role: "learner", name, email: demoLearnerEmail(name), cohort: cohort.name })),
    ];
    for (const member of members) {
      const user = await ensureUser(db, schoolId, member, passwordHash);
      created += Number(user.created);
      await db
        .insert(cohortMemberships)
        .values({ cohortId, userId: user.id, role: member.role === "instructor" ? "instructor" : "learner" })
        .onConflictDoNothing();
      accounts.push(member);
    }
  }
  return { accounts, created };
}

function printAccounts(accounts: Account[], created: number): void {
  console.log(`Demo school "${demoSchool.name}" ready (${created} new account${created === 1 ? "" : "s"}).`);
  console.log(`Demo accounts — password for all: ${demoPassword}`);
  for (const account of accounts) {
    const where = account.cohort ? `  (${account.cohort})` : "";
    console.log(`  ${account.role.padEnd(10)} ${account.email.padEnd(42)} ${account.name}${where}`);
  }
}

async function main(): Promise<void> {
  const pool = createPool(readDatabaseEnv().DATABASE_URL, 2);
  try {
    const db = createDatabase(pool);
    const { accounts, created } = await seed(db);
    printAccounts(accounts, created);
    const activity = await seedDemoActivity(db);
    console.log(
      `Demo activity: ${activity.learners} learner${activity.learners === 1 ? "" : "s"} given ${activity.attempts} lab attempts, ${activity.answers} quick-check answers and ${activity.benchHandIns} bench hand-ins.`,
    );
  } finally {
    await pool.end();
  }
}

main().catch((error: unknown) => {
  console.error(`Seeding failed: ${describeDatabaseFailure(error)}`);
  process.exit(1);
});
