import { NextResponse } from "next/server";
import { z } from "zod";
import { listLabAttemptsByLearner, recordLabAttempt } from "@/db/queries/attempts";
import { findLearnerCohortId } from "@/db/queries/cohorts";
import { getCourse } from "@/lessons";
import { checkCertificateAfterCourseWork } from "@/lib/certificates";
import { outcomeOf, scoreWork, toAttemptView, variantSeedFor, verdictLines } from "@/lib/grading";
import { readAttemptPageQuery, toAttemptPage } from "@/lib/grading/attempt-pages";
import { gradeWorkOffThread } from "@/lib/grading/grade-off-thread";
import { invalidInput, issuesOf } from "@/lib/grading/input-error";
import { bodyLimits } from "@/lib/http/body-limits";
import { AppError } from "@/lib/http/errors";
import { readJsonBody } from "@/lib/http/json-body";
import { errorResponse } from "@/lib/http/respond";
import { limitRequest } from "@/lib/rate-limit/limit-request";
import { findLab, requireLearner, requireOpenLab, withSession } from "../../learner-request";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ labSlug: string }> };

const submissionSchema = z.strictObject({
  choices: z.record(z.string(), z.unknown(), { error: "must be an object of choices by run" }),
  answers: z.record(z.string(), z.string({ error: "must be text" }).max(200, { error: "must be at most 200 characters" })).optional(),
  idempotencyKey: z.uuid({ error: "must be a UUID made by the client for this submission" }),
});

/**
 * Grades a submission on the server (the browser's own preview is never trusted) and stores it as
 * the learner's next attempt. A retried submission with the same idempotency key gets the stored
 * attempt back instead of a second one.
 */
export async function POST(request: Request, context: Context): Promise<NextResponse> {
  try {
    const learner = await requireLearner(request);
    await limitRequest(request, "grading", learner.user.id);
    const lab = findLab((await context.params).labSlug);
    await requireOpenLab(learner.user, lab);
    // The learner, the lab and its lock are checked first: a refused request's body is never read.
    const body = submissionSchema.safeParse(await readJsonBody(request, bodyLimits.labSubmission));
    if (!body.success) throw invalidInput(issuesOf(body.error));
    const { user } = learner;
    const seed = variantSeedFor(user.id, lab.slug);
    const work = await gradeWorkOffThread({ lab, seed, choices: body.data.choices, answers: body.data.answers });

    const recorded = await recordLabAttempt({
      userId: user.id,
      labSlug: lab.slug,
      cohortId: await findLearnerCohortId({ userId: user.id, courseSlug: getCourse().slug }),
      idempotencyKey: body.data.idempotencyKey,
      variantSeed: seed,
      choices: work.choices,
      score: (attemptNumber) => {
        const grade = scoreWork(lab, work, attemptNumber);
        return { outcome: outcomeOf(grade), score: grade.score, passed: grade.passed };
      },
    });
    if (recorded.status === "key-taken") {
      throw new AppError("conflict", "That submission key was already used for another lab. Submit again.");
    }
    const attempt = toAttemptView(recorded.attempt);
    // A replay checks too: the first answer may have been cut off between the commit and the check.
    if (attempt.passed) await checkCertificateAfterCourseWork({ userId: user.id });
    return withSession(
      NextResponse.json(
        { attempt, score: attempt.score, passed: attempt.passed, reasons: verdictLines(attempt), replayed: recorded.status === "replayed" },
        { status: recorded.status === "created" ? 201 : 200 },
      ),
      learner,
    );
  } catch (error) {
    return errorResponse(error);
  }
}

/**
 * The learner's own attempts at the lab, newest first, a page at a time: `?limit=` (20 unless
 * given, at most 100) and `?cursor=` from the previous page's `nextCursor`, null on the last page.
 */
export async function GET(request: Request, context: Context): Promise<NextResponse> {
  try {
    const learner = await requireLearner(request);
    const lab = findLab((await context.params).labSlug);
    const { limit, cursor } = readAttemptPageQuery(request.url);
    const rows = await listLabAttemptsByLearner({ userId: learner.user.id, labSlug: lab.slug, limit: limit + 1, beforeNumber: cursor });
    const page = toAttemptPage(rows, limit);
    return withSession(NextResponse.json({ attempts: page.items.map(toAttemptView), nextCursor: page.nextCursor }), learner);
  } catch (error) {
    return errorResponse(error);
  }
}
