import { eq } from "drizzle-orm";
import { db } from "../client";
import { schools, type School } from "../schema";

export async function findSchoolById(params: { schoolId: string }): Promise<School | undefined> {
  const [school] = await db.select().from(schools).where(eq(schools.id, params.schoolId)).limit(1);
  return school;
}
