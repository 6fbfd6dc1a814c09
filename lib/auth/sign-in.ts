import { findUserByEmail } from "@/db/queries/users";
import { verifyAgainstDummy, verifyPassword } from "./password";
import { createSession, type SessionCookie, type SessionUser } from "./session-store";
import { checkSignInThrottle, noteSignInAttempt } from "./throttle";

export type SignInResult =
  | { ok: true; user: SessionUser; cookie: SessionCookie }
  | { ok: false; reason: "invalid-credentials" }
  | { ok: false; reason: "throttled"; retryAfterMinutes: number };

/**
 * Checks an e-mail and password and opens a session. An unknown e-mail, a wrong password and a
 * deactivated account all give the same answer after the same amount of hashing work.
 */
export async function signInWithPassword(params: {
  email: string;
  password: string;
  clientAddress: string;
  now?: Date;
}): Promise<SignInResult> {
  const now = params.now ?? new Date();
  const throttle = await checkSignInThrottle({ email: params.email, clientAddress: params.clientAddress, now });
  if (!throttle.allowed) return { ok: false, reason: "throttled", retryAfterMinutes: throttle.retryAfterMinutes };

  const user = await findUserByEmail({ email: params.email });
  const passwordMatches = user
    ? await verifyPassword(user.passwordHash, params.password)
    : await verifyAgainstDummy(params.password);
  const succeeded = Boolean(user?.active && passwordMatches);
  await noteSignInAttempt({ email: params.email, clientAddress: params.clientAddress, succeeded, now });
  if (!user || !succeeded) return { ok: false, reason: "invalid-credentials" };

  const cookie = await createSession(user.id);
  const { id, schoolId, email, name, role, active } = user;
  return { ok: true, user: { id, schoolId, email, name, role, active }, cookie };
}
