import type { Metadata } from "next";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { PageHeading } from "@/components/ui/page-heading";
import { listInstructorsBySchool } from "@/db/queries/admin-cohorts";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { courseOptions } from "@/lib/enrolment";
import { CohortForm } from "../../cohort-form";
import { loadAdminCohort } from "../load-cohort";

export const metadata: Metadata = { title: "Edit cohort" };

export default async function EditCohortPage({ params }: { params: Promise<{ cohortId: string }> }) {
  const { cohortId } = await params;
  const admin = await requireRouteAccess("/admin/cohorts/[cohortId]/edit", { cohortId });
  const [cohort, instructors] = await Promise.all([
    loadAdminCohort({ schoolId: admin.schoolId, cohortId }),
    listInstructorsBySchool({ schoolId: admin.schoolId }),
  ]);
  return (
    <AppFrame user={admin}>
      <PageHeading eyebrow="Edit cohort" title={cohort.name} lead="Changes apply at once; learners and their work stay as they are." />
      <Card className="max-w-2xl">
        <CohortForm
          initial={{
            cohortId: cohort.id,
            name: cohort.name,
            courseSlug: cohort.courseSlug,
            startsOn: cohort.startsOn,
            endsOn: cohort.endsOn,
            instructorIds: cohort.instructorIds,
          }}
          courses={courseOptions()}
          instructors={instructors}
          cancelHref={`/admin/cohorts/${cohort.id}`}
        />
      </Card>
    </AppFrame>
  );
}
