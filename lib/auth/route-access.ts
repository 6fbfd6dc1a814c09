import type { Role } from "./permissions";

/**
 * Every page that needs a signed-in user, with the roles that may open it. Pages guard
 * themselves with requireRouteAccess(<key>), and the tests walk this table, so a page missing
 * from it fails the route coverage test.
 */
export const protectedRoutes = {
  "/learn": ["learner"],
  "/lessons/[lessonSlug]": ["learner"],
  "/labs/[labSlug]": ["learner"],
  "/bench/[exerciseSlug]": ["learner"],
  "/certificate": ["learner"],
  "/cohorts": ["instructor"],
  "/cohorts/[cohortId]": ["instructor", "admin"],
  "/cohorts/[cohortId]/learners/[learnerId]": ["instructor", "admin"],
  "/reviews": ["instructor"],
  "/reviews/[submissionId]": ["instructor"],
  "/admin": ["admin"],
  "/admin/cohorts/new": ["admin"],
  "/admin/cohorts/[cohortId]": ["admin"],
  "/admin/cohorts/[cohortId]/edit": ["admin"],
  "/admin/cohorts/[cohortId]/import": ["admin"],
  "/certificates": ["admin"],
  "/dev/mail": ["admin"],
} as const satisfies Record<string, readonly Role[]>;

export type ProtectedRoute = keyof typeof protectedRoutes;

/** The concrete path for a route pattern, for the return-after-sign-in link. */
export function fillRoute(route: ProtectedRoute, params: Record<string, string> = {}): string {
  return route.replace(/\[(\w+)\]/g, (_match, name: string) => encodeURIComponent(params[name] ?? ""));
}
