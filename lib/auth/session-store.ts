import { DrizzlePostgreSQLAdapter } from "@lucia-auth/adapter-drizzle";
import { Lucia, TimeSpan } from "lucia";
import { db } from "@/db/client";
import { sessions, users, type Role } from "@/db/schema";
import { readAppEnv } from "@/lib/env";

// The only module that knows the session library: everything else talks to the functions below,
// so replacing the library touches this file alone.

export type SessionUser = {
  id: string;
  schoolId: string;
  email: string;
  name: string;
  role: Role;
  active: boolean;
};

export type SessionCookie = {
  name: string;
  value: string;
  attributes: {
    httpOnly?: boolean;
    secure?: boolean;
    sameSite?: "lax" | "strict" | "none";
    path?: string;
    maxAge?: number;
    expires?: Date;
  };
};

export const sessionCookieName = "edgewise_session";

// The library's session ids are 40 base32 characters; a cookie value of any other shape is not
// looked up, so a mangled one (a NUL byte, which PostgreSQL refuses in text) reads as no session.
const possibleSessionToken = /^[a-z0-9]{1,64}$/;

function createLucia() {
  return new Lucia(new DrizzlePostgreSQLAdapter(db, sessions, users), {
    sessionExpiresIn: new TimeSpan(30, "d"),
    sessionCookie: {
      name: sessionCookieName,
      attributes: { sameSite: "lax", secure: readAppEnv().APP_URL.startsWith("https:") },
    },
    getUserAttributes: (row): Omit<SessionUser, "id"> => ({
      schoolId: row.schoolId,
      email: row.email,
      name: row.name,
      role: row.role,
      active: row.active,
    }),
  });
}

declare module "lucia" {
  interface Register {
    Lucia: ReturnType<typeof createLucia>;
    UserId: string;
    DatabaseUserAttributes: Omit<typeof users.$inferSelect, "id">;
  }
}

let lucia: ReturnType<typeof createLucia> | undefined;
function getLucia() {
  return (lucia ??= createLucia());
}

export async function createSession(userId: string): Promise<SessionCookie> {
  const session = await getLucia().createSession(userId, {});
  return getLucia().createSessionCookie(session.id);
}

export type ValidatedSession =
  | { user: SessionUser; sessionId: string; refreshedCookie: SessionCookie | null }
  | { user: null; sessionId: null; refreshedCookie: SessionCookie | null };

/** Looks the token up; a session of a deactivated user counts as no session. */
export async function validateSessionToken(token: string): Promise<ValidatedSession> {
  if (!possibleSessionToken.test(token)) return { user: null, sessionId: null, refreshedCookie: getLucia().createBlankSessionCookie() };
  const { session, user } = await getLucia().validateSession(token);
  if (!session) return { user: null, sessionId: null, refreshedCookie: getLucia().createBlankSessionCookie() };
  if (!user.active) {
    await getLucia().invalidateSession(session.id);
    return { user: null, sessionId: null, refreshedCookie: getLucia().createBlankSessionCookie() };
  }
  const refreshedCookie = session.fresh ? getLucia().createSessionCookie(session.id) : null;
  return { user, sessionId: session.id, refreshedCookie };
}

export async function invalidateSession(sessionId: string): Promise<SessionCookie> {
  await getLucia().invalidateSession(sessionId);
  return getLucia().createBlankSessionCookie();
}

export async function invalidateUserSessions(userId: string): Promise<void> {
  await getLucia().invalidateUserSessions(userId);
}

export function blankSessionCookie(): SessionCookie {
  return getLucia().createBlankSessionCookie();
}
