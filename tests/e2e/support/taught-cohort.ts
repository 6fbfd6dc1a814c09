import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { demoCohorts } from "@/db/demo-data";
import { cohortMemberships, cohorts, users } from "@/db/schema";
import { getCourse } from "@/lessons";

const day = 86_400_000;
const isoDay = (offsetDays: number) => new Date(Date.now() + offsetDays * day).toISOString().slice(0, 10);

/** A new cohort of the demo school, taught by the seeded instructor who signs in as "instructor". */
export async function createTaughtCohort(params: { name: string; startedDaysAgo: number; endsInDays: number }) {
  const [instructor] = await db.select().from(users).where(eq(users.email, demoCohorts[0].instructor.email));
  if (!instructor) throw new Error("The seeded instructor is missing: run the seed before the browser tests.");
  const [cohort] = await db
    .insert(cohorts)
    .values({ schoolId: instructor.schoolId, name: params.name, courseSlug: getCourse().slug, startsOn: isoDay(-params.startedDaysAgo), endsOn: isoDay(params.endsInDays) })
    .returning();
  await db.insert(cohortMemberships).values({ cohortId: cohort!.id, userId: instructor.id, role: "instructor" });
  return { cohortId: cohort!.id, schoolId: instructor.schoolId };
}
