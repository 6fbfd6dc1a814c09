import { LockedPage } from "@/components/lesson/locked-page";
import type { LessonProgressView } from "@/lib/progress";

/** What a learner sees on opening the bench exercise of a lesson that is not open to them yet. */
export function LockedBench({ lesson, exerciseTitle }: { lesson: LessonProgressView; exerciseTitle: string }) {
  const before = lesson.waitsFor!;
  return (
    <LockedPage lesson={lesson} code={`Bench exercise · lesson ${lesson.number} · locked`}>
      <p>
        <strong className="text-ink">{exerciseTitle}</strong> is the bench exercise of lesson {lesson.number}, {lesson.title}. It opens, with
        the lesson, when lesson {before.number}, {before.title}, is done.
      </p>
    </LockedPage>
  );
}
