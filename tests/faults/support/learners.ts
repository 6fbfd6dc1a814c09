import { db } from "@/db/client";
import { markLessonsCompleted } from "@/db/queries/progress";
import { cohortMemberships } from "@/db/schema";
import { getCourse, getLessonOfLab } from "@/lessons";
import { createSession } from "@/lib/auth/session-store";
import { createPerson } from "../../integration/support/people";

export type FaultLearner = { id: string; cookie: string };

/** A learner of the cohort with the lessons before the lab done (so it is open) and a session. */
export async function readyLearnerAtLab(params: { cohortId: string; labSlug: string; label: string }): Promise<FaultLearner> {
  const person = await createPerson({ role: "learner", password: "pulled plug", label: params.label });
  await db.insert(cohortMemberships).values({ cohortId: params.cohortId, userId: person.id, role: "learner" });
  const lessonNumber = getLessonOfLab(params.labSlug)!.number;
  const earlier = getCourse().lessons.filter((lesson) => lesson.number < lessonNumber);
  await markLessonsCompleted({ userId: person.id, completions: earlier.map((lesson) => ({ lessonSlug: lesson.slug, completedAt: new Date() })) });
  const cookie = await createSession(person.id);
  return { id: person.id, cookie: `${cookie.name}=${cookie.value}` };
}
