import type { Metadata } from "next";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatDayRange } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { listCohortsByMember } from "@/db/queries/cohorts";
import { requireRouteAccess } from "@/lib/auth/current-user";

export const metadata: Metadata = { title: "Your course" };

export default async function LearnerHomePage() {
  const user = await requireRouteAccess("/learn");
  const cohorts = await listCohortsByMember({ userId: user.id, role: "learner" });
  const firstName = user.name.split(/\s+/)[0];

  return (
    <AppFrame user={user}>
      <PageHeading
        eyebrow="Your course"
        title={`Welcome, ${firstName}`}
        lead="Work through the lessons in order. Each one ends in a lab on the workbench, where the line simulator gives your design a verdict."
      />
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <Card>
          <h2 className="text-lg font-semibold">Course map</h2>
          <p className="mt-2 text-ink-soft">
            The lessons come here: from the pixel data stream and logic levels, through edges, cables as transmission
            lines and reflections, to series termination and designing a real run.
          </p>
          <p className="mt-4 rounded-lg border border-dashed border-line-strong bg-sunken px-4 py-3 text-sm text-ink-soft">
            Your instructor will tell you when the first lesson opens.
          </p>
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
    </AppFrame>
  );
}
