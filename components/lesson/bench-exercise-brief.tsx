import Link from "next/link";
import { buttonClass } from "@/components/ui/button-class";
import type { BenchExercise } from "@/lessons";
import { displayUnit } from "@/lib/answers/quantity-kinds";
import { LessonMarkdown } from "./lesson-markdown";

/**
 * The bench exercise of lessons 7 and 8: what to build and measure, what the photo must show and
 * how it is marked; the work itself is handed in on the exercise's bench page.
 */
export function BenchExerciseBrief({ exercise }: { exercise: BenchExercise }) {
  const points = exercise.rubric.reduce((sum, item) => sum + item.points, 0);
  return (
    <section id="bench" aria-labelledby="bench-title" className="mt-10 scroll-mt-24 rounded-card border border-line bg-surface p-5 sm:p-6">
      <p className="text-sm font-semibold uppercase tracking-wide text-copper">Bench exercise</p>
      <h2 id="bench-title" className="mt-1 text-2xl font-semibold tracking-tight text-ink">
        {exercise.title}
      </h2>
      <LessonMarkdown markdown={exercise.brief} className="mt-3" />
      <div className="mt-6 grid gap-6 md:grid-cols-2">
        <div>
          <h3 className="font-semibold text-ink">Readings to record</h3>
          <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-soft marker:text-copper">
            {exercise.asks.map((ask) => (
              <li key={ask.id}>
                {ask.label}
                {ask.unit ? <span className="text-ink-faint"> (in {displayUnit(ask.unit)})</span> : null}
              </li>
            ))}
          </ul>
        </div>
        <div>
          <h3 className="font-semibold text-ink">{exercise.photo.required ? "Your scope photo must show" : "If you add a scope photo, it should show"}</h3>
          <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-soft marker:text-copper">
            {exercise.photo.mustShow.map((item) => (
              <li key={item}>{item}</li>
            ))}
          </ul>
        </div>
      </div>
      <div className="mt-6">
        <h3 className="font-semibold text-ink">How your instructor marks it ({points} points)</h3>
        <ul className="mt-2 divide-y divide-line rounded-lg border border-line text-sm">
          {exercise.rubric.map((item) => (
            <li key={item.id} className="flex items-start justify-between gap-4 px-3 py-2">
              <span className="text-ink-soft">{item.criterion}</span>
              <span className="shrink-0 font-semibold text-ink tabular-nums">{item.points} pt</span>
            </li>
          ))}
        </ul>
      </div>
      <div className="mt-6 rounded-lg bg-sunken px-4 py-3">
        <p className="text-sm text-ink">
          Have the photo and these readings ready, then hand them in on the bench page; your instructor reviews them against the
          marking above.
        </p>
        <Link href={`/bench/${exercise.slug}`} className={buttonClass("secondary", "mt-3 print:hidden")}>
          Hand in your bench work <span aria-hidden="true">→</span>
        </Link>
      </div>
    </section>
  );
}
