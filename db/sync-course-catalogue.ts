import { sql } from "drizzle-orm";
import type { Course } from "@/lessons";
import type { Executor } from "./connection";
import { courses, labs, lessons } from "./schema";

/**
 * Mirrors the course's slugs from lessons/ into the catalogue tables, so attempts and progress can
 * reference them. Upserts only: a lesson removed from lessons/ keeps its row while attempts point
 * at it.
 */
export async function syncCourseCatalogue(executor: Executor, course: Course): Promise<void> {
  await executor.transaction(async (tx) => {
    await tx
      .insert(courses)
      .values({ slug: course.slug, title: course.title, unlockInOrder: course.unlockInOrder })
      .onConflictDoUpdate({
        target: courses.slug,
        set: { title: course.title, unlockInOrder: course.unlockInOrder, syncedAt: sql`now()` },
      });
    for (const lesson of course.lessons) {
      await tx
        .insert(lessons)
        .values({ slug: lesson.slug, courseSlug: course.slug, number: lesson.number, title: lesson.title })
        .onConflictDoUpdate({ target: lessons.slug, set: { number: lesson.number, title: lesson.title } });
      if (lesson.lab) {
        await tx
          .insert(labs)
          .values({ slug: lesson.lab.slug, lessonSlug: lesson.slug, title: lesson.lab.title })
          .onConflictDoUpdate({ target: labs.slug, set: { lessonSlug: lesson.slug, title: lesson.lab.title } });
      }
    }
  });
}
