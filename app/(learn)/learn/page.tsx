import type { Metadata } from "next";
import Link from "next/link";
import { CertificateCard } from "@/components/certificate/certificate-card";
import { CourseMap } from "@/components/lesson/course-map";
import { LabScoreChart } from "@/components/lesson/lab-score-chart";
import { AppFrame } from "@/components/shell/app-frame";
import { buttonClass } from "@/components/ui/button-class";
import { Card } from "@/components/ui/card";
import { formatDayRange } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { listCohortsByMember } from "@/db/queries/cohorts";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { getCertificateStanding, type CertificateStanding } from "@/lib/certificates/standing";
import { learnerCertificatePath } from "@/lib/certificates/urls";
import { getCourseProgress, type CourseProgress } from "@/lib/progress";
import { WhatRemains } from "./what-remains";

export const metadata: Metadata = { title: "Your course" };

/**
 * What to do next: the next open lesson; once every lesson is done, what the certificate still
 * asks for. "Finished" is said only when the certificate's requirements are met.
 */
function NextStep({ progress, standing }: { progress: CourseProgress; standing: CertificateStanding }) {
  const next = progress.next;
  const total = progress.lessons.length;
  if (!next && standing.certificate) {
    return (
      <Card className="border-ok/40 bg-ok-soft">
        <p className="text-sm font-semibold uppercase tracking-wide text-ok">Course finished</p>
        <h2 className="mt-1 text-2xl font-semibold tracking-tight">Every requirement of the certificate is met</h2>
        <p className="mt-2 text-ink-soft">You can go back to any lesson or lab to revise.</p>
      </Card>
    );
  }
  if (!next) {
    return (
      <Card className="border-copper/40">
        <p className="text-sm font-semibold uppercase tracking-wide text-copper">Every lesson is done · the certificate is not earned yet</p>
        <h2 className="mt-1 text-2xl font-semibold tracking-tight">Still to do for the certificate</h2>
        {standing.requirements ? <WhatRemains status={standing.requirements} progress={progress} /> : null}
        <Link href={learnerCertificatePath} className={buttonClass("secondary", "mt-5")}>
          See every requirement
        </Link>
      </Card>
    );
  }
  const started = next.startedAt !== null || next.checks.answered > 0 || (next.lab?.attempts ?? 0) > 0;
  const todo = [
    next.checks.correct < next.checks.total ? `${next.checks.total - next.checks.correct} quick check${next.checks.total - next.checks.correct === 1 ? "" : "s"} to answer` : null,
    next.lab && !next.lab.passed ? "the lab to pass" : null,
  ].filter(Boolean);
  return (
    <Card className="border-accent/40">
      <p className="text-sm font-semibold uppercase tracking-wide text-copper">Up next · lesson {next.number} of {total}</p>
      <h2 className="mt-1 text-2xl font-semibold tracking-tight">{next.title}</h2>
      <p className="mt-2 max-w-2xl text-ink-soft">{next.summary}</p>
      {started && todo.length > 0 ? <p className="mt-2 text-sm font-medium text-ink">Still to do: {todo.join(" and ")}.</p> : null}
      <Link href={`/lessons/${next.slug}`} className={buttonClass("primary", "mt-5 px-5 py-3 text-base")}>
        {started ? `Continue lesson ${next.number}` : `Start lesson ${next.number}`}
        <span aria-hidden="true">→</span>
      </Link>
    </Card>
  );
}

export default async function LearnerHomePage() {
  const user = await requireRouteAccess("/learn");
  const [cohorts, progress] = await Promise.all([listCohortsByMember({ userId: user.id, role: "learner" }), getCourseProgress({ userId: user.id })]);
  // After the progress, which stamps finished lessons: the certificate is checked on what is recorded.
  const standing = await getCertificateStanding({ userId: user.id });
  const firstName = user.name.split(/\s+/)[0];
  const total = progress.lessons.length;
  const scores = progress.lessons.flatMap((lesson) =>
    lesson.lab ? [{ lesson: lesson.number, title: lesson.lab.title, bestScore: lesson.lab.bestScore, passed: lesson.lab.passed }] : [],
  );

  return (
    <AppFrame user={user}>
      <PageHeading
        eyebrow={progress.course.title}
        title={`Welcome, ${firstName}`}
        lead={`${progress.lessonsDone} of ${total} lessons done · ${progress.labsPassed} of ${scores.length} labs passed`}
      />
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="space-y-6">
          <NextStep progress={progress} standing={standing} />
          <Card>
            <h2 className="text-lg font-semibold">Course map</h2>
            <p className="mt-1 mb-4 text-sm text-ink-soft">
              A lesson is done when its lab is passed on the workbench and each of its quick checks has been answered
              correctly at least once. The certificate also asks for a minimum score in each lab and for each bench
              exercise to be accepted by your instructor.{" "}
              {progress.course.unlockInOrder
                ? "Lessons open in order: each one opens when the lesson before it is done."
                : "Every lesson is open: take them in the order that suits you."}
            </p>
            <CourseMap progress={progress} />
          </Card>
        </div>
        <div className="space-y-6">
          <CertificateCard standing={standing} />
          <Card>
            <h2 className="text-lg font-semibold">Best lab scores</h2>
            <p className="mt-1 text-sm text-ink-soft">Out of 100, one bar per lesson&apos;s lab; ✓ marks a pass.</p>
            {scores.some((s) => s.bestScore !== null) ? (
              <div className="mt-3">
                <LabScoreChart scores={scores} />
              </div>
            ) : (
              <p className="mt-3 rounded-lg border border-dashed border-line-strong bg-sunken px-4 py-3 text-sm text-ink-soft">
                Your scores appear here once you submit your first lab.
              </p>
            )}
          </Card>
          <Card>
            <h2 className="text-lg font-semibold">Your cohort</h2>
            {cohorts.length === 0 ? (
              <p className="mt-2 text-ink-soft">You are not in a cohort yet. Your school&apos;s admin can add you.</p>
            ) : (
              <ul className="mt-3 space-y-4">
                {cohorts.map((cohort) => (
                  <li key={cohort.id}>
                    <p className="font-medium">{cohort.name}</p>
                    <p className="text-sm text-ink-soft">{formatDayRange(cohort.startsOn, cohort.endsOn)}</p>
                    {cohort.instructorNames.length > 0 ? (
                      <p className="text-sm text-ink-soft">Instructor: {cohort.instructorNames.join(", ")}</p>
                    ) : null}
                  </li>
                ))}
              </ul>
            )}
          </Card>
        </div>
      </div>
    </AppFrame>
  );
}
