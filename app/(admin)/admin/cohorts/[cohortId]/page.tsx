import type { Metadata } from "next";
import Link from "next/link";
import { z } from "zod";
import { AppFrame } from "@/components/shell/app-frame";
import { buttonClass } from "@/components/ui/button-class";
import { Card } from "@/components/ui/card";
import { formatDayRange } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { listInstructorsBySchool } from "@/db/queries/admin-cohorts";
import { listCohortRoster } from "@/db/queries/enrolment";
import { getCourse } from "@/lessons";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { buildRoster, countRosterStates, filterRoster, type RosterState } from "@/lib/enrolment";
import { StatusNotice } from "../../status-notice";
import { EnrolForm } from "./enrol-form";
import { loadAdminCohort } from "./load-cohort";
import { ResendWaitingButton } from "./resend-waiting-button";
import { RosterTable } from "./roster-table";

export const metadata: Metadata = { title: "Cohort" };

const pageSize = 50;

const stateFilters = ["all", "accepted", "unsent", "pending", "expired", "revoked", "deactivated"] as const;

const searchSchema = z.object({
  state: z.enum(stateFilters).catch("all"),
  q: z.string().max(200).catch(""),
  page: z.coerce.number().int().min(1).catch(1),
  notice: z.enum(["created", "saved", "imported"]).optional().catch(undefined),
});

const notices = {
  created: "Cohort created. Enrol learners one by one below, or import a CSV list.",
  saved: "Changes saved.",
  imported: "Import finished.",
} as const;

function describeWaitingMail(unsent: number): string {
  const what = unsent === 1 ? "1 invitation e-mail has" : `${unsent.toLocaleString("en-GB")} invitation e-mails have`;
  return `${what} not gone out yet because the mail server did not answer. Edgewise keeps trying on its own and sends ${unsent === 1 ? "it" : "them"} once mail works again; “Resend all waiting” tries at once.`;
}

export default async function AdminCohortPage({
  params,
  searchParams,
}: {
  params: Promise<{ cohortId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { cohortId } = await params;
  const admin = await requireRouteAccess("/admin/cohorts/[cohortId]", { cohortId });
  const cohort = await loadAdminCohort({ schoolId: admin.schoolId, cohortId });
  const search = searchSchema.parse(await searchParams);
  const [roster, instructors] = await Promise.all([
    listCohortRoster({ schoolId: admin.schoolId, cohortId: cohort.id }),
    listInstructorsBySchool({ schoolId: admin.schoolId }),
  ]);

  const lines = buildRoster(roster.members, roster.invitations, new Date());
  const counts = countRosterStates(lines);
  const filtered = filterRoster(lines, { state: search.state, query: search.q });
  const pageCount = Math.max(1, Math.ceil(filtered.length / pageSize));
  const page = Math.min(search.page, pageCount);
  const shown = filtered.slice((page - 1) * pageSize, page * pageSize);
  const teaching = instructors.filter((instructor) => cohort.instructorIds.includes(instructor.id));
  const course = getCourse();

  return (
    <AppFrame user={admin}>
      <p className="mb-2 text-sm">
        <Link href="/admin" className="text-accent underline-offset-2 hover:underline">
          ← School
        </Link>
      </p>
      <PageHeading
        eyebrow="Cohort"
        title={cohort.name}
        lead={
          <>
            {cohort.courseSlug === course.slug ? course.title : cohort.courseSlug} · {formatDayRange(cohort.startsOn, cohort.endsOn)} ·{" "}
            {teaching.length > 0 ? `taught by ${teaching.map((instructor) => instructor.name).join(", ")}` : "no instructor yet"}
          </>
        }
      />
      {search.notice ? <StatusNotice tone="success" message={notices[search.notice]} className="mb-6" /> : null}
      {counts.unsent > 0 ? <StatusNotice tone="warning" message={describeWaitingMail(counts.unsent)} className="mb-6" /> : null}
      <div className="mb-6 flex flex-wrap items-start gap-3">
        <Link href={`/admin/cohorts/${cohort.id}/import`} className={buttonClass("primary")}>
          Import a CSV list
        </Link>
        <Link href={`/admin/cohorts/${cohort.id}/edit`} className={buttonClass("secondary")}>
          Edit cohort
        </Link>
        <Link href={`/cohorts/${cohort.id}`} className={buttonClass("secondary")}>
          Progress and grade book
        </Link>
        <ResendWaitingButton cohortId={cohort.id} waiting={counts.unsent + counts.pending + counts.expired} />
      </div>

      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,2fr)]">
        <Card>
          <RosterTable
            cohortId={cohort.id}
            lines={shown}
            counts={counts}
            total={lines.length}
            filteredTotal={filtered.length}
            filter={{ state: search.state as RosterState | "all", query: search.q }}
            page={page}
            pageCount={pageCount}
            pageSize={pageSize}
          />
        </Card>
        <div className="space-y-6">
          <Card>
            <h2 className="text-lg font-semibold">Enrol a learner</h2>
            <p className="mb-4 mt-1 text-sm text-ink-soft">
              They get an e-mail with a link to set their password. Until they accept, they cannot sign in. The link works once, for 7 days.
            </p>
            <EnrolForm cohortId={cohort.id} />
          </Card>
        </div>
      </div>
    </AppFrame>
  );
}
