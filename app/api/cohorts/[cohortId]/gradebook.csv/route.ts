import { z } from "zod";
import { decideRoleAccess } from "@/lib/auth/access";
import { protectedRoutes } from "@/lib/auth/route-access";
import { gradebookCsv, gradebookFileName } from "@/lib/gradebook";
import { loadCohortGradebook } from "@/lib/gradebook/load";
import { AppError } from "@/lib/http/errors";
import { errorResponse } from "@/lib/http/respond";
import { findViewerOfRequest } from "@/lib/uploads/request-viewer";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ cohortId: string }> };

/**
 * The cohort's grade book as a CSV download, for whoever may open the cohort's page: its
 * instructors and the admins of its school. A cohort the viewer may not see answers 404, as an
 * unknown one does, so its existence is not confirmed.
 */
export async function GET(request: Request, context: Context): Promise<Response> {
  try {
    const viewer = await findViewerOfRequest(request);
    const decision = decideRoleAccess(viewer, protectedRoutes["/cohorts/[cohortId]"]);
    if (decision === "sign-in") throw new AppError("unauthenticated");
    if (decision === "forbidden") throw new AppError("forbidden", "Only a cohort's instructors and its school's admins can export its grade book.");
    const { cohortId } = await context.params;
    const missing = new AppError("not-found", "There is no such cohort among the ones you can see.");
    if (!z.uuid().safeParse(cohortId).success) throw missing;
    const now = new Date();
    const loaded = await loadCohortGradebook({ cohortId, viewer: viewer!, now });
    if (!loaded) throw missing;
    return new Response(gradebookCsv(loaded.gradebook), {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="${gradebookFileName(loaded.cohort.name, now)}"`,
        "cache-control": "private, no-store",
        "x-content-type-options": "nosniff",
      },
    });
  } catch (error) {
    return errorResponse(error);
  }
}
