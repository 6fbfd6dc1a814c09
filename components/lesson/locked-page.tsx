import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import { StatusPage } from "@/components/ui/status-page";
import type { LessonProgressView } from "@/lib/progress";

/**
 * What a learner sees on opening a lesson, or its lab, that is not open to them yet: which lesson
 * to finish first, with the way there. `children` says what is locked and why.
 */
export function LockedPage({ lesson, code, children }: { lesson: LessonProgressView; code: string; children: React.ReactNode }) {
  const before = lesson.waitsFor!;
  return (
    <StatusPage
      code={code}
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
      {children}
    </StatusPage>
  );
}
