import { LockedPage } from "@/components/lesson/locked-page";
import type { LessonProgressView } from "@/lib/progress";

/** What a learner sees on opening the workbench of a lesson that is not open to them yet. */
export function LockedLab({ lesson, labTitle }: { lesson: LessonProgressView; labTitle: string }) {
  const before = lesson.waitsFor!;
  return (
    <LockedPage lesson={lesson} code={`Lab ${lesson.number} · locked`}>
      <p>
        <strong className="text-ink">{labTitle}</strong> is the lab of lesson {lesson.number}, {lesson.title}. It opens on the workbench when
        lesson {before.number}, {before.title}, is done.
      </p>
    </LockedPage>
  );
}
