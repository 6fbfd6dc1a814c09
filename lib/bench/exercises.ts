import { getCourse, type BenchExercise, type Lesson } from "@/lessons";

export type BenchExerciseEntry = { exercise: BenchExercise; lesson: Lesson; courseSlug: string };

/** A bench exercise of the course by its slug, with the lesson it closes. */
export function findBenchExercise(slug: string): BenchExerciseEntry | undefined {
  const course = getCourse();
  const lesson = course.lessons.find((l) => l.bench?.slug === slug);
  return lesson?.bench ? { exercise: lesson.bench, lesson, courseSlug: course.slug } : undefined;
}

export function benchExercisePath(slug: string): string {
  return `/bench/${encodeURIComponent(slug)}`;
}

/** Points the rubric allows in all. */
export function rubricMaximum(exercise: BenchExercise): number {
  return exercise.rubric.reduce((sum, criterion) => sum + criterion.points, 0);
}
