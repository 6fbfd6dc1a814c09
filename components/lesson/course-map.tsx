import Link from "next/link";
import { benchExercisePath } from "@/lib/bench/exercises";
import type { CourseProgress, LessonProgressView } from "@/lib/progress";
import { benchStateWords } from "@/lib/progress/bench-state-words";

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
  const needs = lab.certificateMinScore === null ? "" : ` · the certificate needs ${lab.certificateMinScore}`;
  if (lab.passed) return `passed · best score ${lab.bestScore}${lab.meetsCertificate || lab.certificateMinScore === null ? "" : needs}`;
  if (lab.attempts > 0) return `not passed yet · best score ${lab.bestScore} (${lab.attempts} attempt${lab.attempts === 1 ? "" : "s"})`;
  return "not tried yet";
}

const benchTones = {
  "not-started": "text-ink-soft",
  draft: "text-ink-soft",
  submitted: "text-accent-strong",
  returned: "text-copper",
  accepted: "text-ok",
} as const;

/** One piece of work the certificate asks for, with where the learner stands on it. */
function Requirement({ kind, title, href, children }: { kind: string; title: string; href: string | null; children: React.ReactNode }) {
  return (
    <li className="min-w-0">
      <span className="text-ink-faint">{kind}: </span>
      {href ? (
        <Link href={href} className="font-medium text-ink underline-offset-2 hover:underline">
          {title}
        </Link>
      ) : (
        <span className="font-medium text-ink-soft">{title}</span>
      )}
      <span> · {children}</span>
    </li>
  );
}

/**
 * The course's lessons in order, each with its state, its quick checks and the work the certificate
 * asks of it: the lab (with the score the certificate needs) and the bench exercise, if it has one.
 */
export function CourseMap({ progress }: { progress: CourseProgress }) {
  return (
    <ol className="relative space-y-2">
      {progress.lessons.map((lesson) => {
        const isNext = progress.next?.slug === lesson.slug;
        const locked = lesson.state === "locked";
        return (
          <li
            key={lesson.slug}
            className={`flex gap-4 rounded-lg border px-3 py-3 sm:px-4 ${isNext ? "border-accent/50 bg-accent-soft/40" : "border-transparent"}`}
          >
            <StateBadge lesson={lesson} />
            <div className="min-w-0 flex-1">
              <p className="flex flex-wrap items-baseline gap-x-2 gap-y-0.5">
                {locked ? (
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
              {locked && lesson.waitsFor ? (
                <p className="mt-0.5 text-sm text-ink-faint">Opens when lesson {lesson.waitsFor.number} is done.</p>
              ) : (
                <p className="mt-1 text-sm text-ink-soft">
                  Quick checks {lesson.checks.correct} of {lesson.checks.total} right
                  {lesson.checks.answered > lesson.checks.correct ? ` (${lesson.checks.answered - lesson.checks.correct} still to get right)` : ""}
                </p>
              )}
              {lesson.lab || lesson.bench ? (
                <ul className="mt-1 space-y-0.5 text-sm text-ink-soft" aria-label={`Lesson ${lesson.number}: work for the certificate`}>
                  {lesson.lab ? (
                    <Requirement kind="Lab" title={lesson.lab.title} href={locked ? null : `/labs/${lesson.lab.slug}`}>
                      {locked ? "opens with the lesson" : labLine(lesson.lab)}
                    </Requirement>
                  ) : null}
                  {lesson.bench ? (
                    <Requirement kind="Bench exercise" title={lesson.bench.title} href={locked ? null : benchExercisePath(lesson.bench.slug)}>
                      <span className={locked ? "" : `font-medium ${benchTones[lesson.bench.state]}`}>
                        {locked ? "opens with the lesson" : benchStateWords[lesson.bench.state]}
                      </span>
                    </Requirement>
                  ) : null}
                </ul>
              ) : null}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
