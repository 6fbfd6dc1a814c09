import type { Metadata } from "next";
import Link from "next/link";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { PageHeading } from "@/components/ui/page-heading";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { loadAdminCohort } from "../load-cohort";
import { RosterImport } from "./roster-import";

export const metadata: Metadata = { title: "Import learners" };

export default async function ImportRosterPage({ params }: { params: Promise<{ cohortId: string }> }) {
  const { cohortId } = await params;
  const admin = await requireRouteAccess("/admin/cohorts/[cohortId]/import", { cohortId });
  const cohort = await loadAdminCohort({ schoolId: admin.schoolId, cohortId });
  return (
    <AppFrame user={admin}>
      <p className="mb-2 text-sm">
        <Link href={`/admin/cohorts/${cohort.id}`} className="text-accent underline-offset-2 hover:underline">
          ← {cohort.name}
        </Link>
      </p>
      <PageHeading eyebrow="Import learners" title={cohort.name} lead="Upload a list of names and e-mail addresses. You see what would happen to every row before anything is saved." />
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,2fr)]">
        <Card>
          <RosterImport cohortId={cohort.id} cohortName={cohort.name} />
        </Card>
        <Card className="text-sm">
          <h2 className="text-base font-semibold">What the file should look like</h2>
          <p className="mt-2 text-ink-soft">One learner per line, with a first line naming the columns:</p>
          <pre className="mt-2 overflow-x-auto rounded-lg bg-sunken p-3 text-xs">{`name,e-mail
Rosa Tern,rosa@example.org
"Quill, Amos",amos@example.org`}</pre>
          <ul className="mt-3 list-disc space-y-1.5 pl-5 text-ink-soft">
            <li>Commas, semicolons or tabs between the columns; spreadsheets&apos; “CSV” export works as it is.</li>
            <li>Column names such as “Name”, “Full name”, “E-mail address”, or separate “First name” and “Last name”.</li>
            <li>Other columns are ignored.</li>
            <li>People already in the cohort or the school, and repeated addresses, are shown as duplicates and skipped.</li>
          </ul>
        </Card>
      </div>
    </AppFrame>
  );
}
