import type { Metadata } from "next";
import { AppFrame } from "@/components/shell/app-frame";
import { Card } from "@/components/ui/card";
import { PageHeading } from "@/components/ui/page-heading";
import { listInstructorsBySchool } from "@/db/queries/admin-cohorts";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { courseOptions } from "@/lib/enrolment";
import { CohortForm } from "../cohort-form";

export const metadata: Metadata = { title: "New cohort" };

export default async function NewCohortPage() {
  const admin = await requireRouteAccess("/admin/cohorts/new");
  const instructors = await listInstructorsBySchool({ schoolId: admin.schoolId });
  const courses = courseOptions();
  return (
    <AppFrame user={admin}>
      <PageHeading eyebrow="School admin" title="New cohort" lead="A group of learners who take the course together, with its dates and instructors." />
      <Card className="max-w-2xl">
        <CohortForm
          initial={{ cohortId: null, name: "", courseSlug: courses[0]!.value, startsOn: "", endsOn: "", instructorIds: [] }}
          courses={courses}
          instructors={instructors}
          cancelHref="/admin"
        />
      </Card>
    </AppFrame>
  );
}
