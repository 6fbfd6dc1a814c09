import "server-only";
import type { NextResponse } from "next/server";
import { decideRoleAccess } from "@/lib/auth/access";
import { readSessionTokenOfRequest } from "@/lib/auth/request-session-token";
import { validateSessionToken, type SessionCookie, type SessionUser } from "@/lib/auth/session-store";
import { getLab, getLessonOfLab, type Lab } from "@/lessons";
import { AppError } from "@/lib/http/errors";
import { findLessonProgressView } from "@/lib/progress";

// Route handlers answer in JSON: no redirect to sign-in and no 403 page, but 401 and 403 bodies.
// The session is read from the request itself, so the handlers run the same under a test.

export type LearnerRequest = { user: SessionUser; refreshedCookie: SessionCookie | null };

export async function requireLearner(request: Request): Promise<LearnerRequest> {
  const token = readSessionTokenOfRequest(request);
  const session = token ? await validateSessionToken(token) : null;
  const decision = decideRoleAccess(session?.user ?? null, ["learner"]);
  if (decision === "sign-in") throw new AppError("unauthenticated");
  if (decision === "forbidden") throw new AppError("forbidden", "Only learners work at a lab's workbench.");
  return { user: session!.user!, refreshedCookie: session!.refreshedCookie };
}

export function findLab(labSlug: string): Lab {
  const lab = getLab(labSlug);
  if (!lab) throw new AppError("not-found", "There is no lab with that name.");
  return lab;
}

/** Labs open in lesson order, as their lessons do: grading a locked one is refused, not only hidden. */
export async function requireOpenLab(user: SessionUser, lab: Lab): Promise<void> {
  const lesson = getLessonOfLab(lab.slug);
  const view = lesson ? await findLessonProgressView({ userId: user.id, lessonSlug: lesson.slug }) : undefined;
  if (view?.state === "locked" && view.waitsFor) {
    throw new AppError("forbidden", `This lab opens when lesson ${view.waitsFor.number}, ${view.waitsFor.title}, is done.`);
  }
}

/** Carries a session extension back to the browser, as pages cannot. */
export function withSession<T extends NextResponse>(response: T, learner: LearnerRequest): T {
  const cookie = learner.refreshedCookie;
  if (cookie) response.cookies.set(cookie.name, cookie.value, cookie.attributes);
  return response;
}
