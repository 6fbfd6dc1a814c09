import "server-only";
import { listBenchStatusesByLearner, listLabResultsByLearner, listLessonProgressByLearner, markLessonsCompleted, markLessonStarted } from "@/db/queries/progress";
import { listQuickCheckResultsByLearner } from "@/db/queries/quick-checks";
import { getCourse } from "@/lessons";
import { checkKey, computeCourseProgress, type CourseProgress, type LessonProgressView } from "./course-progress";

export type { BenchState, CourseProgress, LessonProgressView, LessonState } from "./course-progress";

/**
 * The learner's progress through the course, computed from their lab attempts, quick-check answers
 * and lesson rows. Lessons that have met the done rule since the last look get their completion
 * stamped (with the moment the rule was met, not the moment of looking).
 */
export async function getCourseProgress(params: { userId: string }): Promise<CourseProgress> {
  const [labs, checks, lessons, bench] = await Promise.all([
    listLabResultsByLearner(params),
    listQuickCheckResultsByLearner(params),
    listLessonProgressByLearner(params),
    listBenchStatusesByLearner(params),
  ]);
  const progress = computeCourseProgress(getCourse(), {
    labs: new Map(labs.map((row) => [row.labSlug, row])),
    checks: new Map(checks.map((row) => [checkKey(row.lessonSlug, row.checkId), row])),
    lessons: new Map(lessons.map((row) => [row.lessonSlug, row])),
    bench: new Map(bench.map((row) => [row.exerciseSlug, row.status])),
  });
  const completions = progress.lessons.flatMap((lesson) =>
    lesson.completionToRecord && lesson.completedAt ? [{ lessonSlug: lesson.slug, completedAt: lesson.completedAt }] : [],
  );
  if (completions.length > 0) await markLessonsCompleted({ userId: params.userId, completions });
  return progress;
}

export async function findLessonProgressView(params: { userId: string; lessonSlug: string }): Promise<LessonProgressView | undefined> {
  const progress = await getCourseProgress({ userId: params.userId });
  return progress.lessons.find((lesson) => lesson.slug === params.lessonSlug);
}

/** For the workbench's gate: false for a locked lesson and for a slug the course does not have. */
export async function isLessonOpen(params: { userId: string; lessonSlug: string }): Promise<boolean> {
  const lesson = await findLessonProgressView(params);
  return lesson !== undefined && lesson.state !== "locked";
}

export async function recordLessonOpened(params: { userId: string; lessonSlug: string }): Promise<void> {
  await markLessonStarted(params);
}
