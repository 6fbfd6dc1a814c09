import "server-only";
import { readSessionTokenOfRequest } from "@/lib/auth/request-session-token";
import { validateSessionToken, type SessionUser } from "@/lib/auth/session-store";

/**
 * The signed-in user behind a request, read from its Cookie header. Route handlers that serve
 * files or sign uploads use this rather than the request-scoped helpers, so they behave the same
 * wherever the request object comes from.
 */
export async function findViewerOfRequest(request: Request): Promise<SessionUser | null> {
  const token = readSessionTokenOfRequest(request);
  if (!token) return null;
  return (await validateSessionToken(token)).user;
}
