import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatDayRange } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { findCohortTaughtBy, listCohortMembers } from "@/db/queries/cohorts";
import { requireRouteAccess } from "@/lib/auth/current-user";

export const metadata: Metadata = { title: "Cohort" };

export default async function CohortPage({ params }: { params: Promise<{ cohortId: string }> }) {
  const { cohortId } = await params;
  const user = await requireRouteAccess("/cohorts/[cohortId]", { cohortId });
  if (!z.uuid().safeParse(cohortId).success) notFound();
  // A cohort the instructor does not teach is reported as missing, not as forbidden, so its
  // existence is not confirmed to them.
  const cohort = await findCohortTaughtBy({ cohortId, instructorId: user.id });
  if (!cohort) notFound();
  const learners = await listCohortMembers({ cohortId: cohort.id, role: "learner" });

  return (
    <AppFrame user={user}>
      <p className="mb-4 text-sm">
        <Link href="/cohorts" className="font-medium text-accent underline-offset-2 hover:underline">
          ← My cohorts
        </Link>
      </p>
      <PageHeading eyebrow={formatDayRange(cohort.startsOn, cohort.endsOn)} title={cohort.name} />
      <Card>
        <h2 className="text-lg font-semibold">Learners ({learners.length})</h2>
        {learners.length === 0 ? (
          <p className="mt-2 text-ink-soft">No learners have joined yet.</p>
        ) : (
          <ul className="mt-3 divide-y divide-line">
            {learners.map((learner) => (
              <li key={learner.userId} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-3">
                <span className="font-medium">{learner.name}</span>
                <span className="text-sm text-ink-soft">{learner.email}</span>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-4 rounded-lg border border-dashed border-line-strong bg-sunken px-4 py-3 text-sm text-ink-soft">
          Lesson progress and lab verdicts appear here once the course is published.
        </p>
      </Card>
    </AppFrame>
  );
}
