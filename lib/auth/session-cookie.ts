import "server-only";
import { cookies } from "next/headers";
import type { SessionCookie } from "./session-store";

/** Only callable from server actions and route handlers: pages cannot set cookies. */
export async function writeSessionCookie(cookie: SessionCookie): Promise<void> {
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
}

export async function readSessionToken(name: string): Promise<string | null> {
  return (await cookies()).get(name)?.value ?? null;
}
