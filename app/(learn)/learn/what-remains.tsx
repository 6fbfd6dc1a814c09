import Link from "next/link";
import { benchExercisePath } from "@/lib/bench/exercises";
import type { CompletionStatus } from "@/lib/certificates/completion";
import type { CourseProgress } from "@/lib/progress";
import { benchStateWords } from "@/lib/progress/bench-state-words";

/** The certificate's requirements that are not met yet, each with where the learner stands on it. */
export function WhatRemains({ status, progress }: { status: CompletionStatus; progress: CourseProgress }) {
  const benchStates = new Map(progress.lessons.flatMap((lesson) => (lesson.bench ? [[lesson.bench.slug, lesson.bench.state] as const] : [])));
  const labs = status.labs.filter((lab) => !lab.met);
  const exercises = status.benchExercises.filter((exercise) => !exercise.accepted);
  return (
    <ul className="mt-3 space-y-1.5 text-sm" aria-label="Still to do for the certificate">
      {labs.map((lab) => (
        <li key={lab.slug}>
          <span className="text-ink-faint">Lab: </span>
          <Link href={`/labs/${lab.slug}`} className="font-medium">
            {lab.title}
          </Link>
          <span className="text-ink-soft">
            {" "}
            · a passing score of {lab.minScore} or more{lab.bestScore === null ? "" : ` (best so far ${lab.bestScore})`}
          </span>
        </li>
      ))}
      {exercises.map((exercise) => (
        <li key={exercise.slug}>
          <span className="text-ink-faint">Bench exercise: </span>
          <Link href={benchExercisePath(exercise.slug)} className="font-medium">
            {exercise.title}
          </Link>
          <span className="text-ink-soft"> · {benchStateWords[benchStates.get(exercise.slug) ?? "not-started"]}, to be accepted by your instructor</span>
        </li>
      ))}
    </ul>
  );
}
