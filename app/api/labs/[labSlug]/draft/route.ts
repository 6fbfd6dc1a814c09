import { NextResponse } from "next/server";
import { saveLabDraft } from "@/db/queries/lab-drafts";
import { labVariant } from "@/lessons";
import { variantSeedFor } from "@/lib/grading";
import { invalidInput, issuesOf } from "@/lib/grading/input-error";
import { bodyLimits } from "@/lib/http/body-limits";
import { readJsonBody } from "@/lib/http/json-body";
import { errorResponse } from "@/lib/http/respond";
import { labDraftSchemaFor } from "@/lib/lab-drafts";
import { limitRequest } from "@/lib/rate-limit/limit-request";
import { findLab, requireLearner, requireOpenLab, withSession } from "../../learner-request";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ labSlug: string }> };

/**
 * Keeps the learner's latest workbench for the lab (every run's choices and the answers typed so
 * far), so that the lab page opens with it. Each value must be one the learner's variant offers.
 */
export async function POST(request: Request, context: Context): Promise<NextResponse> {
  try {
    const learner = await requireLearner(request);
    await limitRequest(request, "workbench-save", learner.user.id);
    const lab = findLab((await context.params).labSlug);
    await requireOpenLab(learner.user, lab);
    // The learner, the limits, the lab and its lock are checked first: a refused request's body is never read.
    const variant = labVariant(lab, variantSeedFor(learner.user.id, lab.slug));
    const body = labDraftSchemaFor(lab, variant).safeParse(await readJsonBody(request, bodyLimits.labDraft));
    if (!body.success) throw invalidInput(issuesOf(body.error));
    await saveLabDraft({ userId: learner.user.id, labSlug: lab.slug, choices: body.data.choices, answers: body.data.answers });
    return withSession(NextResponse.json({ saved: true }), learner);
  } catch (error) {
    return errorResponse(error);
  }
}
