import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { LabAttempts } from "@/components/gradebook/lab-attempts";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatMoment } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { requireRouteAccess } from "@/lib/auth/current-user";
import type { GradebookItem } from "@/lib/gradebook";
import { loadLearnerRecord, type BenchRecord, type LabRecord } from "@/lib/gradebook/load";
import type { LessonChecksRecord } from "@/lib/gradebook/quick-check-record";
import { plural } from "@/lib/gradebook/words";

export const metadata: Metadata = { title: "Learner's work" };

const benchStatusWords = {
  draft: "Draft, not handed in",
  submitted: "Handed in, waiting for review",
  returned: "Returned for rework",
  accepted: "Accepted",
} as const;

/** The in-page anchor of an item's section ("lab-rc-window"). */
function anchorOf(item: GradebookItem): string {
  return item.key.replace(":", "-");
}

function labSummary(record: LabRecord): string {
  const { attempts } = record;
  if (attempts.length === 0) return "Not attempted yet.";
  const firstPass = attempts.find((attempt) => attempt.passed);
  const best = Math.max(...attempts.map((attempt) => attempt.score));
  return firstPass
    ? `Passed on attempt ${firstPass.attemptNumber} of ${attempts.length}; best score ${best}.`
    : `Not passed in ${plural(attempts.length, "attempt")}; best score ${best}.`;
}

function BenchWork({ record, canReview }: { record: BenchRecord; canReview: boolean }) {
  const { work } = record;
  if (!work) return <p className="text-sm text-ink-soft">Not started yet.</p>;
  return (
    <div className="text-sm">
      <p>
        <span className="font-semibold">{benchStatusWords[work.status]}</span>
        {work.submittedAt ? <span className="text-ink-soft"> · handed in {formatMoment(work.submittedAt)}</span> : null}
        {canReview && work.status === "submitted" ? (
          <>
            {" · "}
            <Link href={`/reviews/${work.submissionId}`} className="font-semibold text-accent underline-offset-2 hover:underline">
              Review it
            </Link>
          </>
        ) : null}
      </p>
      {work.reviews.length > 0 ? (
        <ol className="mt-3 space-y-3">
          {work.reviews.map((review) => (
            <li key={review.createdAt.toISOString()} className="rounded-lg border border-line bg-sunken/50 px-3 py-2">
              <p>
                <span className="font-semibold">{review.decision === "accept" ? "✓ Accepted" : "↺ Returned"}</span>{" "}
                with {review.total} of {review.maxTotal} points
                <span className="text-ink-soft"> · {formatMoment(review.createdAt)}</span>
              </p>
              <p className="mt-1 whitespace-pre-line text-ink-soft">{review.feedback}</p>
            </li>
          ))}
        </ol>
      ) : null}
    </div>
  );
}

function QuickCheckAnswers({ lesson }: { lesson: LessonChecksRecord }) {
  return (
    <ol className="mt-3 space-y-3 text-sm">
      {lesson.checks.map((check) => (
        <li key={check.id} className="rounded-lg border border-line px-3 py-2">
          <p>
            <span className="font-semibold">Quick check {check.number}</span>
            <span className="text-ink-soft"> · {check.kind}</span>
            {check.answers.length === 0 ? <span className="text-ink-soft"> · not answered yet</span> : null}
          </p>
          {check.answers.length > 0 ? (
            <p className="mt-1 text-ink-soft">
              {check.asked} <span className="text-ink">Accepted answer: {check.expected}.</span>
            </p>
          ) : null}
          {check.answers.length > 0 ? (
            <ol className="mt-1 space-y-0.5">
              {check.answers.map((answer) => (
                <li key={answer.createdAt.toISOString()} className="flex flex-wrap gap-x-2">
                  <span className={answer.correct ? "font-medium text-ok" : "text-danger"}>{answer.correct ? "✓ right" : "✗ wrong"}</span>
                  <span className="break-all font-mono">{answer.entry}</span>
                  <span className="text-ink-soft">{formatMoment(answer.createdAt)}</span>
                </li>
              ))}
            </ol>
          ) : null}
        </li>
      ))}
    </ol>
  );
}

export default async function LearnerRecordPage({ params }: { params: Promise<{ cohortId: string; learnerId: string }> }) {
  const { cohortId, learnerId } = await params;
  const user = await requireRouteAccess("/cohorts/[cohortId]/learners/[learnerId]", { cohortId, learnerId });
  if (!z.uuid().safeParse(cohortId).success || !z.uuid().safeParse(learnerId).success) notFound();
  const record = await loadLearnerRecord({ cohortId, learnerId, viewer: user });
  if (!record) notFound();
  const { cohort, learner, labs, bench, checks } = record;
  const passed = labs.filter((lab) => lab.attempts.some((attempt) => attempt.passed)).length;

  return (
    <AppFrame user={user}>
      <p className="mb-4 text-sm">
        <Link href={`/cohorts/${cohort.id}`} className="font-medium text-accent underline-offset-2 hover:underline">
          ← {cohort.name}
        </Link>
      </p>
      <PageHeading
        eyebrow="Learner's work"
        title={learner.name}
        lead={
          <>
            {learner.email}
            {learner.active ? null : " · account switched off"} · {passed} of {labs.length} labs passed
          </>
        }
      />

      <nav aria-label="Labs" className="mb-6 flex flex-wrap gap-2 text-sm">
        {[...labs, ...bench].map(({ item }) => (
          <a key={item.key} href={`#${anchorOf(item)}`} className="rounded-full border border-line-strong bg-surface px-3 py-1 hover:border-accent">
            {item.label}
          </a>
        ))}
      </nav>

      <div className="space-y-6">
        {labs.map((lab) => (
          <Card key={lab.item.key}>
            <section id={anchorOf(lab.item)} aria-labelledby={`${anchorOf(lab.item)}-heading`} className="scroll-mt-6">
              <h2 id={`${anchorOf(lab.item)}-heading`} className="text-lg font-semibold">
                {lab.item.label} · {lab.item.title}
              </h2>
              <p className="mt-1 text-sm text-ink-soft">{labSummary(lab)}</p>
              {lab.attempts.length > 0 ? (
                <div className="mt-4">
                  <LabAttempts attempts={lab.attempts} labLabel={lab.item.label} learnerName={learner.name} />
                </div>
              ) : null}
            </section>
          </Card>
        ))}
        <Card>
          <section id="quick-checks" aria-labelledby="quick-checks-heading" className="scroll-mt-6">
            <h2 id="quick-checks-heading" className="text-lg font-semibold">
              Quick checks
            </h2>
            {checks.length === 0 ? <p className="mt-1 text-sm text-ink-soft">No quick check answered yet.</p> : null}
            {checks.map((lesson) => (
              <details key={lesson.slug} className="mt-3 border-t border-line pt-3" open>
                <summary className="cursor-pointer font-semibold">
                  Lesson {lesson.number} · {lesson.title}
                </summary>
                <QuickCheckAnswers lesson={lesson} />
              </details>
            ))}
          </section>
        </Card>
        {bench.map((record) => (
          <Card key={record.item.key}>
            <section id={anchorOf(record.item)} aria-labelledby={`${anchorOf(record.item)}-heading`} className="scroll-mt-6">
              <h2 id={`${anchorOf(record.item)}-heading`} className="mb-2 text-lg font-semibold">
                {record.item.label} · {record.item.title}
              </h2>
              <BenchWork record={record} canReview={user.role === "instructor"} />
            </section>
          </Card>
        ))}
      </div>
    </AppFrame>
  );
}
