import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import { StatusPage } from "@/components/ui/status-page";
import type { LessonProgressView } from "@/lib/progress";

/** What a learner sees on opening a lesson that is not open to them yet. */
export function LockedLesson({ lesson }: { lesson: LessonProgressView }) {
  const before = lesson.waitsFor!;
  return (
    <StatusPage
      code={`Lesson ${lesson.number} · locked`}
      title={`Finish lesson ${before.number} first`}
      actions={
        <>
          <Link href={`/lessons/${before.slug}`} className={buttonClass("primary")}>
            Go to lesson {before.number}
          </Link>
          <Link href="/learn" className={buttonClass("secondary")}>
            Course map
          </Link>
        </>
      }
    >
      <p>
        <strong className="text-ink">{lesson.title}</strong> opens when lesson {before.number}, {before.title}, is done: its lab passed on
        the workbench and each of its quick checks answered correctly.
      </p>
      <p>The lessons build on one another, so this course opens them in order.</p>
    </StatusPage>
  );
}
