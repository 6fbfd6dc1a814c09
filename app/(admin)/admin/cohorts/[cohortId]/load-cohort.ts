import "server-only";
import { notFound } from "next/navigation";
import { z } from "zod";
import { findCohortForAdmin, type AdminCohort } from "@/db/queries/admin-cohorts";

/** The cohort named in the URL, if it belongs to the admin's school; any other id is a 404. */
export async function loadAdminCohort(params: { schoolId: string; cohortId: string }): Promise<AdminCohort> {
  const cohortId = z.uuid().safeParse(params.cohortId);
  const cohort = cohortId.success ? await findCohortForAdmin({ schoolId: params.schoolId, cohortId: cohortId.data }) : undefined;
  if (!cohort) notFound();
  return cohort;
}
