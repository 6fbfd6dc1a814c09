import type { Metadata } from "next";
import Link from "next/link";
import { AppFrame } from "@/components/shell/app-frame";
import { buttonClass } from "@/components/ui/button-class";
import { Card } from "@/components/ui/card";
import { formatDayRange, formatMoment } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { listCohortsBySchool } from "@/db/queries/cohorts";
import { countLearnersBySchool, listOpenInvitationsBySchool, listStaffBySchool } from "@/db/queries/enrolment";
import { findSchoolById } from "@/db/queries/schools";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { EntryButtons } from "./entry-buttons";
import { InviteForm } from "./invite-form";

export const metadata: Metadata = { title: "School" };

const roleLabels = { admin: "Admin", instructor: "Instructor", learner: "Learner" } as const;
const openInvitationsShown = 10;

export default async function AdminHomePage() {
  const admin = await requireRouteAccess("/admin");
  const now = new Date();
  const [school, cohorts, staff, headcount, open] = await Promise.all([
    findSchoolById({ schoolId: admin.schoolId }),
    listCohortsBySchool({ schoolId: admin.schoolId }),
    listStaffBySchool({ schoolId: admin.schoolId }),
    countLearnersBySchool({ schoolId: admin.schoolId }),
    listOpenInvitationsBySchool({ schoolId: admin.schoolId, now, limit: openInvitationsShown }),
  ]);

  return (
    <AppFrame user={admin}>
      <PageHeading
        eyebrow="School admin"
        title={school?.name ?? "Your school"}
        lead="Cohorts and their learners, your instructors, and invitations that have not been accepted yet."
      />
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="space-y-6">
          <Card>
            <div className="flex flex-wrap items-center justify-between gap-3">
              <h2 className="text-lg font-semibold">Cohorts ({cohorts.length})</h2>
              <Link href="/admin/cohorts/new" className={buttonClass("primary", "px-3 py-2")}>
                New cohort
              </Link>
            </div>
            {cohorts.length === 0 ? (
              <p className="mt-2 text-ink-soft">No cohorts yet. Create one, then enrol its learners.</p>
            ) : (
              <ul className="mt-3 divide-y divide-line">
                {cohorts.map((cohort) => (
                  <li key={cohort.id}>
                    <Link href={`/admin/cohorts/${cohort.id}`} className="group -mx-2 block rounded-lg px-2 py-3 no-underline hover:bg-sunken">
                      <span className="flex items-baseline justify-between gap-3">
                        <span className="font-medium text-ink group-hover:text-accent-strong">{cohort.name}</span>
                        <span className="shrink-0 text-sm text-accent" aria-hidden="true">
                          Open →
                        </span>
                      </span>
                      <span className="block text-sm text-ink-soft">
                        {formatDayRange(cohort.startsOn, cohort.endsOn)} · {cohort.learnerCount} learner{cohort.learnerCount === 1 ? "" : "s"}
                        {cohort.instructorNames.length > 0 ? ` · taught by ${cohort.instructorNames.join(", ")}` : " · no instructor yet"}
                      </span>
                    </Link>
                  </li>
                ))}
              </ul>
            )}
          </Card>
          <Card>
            <h2 className="text-lg font-semibold">Instructors and admins ({staff.length})</h2>
            <p className="mt-1 text-sm text-ink-soft">
              {headcount.learners} learner{headcount.learners === 1 ? "" : "s"} in all
              {headcount.awaiting > 0 ? `, ${headcount.awaiting} not yet accepted` : ""}
              {headcount.deactivated > 0 ? `, ${headcount.deactivated} deactivated` : ""}. Learners are listed in their cohorts.
            </p>
            <div className="-mx-5 mt-3 sm:-mx-6">
              <table className="w-full text-left text-sm">
                <thead className="border-b border-line text-ink-faint">
                  <tr>
                    <th scope="col" className="px-5 py-2 font-medium sm:px-6">Name</th>
                    <th scope="col" className="hidden px-2 py-2 font-medium sm:table-cell">E-mail</th>
                    <th scope="col" className="px-5 py-2 font-medium sm:px-6">Role</th>
                  </tr>
                </thead>
                <tbody className="divide-y divide-line">
                  {staff.map((person) => (
                    <tr key={person.id}>
                      <td className="px-5 py-2.5 font-medium sm:px-6">
                        {person.name}
                        {person.active ? null : <span className="ml-2 text-xs text-danger">deactivated</span>}
                        <span className="block font-normal break-all text-ink-soft sm:hidden">{person.email}</span>
                      </td>
                      <td className="hidden px-2 py-2.5 text-ink-soft sm:table-cell">{person.email}</td>
                      <td className="px-5 py-2.5 align-top sm:px-6 sm:align-middle">{roleLabels[person.role]}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </Card>
        </div>
        <div className="space-y-6">
          <Card>
            <h2 className="text-lg font-semibold">Invite someone</h2>
            <p className="mb-4 mt-1 text-sm text-ink-soft">
              For instructors, or a single learner who will choose their own name. To enrol learners by name or from a list, open their
              cohort. The link works once, for 7 days.
            </p>
            <InviteForm cohorts={cohorts.map(({ id, name }) => ({ id, name }))} />
          </Card>
          <Card>
            <h2 className="text-lg font-semibold">Waiting to be accepted ({open.total})</h2>
            {open.total === 0 ? (
              <p className="mt-2 text-sm text-ink-soft">No open invitations.</p>
            ) : (
              <>
                <ul className="mt-3 divide-y divide-line text-sm">
                  {open.invitations.map((invitation) => (
                    <li key={invitation.id} className="space-y-2 py-2.5">
                      <div>
                        <p className="font-medium break-all">{invitation.email}</p>
                        <p className="text-ink-soft">
                          {roleLabels[invitation.role]}
                          {invitation.cohortName ? ` · ${invitation.cohortName}` : ""} · expires {formatMoment(invitation.expiresAt)}
                        </p>
                      </div>
                      <EntryButtons cohortId={null} state="pending" userId={null} invitationId={invitation.id} who={invitation.email} />
                    </li>
                  ))}
                </ul>
                {open.total > open.invitations.length ? (
                  <p className="mt-2 text-sm text-ink-soft">
                    The newest {open.invitations.length} are shown; each cohort lists all of its own.
                  </p>
                ) : null}
              </>
            )}
          </Card>
        </div>
      </div>
    </AppFrame>
  );
}
