import Link from "next/link";
import type { CompletionStatus } from "@/lib/certificates/completion";

function Mark({ met }: { met: boolean }) {
  return (
    <span
      aria-hidden
      className={`mt-0.5 inline-flex size-5 shrink-0 items-center justify-center rounded-full text-xs font-bold ${
        met ? "bg-ok text-white" : "border border-line-strong bg-surface text-ink-faint"
      }`}
    >
      {met ? "✓" : ""}
    </span>
  );
}

/** The completion rule as a checklist: each lab with its minimum and the learner's best, each bench exercise. */
export function RequirementsList({ status }: { status: CompletionStatus }) {
  return (
    <div className="grid gap-6 md:grid-cols-2">
      <div>
        <h2 className="text-lg font-semibold">Labs</h2>
        <p className="mt-1 text-sm text-ink-soft">A passing attempt with at least the score shown.</p>
        <ul className="mt-3 divide-y divide-line">
          {status.labs.map((lab) => (
            <li key={lab.slug} className="flex gap-3 py-2.5">
              <Mark met={lab.met} />
              <div className="min-w-0 flex-1">
                <Link href={`/labs/${lab.slug}`} className="font-medium">
                  {lab.title}
                </Link>
                <p className="text-sm text-ink-soft">
                  {lab.bestScore === null ? "Not passed yet" : `Best passing score ${lab.bestScore}`} · needs {lab.minScore}
                  <span className="sr-only">{lab.met ? " (met)" : " (not met yet)"}</span>
                </p>
              </div>
            </li>
          ))}
        </ul>
      </div>
      <div>
        <h2 className="text-lg font-semibold">Bench work</h2>
        <p className="mt-1 text-sm text-ink-soft">Accepted by your instructor.</p>
        <ul className="mt-3 divide-y divide-line">
          {status.benchExercises.map((exercise) => (
            <li key={exercise.slug} className="flex gap-3 py-2.5">
              <Mark met={exercise.accepted} />
              <div className="min-w-0 flex-1">
                <Link href={`/bench/${exercise.slug}`} className="font-medium">
                  {exercise.title}
                </Link>
                <p className="text-sm text-ink-soft">
                  {exercise.accepted ? `Accepted, ${exercise.points} of ${exercise.maxPoints} points` : "Not accepted yet"}
                </p>
              </div>
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}
