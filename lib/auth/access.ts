import { hasPermission, type Permission, type Role } from "./permissions";

export type AccessDecision = "allowed" | "sign-in" | "forbidden";

type Viewer = { role: Role } | null;

/** The one rule behind every guard: nobody signed in → sign in; signed in without the right → 403. */
export function decideRoleAccess(viewer: Viewer, allowed: readonly Role[]): AccessDecision {
  if (!viewer) return "sign-in";
  return allowed.includes(viewer.role) ? "allowed" : "forbidden";
}

export function decidePermissionAccess(viewer: Viewer, permission: Permission): AccessDecision {
  if (!viewer) return "sign-in";
  return hasPermission(viewer.role, permission) ? "allowed" : "forbidden";
}

/**
 * Only same-site paths may be used after sign-in, so a crafted link cannot bounce a person to
 * another site ("//host", "/\host" and absolute URLs are refused).
 */
export function safeReturnPath(candidate: string | null | undefined): string | null {
  if (!candidate || !candidate.startsWith("/") || candidate.startsWith("//") || candidate.startsWith("/\\")) return null;
  if (/[\u0000-\u001f]/.test(candidate) || candidate.length > 512) return null;
  return candidate;
}

export function signInPath(returnTo?: string): string {
  const path = safeReturnPath(returnTo);
  return path ? `/sign-in?next=${encodeURIComponent(path)}` : "/sign-in";
}
