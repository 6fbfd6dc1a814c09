import type { Metadata } from "next";
import Link from "next/link";
import { z } from "zod";
import { FormAlert } from "@/components/forms/form-alert";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatMoment } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { listBenchReviewQueue } from "@/db/queries/bench";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { findBenchExercise } from "@/lib/bench/exercises";

export const metadata: Metadata = { title: "Bench reviews" };

const searchSchema = z.object({ reviewed: z.enum(["sent", "unsent"]).optional().catch(undefined) });

const dayMs = 86_400_000;

function waitingFor(since: Date, now: Date): string {
  const days = Math.floor((now.getTime() - since.getTime()) / dayMs);
  if (days < 1) return "today";
  return days === 1 ? "1 day" : `${days} days`;
}

export default async function ReviewQueuePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const instructor = await requireRouteAccess("/reviews");
  const { reviewed } = searchSchema.parse(await searchParams);
  const queue = await listBenchReviewQueue({ instructorId: instructor.id });
  const now = new Date();

  return (
    <AppFrame user={instructor}>
      <PageHeading
        eyebrow="Teaching"
        title="Bench reviews"
        lead="Bench work from your cohorts that is waiting for a review, longest waiting first. Each review is e-mailed to the learner."
      />
      {reviewed ? (
        <div className="mb-6">
          <FormAlert
            tone={reviewed === "sent" ? "success" : "info"}
            message={
              reviewed === "sent"
                ? "Review saved, and the learner has been e-mailed a link to it."
                : "Review saved. The e-mail to the learner could not be sent; they will still see the review on the exercise page."
            }
          />
        </div>
      ) : null}
      {queue.length === 0 ? (
        <Card>
          <p className="text-ink-soft">Nothing is waiting for review. Work your learners hand in appears here.</p>
        </Card>
      ) : (
        <section className="overflow-hidden rounded-card border border-line bg-surface">
          <h2 className="sr-only">Waiting for review ({queue.length})</h2>
          <ul className="divide-y divide-line">
            {queue.map((entry) => {
              const exercise = findBenchExercise(entry.exerciseSlug);
              return (
                <li key={entry.submissionId}>
                  <Link
                    href={`/reviews/${entry.submissionId}`}
                    className="grid grid-cols-[minmax(0,1fr)_auto] items-center gap-x-4 gap-y-1 px-5 py-4 no-underline transition-colors hover:bg-sunken sm:px-6"
                  >
                    <span className="min-w-0">
                      <span className="block font-semibold text-ink">{entry.learnerName}</span>
                      <span className="block text-sm text-ink-soft">
                        {exercise ? `Lesson ${exercise.lesson.number}: ${exercise.exercise.title}` : entry.exerciseSlug}
                      </span>
                      <span className="block text-sm text-ink-faint">
                        {entry.cohortName} · {entry.photoCount} photo{entry.photoCount === 1 ? "" : "s"}
                        {entry.reviewCount > 0 ? ` · handed in again after ${entry.reviewCount} review${entry.reviewCount === 1 ? "" : "s"}` : ""}
                      </span>
                    </span>
                    <span className="text-right text-sm">
                      <span className="block font-medium text-ink">waiting {waitingFor(entry.submittedAt, now)}</span>
                      <span className="block text-ink-faint">{formatMoment(entry.submittedAt)}</span>
                      <span className="mt-1 block font-semibold text-accent">Review →</span>
                    </span>
                  </Link>
                </li>
              );
            })}
          </ul>
        </section>
      )}
    </AppFrame>
  );
}
