import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatMoment } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { findBenchSubmissionForReviewer, listBenchPhotos, listBenchReviews } from "@/db/queries/bench";
import { formatInUnit } from "@/lib/answers";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { findBenchExercise } from "@/lib/bench/exercises";
import { predictBenchRun } from "@/lib/bench/prediction";
import { describeStatedValues } from "@/lib/bench/submission-form";
import { PhotoLightbox } from "./photo-lightbox";
import { PredictionChart } from "./prediction-chart";
import { ReviewForm } from "./review-form";

export const metadata: Metadata = { title: "Review bench work" };

const statusLabels = { draft: "Not handed in", submitted: "Waiting for review", accepted: "Accepted", returned: "Returned for rework" } as const;

const threeFigures = (value: number) => Number(value.toPrecision(3));
const time = (seconds: number | null) => (seconds === null ? "—" : formatInUnit(threeFigures(seconds), "ns"));
const volts = (value: number | null) => (value === null ? "—" : formatInUnit(threeFigures(value), "V"));

export default async function ReviewPage({ params }: { params: Promise<{ submissionId: string }> }) {
  const { submissionId } = await params;
  const instructor = await requireRouteAccess("/reviews/[submissionId]", { submissionId });
  if (!z.uuid().safeParse(submissionId).success) notFound();
  // Work outside the instructor's cohorts is reported as missing, so its existence is not confirmed.
  const submission = await findBenchSubmissionForReviewer({ submissionId, instructorId: instructor.id });
  const entry = submission && findBenchExercise(submission.exerciseSlug);
  if (!submission || !entry || submission.status === "draft") notFound();
  const { exercise, lesson } = entry;
  const [photos, reviews] = await Promise.all([listBenchPhotos({ submissionId }), listBenchReviews({ submissionId })]);
  const prediction = predictBenchRun(lesson, submission);

  return (
    <AppFrame user={instructor}>
      <p className="mb-4 text-sm">
        <Link href="/reviews" className="font-medium text-accent underline-offset-2 hover:underline">
          ← Bench reviews
        </Link>
      </p>
      <PageHeading
        eyebrow={`${submission.cohortName} · lesson ${lesson.number} bench exercise`}
        title={`${submission.learnerName}: ${exercise.title}`}
        lead={
          submission.submittedAt
            ? `${statusLabels[submission.status]} · handed in ${formatMoment(submission.submittedAt)}${reviews.length > 0 ? ` · ${reviews.length} earlier review${reviews.length === 1 ? "" : "s"}` : ""}`
            : statusLabels[submission.status]
        }
      />

      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-2">
        <div className="space-y-6">
          <Card>
            <h2 className="text-lg font-semibold">Photos</h2>
            <p className="mb-3 mt-1 text-sm text-ink-soft">They must show: {exercise.photo.mustShow.join("; ")}.</p>
            <PhotoLightbox photos={photos.map(({ id, name, width, height }) => ({ id, name, width, height }))} />
          </Card>
          <Card>
            <h2 className="text-lg font-semibold">What the learner states</h2>
            <dl className="mt-3 grid grid-cols-[minmax(0,1fr)] gap-x-4 gap-y-2 text-sm sm:grid-cols-[minmax(0,1fr)_minmax(0,1.4fr)]">
              {describeStatedValues(exercise, submission).map((row) => (
                <div key={row.label} className="contents">
                  <dt className="text-ink-soft">{row.label}</dt>
                  <dd className="mb-2 font-medium whitespace-pre-line text-ink sm:mb-0">{row.value}</dd>
                </div>
              ))}
            </dl>
            <h3 className="mt-5 text-sm font-semibold text-ink">Note</h3>
            <p className="mt-1 whitespace-pre-line text-ink-soft">{submission.note}</p>
          </Card>
        </div>

        <div className="space-y-6">
          <Card>
            <h2 className="text-lg font-semibold">The simulator&apos;s prediction for this run</h2>
            {prediction.ok ? (
              <>
                <table className="mt-3 w-full text-left text-sm tabular-nums">
                  <thead className="text-ink-faint">
                    <tr>
                      <th scope="col" className="py-1.5 font-medium">At the first pixel</th>
                      <th scope="col" className="py-1.5 font-medium">Measured</th>
                      <th scope="col" className="py-1.5 font-medium">Predicted</th>
                    </tr>
                  </thead>
                  <tbody className="divide-y divide-line border-t border-line">
                    <tr>
                      <th scope="row" className="py-1.5 font-normal text-ink-soft">Rise time (10–90 %)</th>
                      <td className="py-1.5 font-medium">{time(submission.riseTimeS)}</td>
                      <td className="py-1.5 font-medium">{time(prediction.riseTime)}</td>
                    </tr>
                    <tr>
                      <th scope="row" className="py-1.5 font-normal text-ink-soft">Overshoot</th>
                      <td className="py-1.5 font-medium">{volts(submission.overshootV)}</td>
                      <td className="py-1.5 font-medium">{volts(prediction.overshoot)}</td>
                    </tr>
                  </tbody>
                </table>
                <p className={`mt-4 rounded-lg px-3 py-2 text-sm font-medium ${prediction.outcome === "fails" ? "bg-danger-soft text-danger" : "bg-ok-soft text-ok"}`}>
                  Simulator verdict: {prediction.summary}, on a line of {Math.round(prediction.z0)} Ω, {time(prediction.delay)} long.
                </p>
                {prediction.reasons.length > 0 ? (
                  <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-ink-soft">
                    {prediction.reasons.slice(0, 3).map((reason, index) => (
                      <li key={index}>
                        {reason.heading}: {reason.message}
                      </li>
                    ))}
                  </ul>
                ) : null}
                <div className="mt-4">
                  <PredictionChart
                    trace={prediction.trace}
                    highLevel={prediction.assumed.highThreshold * prediction.assumed.pixelSupply}
                    lowLevel={prediction.assumed.lowThreshold * prediction.assumed.pixelSupply}
                  />
                </div>
                <p className="mt-2 text-xs text-ink-faint">
                  Assumed from lesson {lesson.number}&apos;s lab: driver output resistance {Math.round(prediction.assumed.driverResistance)} Ω, driver edge{" "}
                  {time(prediction.assumed.edgeTime)}, pixel supply {volts(prediction.assumed.pixelSupply)}. The simulator is a teaching model; the bench
                  measurement is the judge.
                </p>
              </>
            ) : (
              <p className="mt-2 text-sm text-ink-soft">{prediction.reason}</p>
            )}
          </Card>

          <Card>
            <h2 className="text-lg font-semibold">Your review</h2>
            {submission.status === "submitted" ? (
              <div className="mt-4">
                <ReviewForm submissionId={submission.id} rubric={exercise.rubric} />
              </div>
            ) : (
              <p className="mt-2 text-sm text-ink-soft">This work has been reviewed; the learner can see the review on the exercise page.</p>
            )}
          </Card>

          {reviews.length > 0 ? (
            <Card>
              <h2 className="text-lg font-semibold">Earlier reviews</h2>
              <ul className="mt-3 space-y-4">
                {reviews.map((review) => (
                  <li key={review.id} className="border-l-4 border-line-strong pl-3 text-sm">
                    <p className="font-medium text-ink">
                      {review.decision === "accept" ? "Accepted" : "Returned"} · {review.total} of {review.maxTotal} · {review.reviewerName},{" "}
                      {formatMoment(review.createdAt)}
                    </p>
                    <p className="mt-1 whitespace-pre-line text-ink-soft">{review.feedback}</p>
                  </li>
                ))}
              </ul>
            </Card>
          ) : null}
        </div>
      </div>
    </AppFrame>
  );
}
