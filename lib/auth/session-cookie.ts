import "server-only";
import { cookies } from "next/headers";
import { invalidateSession, validateSessionToken, type SessionCookie } from "./session-store";

/** Only callable from server actions and route handlers: pages cannot set cookies. */
export async function writeSessionCookie(cookie: SessionCookie): Promise<void> {
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
}

/**
 * Hands the browser a session just opened. Whatever session cookie it sent along is ended on the
 * server first, so a sign-in never leaves an earlier session (a form left open while signed in,
 * someone else's on a shared machine) alive behind the new one.
 */
export async function replaceSessionCookie(cookie: SessionCookie): Promise<void> {
  const previous = await readSessionToken(cookie.name);
  const held = previous && previous !== cookie.value ? await validateSessionToken(previous) : null;
  if (held?.sessionId) await invalidateSession(held.sessionId);
  await writeSessionCookie(cookie);
}

export async function readSessionToken(name: string): Promise<string | null> {
  return (await cookies()).get(name)?.value ?? null;
}
