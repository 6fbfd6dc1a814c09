import type { Metadata } from "next";
import Link from "next/link";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatDayRange } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { listCohortsByMember } from "@/db/queries/cohorts";
import { requireRouteAccess } from "@/lib/auth/current-user";

export const metadata: Metadata = { title: "My cohorts" };

export default async function InstructorHomePage() {
  const user = await requireRouteAccess("/cohorts");
  const cohorts = await listCohortsByMember({ userId: user.id, role: "instructor" });

  return (
    <AppFrame user={user}>
      <PageHeading
        eyebrow="Teaching"
        title="My cohorts"
        lead="Open a cohort for its progress grid: who is stuck where, every attempt on the scope, and the grade book to download."
      />
      {cohorts.length === 0 ? (
        <Card>
          <p className="text-ink-soft">You are not teaching a cohort yet. Your school&apos;s admin assigns instructors.</p>
        </Card>
      ) : (
        <ul className="grid gap-4 sm:grid-cols-2">
          {cohorts.map((cohort) => (
            <li key={cohort.id}>
              <Link
                href={`/cohorts/${cohort.id}`}
                className="block rounded-card border border-line bg-surface p-5 no-underline transition-colors hover:border-accent"
              >
                <h2 className="text-lg font-semibold text-ink">{cohort.name}</h2>
                <p className="mt-1 text-sm text-ink-soft">{formatDayRange(cohort.startsOn, cohort.endsOn)}</p>
                <p className="mt-3 text-sm font-medium text-accent">
                  {cohort.learnerCount} learner{cohort.learnerCount === 1 ? "" : "s"} →
                </p>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </AppFrame>
  );
}
