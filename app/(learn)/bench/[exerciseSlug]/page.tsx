import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { LessonMarkdown } from "@/components/lesson/lesson-markdown";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatMoment } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import {
  editableBenchStatuses,
  findBenchSubmissionByExercise,
  listBenchPhotos,
  listBenchReviews,
} from "@/db/queries/bench";
import { findLearnerCohortId } from "@/db/queries/cohorts";
import type { BenchSubmission } from "@/db/schema";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { findBenchExercise, rubricMaximum } from "@/lib/bench/exercises";
import { benchPhotoLimits } from "@/lib/bench/photo-limits";
import { findLessonProgressView } from "@/lib/progress";
import { benchFormFields, describeStatedValues, entriesFromStored, noteField } from "@/lib/bench/submission-form";
import { BenchForm } from "./bench-form";
import { LockedBench } from "./locked-bench";
import { PhotoThumbnails } from "./photo-thumbnails";
import { PhotoUploader } from "./photo-uploader";
import { ReviewFeedback } from "./review-feedback";

type Params = { params: Promise<{ exerciseSlug: string }> };

export async function generateMetadata({ params }: Params): Promise<Metadata> {
  const entry = findBenchExercise((await params).exerciseSlug);
  return { title: entry ? entry.exercise.title : "Bench exercise" };
}

const statusLines: Record<BenchSubmission["status"] | "new", { label: string; tone: string; lead: string }> = {
  new: { label: "Not started", tone: "bg-sunken text-ink-soft", lead: "Build the run, measure it at the first pixel, then hand in your photos and readings here." },
  draft: { label: "Not handed in yet", tone: "bg-sunken text-ink-soft", lead: "Add your photos and readings, then hand the work in for review." },
  submitted: { label: "Waiting for review", tone: "bg-accent-soft text-accent-strong", lead: "Your instructor has your work. You will get an e-mail when it has been reviewed." },
  accepted: { label: "Accepted", tone: "bg-ok-soft text-ok", lead: "Your instructor accepted this work." },
  returned: { label: "Returned for rework", tone: "bg-copper-soft text-copper", lead: "Your instructor returned this work. Read the feedback, change what it asks, then hand it in again." },
};

export default async function BenchExercisePage({ params }: Params) {
  const { exerciseSlug } = await params;
  const learner = await requireRouteAccess("/bench/[exerciseSlug]", { exerciseSlug });
  const entry = findBenchExercise(exerciseSlug);
  if (!entry) notFound();
  const { exercise, lesson } = entry;

  const lessonProgress = await findLessonProgressView({ userId: learner.id, lessonSlug: lesson.slug });
  if (lessonProgress?.state === "locked") {
    return (
      <AppFrame user={learner}>
        <LockedBench lesson={lessonProgress} exerciseTitle={exercise.title} />
      </AppFrame>
    );
  }

  const submission = await findBenchSubmissionByExercise({ learnerId: learner.id, exerciseSlug: exercise.slug });
  const [photos, reviews, cohortId] = await Promise.all([
    submission ? listBenchPhotos({ submissionId: submission.id }) : [],
    submission ? listBenchReviews({ submissionId: submission.id }) : [],
    submission ? submission.cohortId : findLearnerCohortId({ userId: learner.id, courseSlug: entry.courseSlug }),
  ]);
  const status = statusLines[submission?.status ?? "new"];
  const editable = !submission || (editableBenchStatuses as readonly string[]).includes(submission.status);
  const [latest, ...earlier] = reviews;
  const thumbnails = photos.map(({ id, name, size, width, height }) => ({ id, name, size, width, height }));

  return (
    <AppFrame user={learner}>
      <p className="mb-4 text-sm">
        <Link href={`/lessons/${lesson.slug}`} className="font-medium text-accent underline-offset-2 hover:underline">
          ← Lesson {lesson.number}: {lesson.title}
        </Link>
      </p>
      <PageHeading eyebrow={`Bench exercise · lesson ${lesson.number}`} title={exercise.title} lead={status.lead} />
      <p className="-mt-4 mb-6">
        <span className={`inline-block rounded-full px-3 py-1 text-sm font-semibold ${status.tone}`}>{status.label}</span>
        {submission?.submittedAt ? <span className="ml-3 text-sm text-ink-faint">last handed in {formatMoment(submission.submittedAt)}</span> : null}
      </p>

      {latest ? (
        <div className="mb-6">
          <ReviewFeedback exercise={exercise} review={latest} latest />
        </div>
      ) : null}

      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <Card className="self-start">
          <h2 className="text-lg font-semibold">The brief</h2>
          <LessonMarkdown markdown={exercise.brief} className="mt-2" />
          <h3 className="mt-6 font-semibold text-ink">{exercise.photo.required ? "Your photos must show" : "Your photos should show"}</h3>
          <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-soft marker:text-copper">
            {exercise.photo.mustShow.map((item) => (
              <li key={item}>{item}</li>
            ))}
          </ul>
          <h3 className="mt-6 font-semibold text-ink">How it is marked ({rubricMaximum(exercise)} points)</h3>
          <ul className="mt-2 divide-y divide-line rounded-lg border border-line text-sm">
            {exercise.rubric.map((criterion) => (
              <li key={criterion.id} className="flex items-start justify-between gap-4 px-3 py-2">
                <span className="text-ink-soft">{criterion.criterion}</span>
                <span className="shrink-0 font-semibold text-ink tabular-nums">{criterion.points} pt</span>
              </li>
            ))}
          </ul>
        </Card>

        <Card className="self-start">
          <h2 className="text-lg font-semibold">Your work</h2>
          {!cohortId ? (
            <p className="mt-2 text-ink-soft">
              You are not in a cohort of this course yet, so there is no instructor to review bench work. Ask your school&apos;s admin to add you.
            </p>
          ) : editable ? (
            <div className="mt-4 space-y-8">
              <section aria-labelledby="photos-heading" className="space-y-3">
                <h3 id="photos-heading" className="font-semibold text-ink">
                  Photos ({benchPhotoLimits.minPhotos} to {benchPhotoLimits.maxPhotos})
                </h3>
                <PhotoThumbnails exerciseSlug={exercise.slug} photos={thumbnails} removable />
                <PhotoUploader exerciseSlug={exercise.slug} storedCount={photos.length} />
              </section>
              <section aria-labelledby="readings-heading" className="space-y-3">
                <h3 id="readings-heading" className="font-semibold text-ink">
                  What you built and measured
                </h3>
                <BenchForm
                  exerciseSlug={exercise.slug}
                  fields={benchFormFields(exercise)}
                  noteLabel={noteField.label}
                  defaults={submission ? entriesFromStored(exercise, submission) : {}}
                  resubmission={submission?.status === "returned"}
                />
              </section>
            </div>
          ) : (
            <div className="mt-4 space-y-6">
              <PhotoThumbnails exerciseSlug={exercise.slug} photos={thumbnails} removable={false} />
              <dl className="grid grid-cols-[minmax(0,1fr)] gap-x-4 gap-y-2 text-sm sm:grid-cols-[minmax(0,1fr)_minmax(0,1.4fr)]">
                {describeStatedValues(exercise, submission!).map((row) => (
                  <div key={row.label} className="contents">
                    <dt className="text-ink-soft">{row.label}</dt>
                    <dd className="mb-2 font-medium whitespace-pre-line text-ink sm:mb-0">{row.value}</dd>
                  </div>
                ))}
              </dl>
              <div>
                <h3 className="text-sm font-semibold text-ink">Your note</h3>
                <p className="mt-1 whitespace-pre-line text-ink-soft">{submission!.note}</p>
              </div>
            </div>
          )}
        </Card>
      </div>

      {earlier.length > 0 ? (
        <details className="mt-6">
          <summary className="cursor-pointer text-sm font-medium text-accent">Earlier reviews ({earlier.length})</summary>
          <div className="mt-3 space-y-4">
            {earlier.map((review) => (
              <ReviewFeedback key={review.id} exercise={exercise} review={review} latest={false} />
            ))}
          </div>
        </details>
      ) : null}
    </AppFrame>
  );
}
