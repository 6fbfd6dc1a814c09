import "server-only";
import { isLessonOpen } from "@/lib/progress";
import { findBenchExercise } from "./exercises";

/**
 * A bench exercise opens with the lesson it closes: the same unlocking rule as the lesson's text
 * and its lab, checked wherever bench work is started, handed in or given a photo.
 */
export async function isBenchExerciseOpen(params: { userId: string; exerciseSlug: string }): Promise<boolean> {
  const entry = findBenchExercise(params.exerciseSlug);
  return entry !== undefined && (await isLessonOpen({ userId: params.userId, lessonSlug: entry.lesson.slug }));
}
