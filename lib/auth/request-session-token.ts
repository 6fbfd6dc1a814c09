import { sessionCookieName } from "./session-store";

/**
 * The session token a request's Cookie header carries, for route handlers that read the request
 * itself. A value that does not decode reads as no token rather than failing the request.
 */
export function readSessionTokenOfRequest(request: Request): string | null {
  for (const part of request.headers.get("cookie")?.split(";") ?? []) {
    const cut = part.indexOf("=");
    if (cut > 0 && part.slice(0, cut).trim() === sessionCookieName) return decodeCookieValue(part.slice(cut + 1).trim());
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
