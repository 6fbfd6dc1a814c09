import { markLessonsCompleted } from "@/db/queries/progress";
import { getCourse, getLessonOfLab } from "@/lessons";
import { createPerson } from "../../integration/support/people";

/** A new learner whose lessons before `labSlug`'s are done, so its workbench is open to them. */
export async function createLearnerAtLab(params: { labSlug: string; password: string; label: string }) {
  const person = await createPerson({ role: "learner", password: params.password, label: params.label });
  const labLesson = getLessonOfLab(params.labSlug)!.number;
  const earlier = getCourse().lessons.filter((lesson) => lesson.number < labLesson);
  await markLessonsCompleted({ userId: person.id, completions: earlier.map((lesson) => ({ lessonSlug: lesson.slug, completedAt: new Date() })) });
  return { id: person.id, email: person.email, password: params.password };
}
