import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import { StatusPage } from "@/components/ui/status-page";
import type { LessonProgressView } from "@/lib/progress";

/** What a learner sees on opening the workbench of a lesson that is not open to them yet. */
export function LockedLab({ lesson, labTitle }: { lesson: LessonProgressView; labTitle: string }) {
  const before = lesson.waitsFor!;
  return (
    <StatusPage
      code={`Lab ${lesson.number} · locked`}
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
        <strong className="text-ink">{labTitle}</strong> is the lab of lesson {lesson.number}, {lesson.title}. It opens on the workbench when
        lesson {before.number}, {before.title}, is done.
      </p>
    </StatusPage>
  );
}
