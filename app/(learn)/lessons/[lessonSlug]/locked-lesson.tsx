import { LockedPage } from "@/components/lesson/locked-page";
import type { LessonProgressView } from "@/lib/progress";

/** What a learner sees on opening a lesson that is not open to them yet. */
export function LockedLesson({ lesson }: { lesson: LessonProgressView }) {
  const before = lesson.waitsFor!;
  return (
    <LockedPage lesson={lesson} code={`Lesson ${lesson.number} · locked`}>
      <p>
        <strong className="text-ink">{lesson.title}</strong> opens when lesson {before.number}, {before.title}, is done: its lab passed on
        the workbench and each of its quick checks answered correctly.
      </p>
      <p>The lessons build on one another, so this course opens them in order.</p>
    </LockedPage>
  );
}
