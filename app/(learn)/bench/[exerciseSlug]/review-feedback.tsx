import { formatMoment } from "@/components/ui/dates";
import type { BenchReviewWithReviewer } from "@/db/queries/bench";
import type { BenchExercise } from "@/lessons";
import { describeReviewScores } from "@/lib/bench/review-scores";

/** One review as the learner reads it: the decision, points per rubric criterion, and the feedback. */
export function ReviewFeedback({ exercise, review, latest }: { exercise: BenchExercise; review: BenchReviewWithReviewer; latest: boolean }) {
  const accepted = review.decision === "accept";
  return (
    <section
      aria-label={latest ? "Your instructor's review" : `Review of ${formatMoment(review.createdAt)}`}
      className={`rounded-card border bg-surface p-5 sm:p-6 ${latest ? (accepted ? "border-ok/40" : "border-copper/50") : "border-line"}`}
    >
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h2 className="text-lg font-semibold">
          {accepted ? "Accepted" : "Returned for rework"} · {review.total} of {review.maxTotal} points
        </h2>
        <p className="text-sm text-ink-faint">
          {review.reviewerName}, {formatMoment(review.createdAt)}
        </p>
      </div>
      <p className="mt-3 whitespace-pre-line text-ink">{review.feedback}</p>
      <ul className="mt-4 divide-y divide-line rounded-lg border border-line text-sm">
        {describeReviewScores(exercise.rubric, review.scores).map((row) => (
          <li key={row.id} className="flex items-start justify-between gap-4 px-3 py-2">
            <span className="text-ink-soft">{row.label}</span>
            <span className="shrink-0 font-semibold text-ink tabular-nums">
              {row.points ?? "not marked"}
              {row.maximum === null ? " pt" : ` / ${row.maximum}`}
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
