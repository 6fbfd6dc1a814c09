import "server-only";
import { forbidden, redirect } from "next/navigation";
import { cache } from "react";
import { decidePermissionAccess, decideRoleAccess, signInPath, type AccessDecision } from "./access";
import type { Permission, Role } from "./permissions";
import { fillRoute, protectedRoutes, type ProtectedRoute } from "./route-access";
import { readSessionToken, writeSessionCookie } from "./session-cookie";
import { sessionCookieName, validateSessionToken, type SessionUser } from "./session-store";

export type { SessionUser };

type CurrentSession = { user: SessionUser; sessionId: string } | null;

/** The signed-in user for this request, looked up once per request however many callers ask. */
export const getCurrentSession = cache(async (): Promise<CurrentSession> => {
  const token = await readSessionToken(sessionCookieName);
  if (!token) return null;
  const result = await validateSessionToken(token);
  if (result.refreshedCookie) {
    // Pages may not set cookies; server actions and route handlers refresh them as they go.
    await writeSessionCookie(result.refreshedCookie).catch(() => undefined);
  }
  return result.user ? { user: result.user, sessionId: result.sessionId } : null;
});

export async function getCurrentUser(): Promise<SessionUser | null> {
  return (await getCurrentSession())?.user ?? null;
}

type GuardOptions = { returnTo?: string };

function enforce(decision: AccessDecision, options: GuardOptions): void {
  if (decision === "sign-in") redirect(signInPath(options.returnTo));
  if (decision === "forbidden") forbidden();
}

/** Anyone signed in; anonymous visitors go to sign-in and come back to `returnTo`. */
export async function requireUser(options: GuardOptions = {}): Promise<SessionUser> {
  const user = await getCurrentUser();
  enforce(user ? "allowed" : "sign-in", options);
  return user!;
}

/** Signed in with one of `roles`; anyone else signed in gets the 403 page. */
export async function requireRole(roles: Role | readonly Role[], options: GuardOptions = {}): Promise<SessionUser> {
  const user = await getCurrentUser();
  enforce(decideRoleAccess(user, typeof roles === "string" ? [roles] : roles), options);
  return user!;
}

/** Signed in with a role that holds `permission` in the permission table. */
export async function requirePermission(permission: Permission, options: GuardOptions = {}): Promise<SessionUser> {
  const user = await getCurrentUser();
  enforce(decidePermissionAccess(user, permission), options);
  return user!;
}

/** The guard for a page listed in the protected route table: its roles, and a way back after sign-in. */
export async function requireRouteAccess(
  route: ProtectedRoute,
  params: Record<string, string> = {},
): Promise<SessionUser> {
  return requireRole(protectedRoutes[route], { returnTo: fillRoute(route, params) });
}
