import type { LessonProgressView } from "@/lib/progress";
import { ContentsRail } from "./contents-rail";
import type { LessonSection } from "./section-headings";

function ProgressSummary({ progress }: { progress: LessonProgressView }) {
  const { checks, lab } = progress;
  const checksDone = checks.correct === checks.total;
  return (
    <ul className="space-y-2 text-sm">
      <li className="flex items-start gap-2">
        <span aria-hidden="true" className={checksDone ? "text-ok" : "text-ink-faint"}>
          {checksDone ? "✓" : "○"}
        </span>
        <span>
          Quick checks: {checks.correct} of {checks.total} answered correctly
        </span>
      </li>
      {lab ? (
        <li className="flex items-start gap-2">
          <span aria-hidden="true" className={lab.passed ? "text-ok" : "text-ink-faint"}>
            {lab.passed ? "✓" : "○"}
          </span>
          <a href="#lab" className="text-ink no-underline hover:underline">
            Lab: {lab.passed ? `passed, best score ${lab.bestScore}` : lab.attempts > 0 ? `not passed yet (best ${lab.bestScore})` : "not tried yet"}
          </a>
        </li>
      ) : null}
      <li className="pt-1 text-ink-soft">
        {progress.state === "done"
          ? "This lesson is done."
          : "The lesson is done when every quick check has been answered correctly and the lab is passed."}
      </li>
    </ul>
  );
}

/**
 * Contents and progress for a long lesson: a sticky column beside the text on wide screens, a
 * collapsible panel above it on a phone.
 */
export function LessonRail({ sections, progress, variant }: { sections: LessonSection[]; progress: LessonProgressView; variant: "side" | "inline" }) {
  if (variant === "inline") {
    return (
      <details className="mb-8 rounded-card border border-line bg-surface px-4 py-3 lg:hidden print:hidden">
        <summary className="cursor-pointer font-semibold text-ink">
          In this lesson · {progress.checks.correct}/{progress.checks.total} checks{progress.lab?.passed ? " · lab passed" : ""}
        </summary>
        <div className="mt-4 space-y-5">
          <ContentsRail sections={sections} />
          <ProgressSummary progress={progress} />
        </div>
      </details>
    );
  }
  return (
    <div className="space-y-6">
      <div>
        <h2 className="mb-2 text-xs font-semibold uppercase tracking-wide text-ink-faint">In this lesson</h2>
        <ContentsRail sections={sections} />
      </div>
      <div className="rounded-card border border-line bg-surface p-4">
        <h2 className="mb-3 text-xs font-semibold uppercase tracking-wide text-ink-faint">Your progress</h2>
        <ProgressSummary progress={progress} />
      </div>
    </div>
  );
}
