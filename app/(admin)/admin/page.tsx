import type { Metadata } from "next";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { formatDayRange, formatMoment } from "@/components/ui/dates";
import { PageHeading } from "@/components/ui/page-heading";
import { listCohortsBySchool } from "@/db/queries/cohorts";
import { listPendingInvitationsBySchool } from "@/db/queries/invitations";
import { findSchoolById } from "@/db/queries/schools";
import { listUsersBySchool } from "@/db/queries/users";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { InviteForm } from "./invite-form";

export const metadata: Metadata = { title: "School" };

const roleLabels = { admin: "Admin", instructor: "Instructor", learner: "Learner" } as const;

export default async function AdminHomePage() {
  const admin = await requireRouteAccess("/admin");
  const [school, cohorts, people, invitations] = await Promise.all([
    findSchoolById({ schoolId: admin.schoolId }),
    listCohortsBySchool({ schoolId: admin.schoolId }),
    listUsersBySchool({ schoolId: admin.schoolId }),
    listPendingInvitationsBySchool({ schoolId: admin.schoolId, now: new Date() }),
  ]);

  return (
    <AppFrame user={admin}>
      <PageHeading
        eyebrow="School admin"
        title={school?.name ?? "Your school"}
        lead="Cohorts, the people in them, and invitations that have not been accepted yet."
      />
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="space-y-6">
          <Card>
            <h2 className="text-lg font-semibold">Cohorts ({cohorts.length})</h2>
            {cohorts.length === 0 ? (
              <p className="mt-2 text-ink-soft">No cohorts yet.</p>
            ) : (
              <ul className="mt-3 divide-y divide-line">
                {cohorts.map((cohort) => (
                  <li key={cohort.id} className="py-3">
                    <p className="font-medium">{cohort.name}</p>
                    <p className="text-sm text-ink-soft">
                      {formatDayRange(cohort.startsOn, cohort.endsOn)} · {cohort.learnerCount} learner
                      {cohort.learnerCount === 1 ? "" : "s"}
                      {cohort.instructorNames.length > 0 ? ` · taught by ${cohort.instructorNames.join(", ")}` : ""}
                    </p>
                  </li>
                ))}
              </ul>
            )}
          </Card>
          <Card>
            <h2 className="text-lg font-semibold">People ({people.length})</h2>
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
                  {people.map((person) => (
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
              They get an e-mail with a link to choose their name and password. The link works once, for 7 days.
            </p>
            <InviteForm cohorts={cohorts.map(({ id, name }) => ({ id, name }))} />
          </Card>
          <Card>
            <h2 className="text-lg font-semibold">Waiting to be accepted ({invitations.length})</h2>
            {invitations.length === 0 ? (
              <p className="mt-2 text-sm text-ink-soft">No open invitations.</p>
            ) : (
              <ul className="mt-3 divide-y divide-line text-sm">
                {invitations.map((invitation) => (
                  <li key={invitation.id} className="py-2.5">
                    <p className="font-medium break-all">{invitation.email}</p>
                    <p className="text-ink-soft">
                      {roleLabels[invitation.role]}
                      {invitation.cohortName ? ` · ${invitation.cohortName}` : ""} · expires {formatMoment(invitation.expiresAt)}
                    </p>
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
