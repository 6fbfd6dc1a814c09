import Link from "next/link";
import type { CourseProgress, LessonProgressView } from "@/lib/progress";

const stateLabels = { done: "Done", open: "Open", locked: "Locked" } as const;

function StateBadge({ lesson }: { lesson: LessonProgressView }) {
  const styles = {
    done: "border-ok bg-ok text-white",
    open: "border-accent bg-surface text-accent-strong",
    locked: "border-line-strong bg-sunken text-ink-faint",
  } as const;
  return (
    <span
      aria-hidden="true"
      className={`flex size-9 shrink-0 items-center justify-center rounded-full border-2 text-sm font-bold ${styles[lesson.state]}`}
    >
      {lesson.state === "done" ? "✓" : lesson.number}
    </span>
  );
}

function labLine(lab: NonNullable<LessonProgressView["lab"]>): string {
  if (lab.passed) return `Lab passed · best score ${lab.bestScore}`;
  if (lab.attempts > 0) return `Lab not passed yet · best score ${lab.bestScore} (${lab.attempts} attempt${lab.attempts === 1 ? "" : "s"})`;
  return "Lab not tried yet";
}

/** The course's lessons in order, each with its state, its lab result and its quick checks. */
export function CourseMap({ progress }: { progress: CourseProgress }) {
  return (
    <ol className="relative space-y-2">
      {progress.lessons.map((lesson) => {
        const isNext = progress.next?.slug === lesson.slug;
        return (
          <li
            key={lesson.slug}
            className={`flex gap-4 rounded-lg border px-3 py-3 sm:px-4 ${isNext ? "border-accent/50 bg-accent-soft/40" : "border-transparent"}`}
          >
            <StateBadge lesson={lesson} />
            <div className="min-w-0 flex-1">
              <p className="flex flex-wrap items-baseline gap-x-2 gap-y-0.5">
                {lesson.state === "locked" ? (
                  <span className="font-semibold text-ink-soft">
                    {lesson.number}. {lesson.title}
                  </span>
                ) : (
                  <Link href={`/lessons/${lesson.slug}`} className="font-semibold text-ink underline-offset-2 hover:underline">
                    {lesson.number}. {lesson.title}
                  </Link>
                )}
                <span
                  className={`text-xs font-semibold uppercase tracking-wide ${
                    lesson.state === "done" ? "text-ok" : lesson.state === "open" ? "text-accent" : "text-ink-faint"
                  }`}
                >
                  {stateLabels[lesson.state]}
                  {isNext ? " · up next" : ""}
                </span>
              </p>
              {lesson.state === "locked" && lesson.waitsFor ? (
                <p className="mt-0.5 text-sm text-ink-faint">Opens when lesson {lesson.waitsFor.number} is done.</p>
              ) : (
                <p className="mt-1 flex flex-wrap gap-x-4 gap-y-0.5 text-sm text-ink-soft">
                  {lesson.lab ? <span>{labLine(lesson.lab)}</span> : null}
                  <span>
                    Quick checks {lesson.checks.correct} of {lesson.checks.total} right
                    {lesson.checks.answered > lesson.checks.correct ? ` (${lesson.checks.answered - lesson.checks.correct} still to get right)` : ""}
                  </span>
                </p>
              )}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
