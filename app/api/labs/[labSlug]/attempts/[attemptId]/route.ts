import { NextResponse } from "next/server";
import { z } from "zod";
import { findLabAttemptOfLearner } from "@/db/queries/attempts";
import { buildSimInput, labVariant } from "@/lessons";
import { toAttemptView } from "@/lib/grading";
import { AppError } from "@/lib/http/errors";
import { errorResponse } from "@/lib/http/respond";
import { findLab, requireLearner, withSession } from "../../../learner-request";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ labSlug: string; attemptId: string }> };

/**
 * One of the learner's attempts with the simulator input of each run rebuilt from the stored seed
 * and choices, so the workbench can re-simulate and redraw exactly what was graded.
 */
export async function GET(request: Request, context: Context): Promise<NextResponse> {
  try {
    const learner = await requireLearner(request);
    const { labSlug, attemptId } = await context.params;
    const lab = findLab(labSlug);
    const notFound = new AppError("not-found", "There is no such attempt of yours at this lab.");
    if (!z.uuid().safeParse(attemptId).success) throw notFound;
    const stored = await findLabAttemptOfLearner({ attemptId, userId: learner.user.id, labSlug: lab.slug });
    if (!stored) throw notFound;
    const attempt = toAttemptView(stored);
    const variant = labVariant(lab, stored.variantSeed);
    const runs = variant.runs.map((run) => ({
      runId: run.id,
      label: run.label,
      input: buildSimInput(run.scenario, attempt.choices[run.id] ?? {}),
    }));
    return withSession(NextResponse.json({ attempt, runs }), learner);
  } catch (error) {
    return errorResponse(error);
  }
}
