import "server-only";
import { sessionCookieName, validateSessionToken, type SessionUser } from "@/lib/auth/session-store";

/**
 * The signed-in user behind a request, read from its Cookie header. Route handlers that serve
 * files or sign uploads use this rather than the request-scoped helpers, so they behave the same
 * wherever the request object comes from.
 */
export async function findViewerOfRequest(request: Request): Promise<SessionUser | null> {
  const token = readCookie(request.headers.get("cookie"), sessionCookieName);
  if (!token) return null;
  return (await validateSessionToken(token)).user;
}

function readCookie(header: string | null, name: string): string | null {
  for (const part of header?.split(";") ?? []) {
    const cut = part.indexOf("=");
    if (cut > 0 && part.slice(0, cut).trim() === name) return decodeCookieValue(part.slice(cut + 1).trim());
  }
  return null;
}

function decodeCookieValue(value: string): string | null {
  try {
    return decodeURIComponent(value);
  } catch {
    return null;
  }
}
