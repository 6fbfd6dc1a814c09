import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { AttemptsPerDayChart } from "@/components/gradebook/attempts-per-day-chart";
import { ProgressGrid } from "@/components/gradebook/progress-grid";
import { ScoreDistributionChart } from "@/components/gradebook/score-distribution-chart";
import { AppFrame } from "@/components/shell/app-frame";
import { buttonClass } from "@/components/ui/button-class";
import { Card } from "@/components/ui/card";
import { formatDayRange } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { stuckRule } from "@/lib/gradebook";
import { loadCohortOverview } from "@/lib/gradebook/load";
import { plural } from "@/lib/gradebook/words";

export const metadata: Metadata = { title: "Cohort progress" };

export default async function CohortPage({ params }: { params: Promise<{ cohortId: string }> }) {
  const { cohortId } = await params;
  const user = await requireRouteAccess("/cohorts/[cohortId]", { cohortId });
  if (!z.uuid().safeParse(cohortId).success) notFound();
  const now = new Date();
  // A cohort the viewer may not see is reported as missing, not as forbidden, so its existence
  // is not confirmed to them.
  const overview = await loadCohortOverview({ cohortId, viewer: user, now });
  if (!overview) notFound();
  const { cohort, gradebook, distributions, days } = overview;
  const { counts } = gradebook;
  const back = user.role === "admin" ? { href: "/admin", label: "← School" } : { href: "/cohorts", label: "← My cohorts" };

  return (
    <AppFrame user={user}>
      <p className="mb-4 text-sm">
        <Link href={back.href} className="font-medium text-accent underline-offset-2 hover:underline">
          {back.label}
        </Link>
      </p>
      <PageHeading
        eyebrow={formatDayRange(cohort.startsOn, cohort.endsOn)}
        title={cohort.name}
        lead={
          gradebook.rows.length === 0
            ? "No learners have joined yet."
            : `${plural(gradebook.rows.length, "learner")}: ${counts.stuck} need${counts.stuck === 1 ? "s" : ""} attention, ${counts.complete} passed everything, ${counts["not-started"]} not started.`
        }
      />

      {/* On screens wider than the page column the grid takes the extra width, so more items fit unscrolled. */}
      <div className="mb-6" style={{ marginInline: "min(0px, calc((72rem - 100vw) / 2))" }}>
        <Card>
          <div className="mb-4 flex flex-wrap items-start justify-between gap-4">
            <div>
              <h2 className="text-lg font-semibold">Progress grid</h2>
              <p className="mt-1 max-w-3xl text-sm text-ink-soft">
                Best score per lab and bench exercise. A learner needs attention after {stuckRule.failedAttempts} failed
                attempts at one lab without a pass, or {stuckRule.idleDays} days without any activity. Open a learner to
                see every attempt on the scope.
              </p>
            </div>
            <a href={`/api/cohorts/${cohort.id}/gradebook.csv`} download className={buttonClass("secondary")}>
              Download grade book (CSV)
            </a>
          </div>
          {gradebook.rows.length === 0 ? (
            <p className="text-ink-soft">The grid fills in as learners join and start the labs.</p>
          ) : (
            <ProgressGrid items={gradebook.items} rows={gradebook.rows} cohortId={cohort.id} now={now} />
          )}
        </Card>
      </div>

      {gradebook.rows.length > 0 ? (
        <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
          <Card className="min-w-0">
            <ScoreDistributionChart distributions={distributions} />
          </Card>
          <Card className="min-w-0">
            <AttemptsPerDayChart days={days} />
          </Card>
        </div>
      ) : null}
    </AppFrame>
  );
}
