import { findUserByEmail } from "@/db/queries/users";
import { verifyAgainstDummy, verifyPassword } from "./password";
import { createSession, type SessionCookie, type SessionUser } from "./session-store";
import { reserveSignInAttempt, settleSuccessfulSignIn } from "./throttle";

export type SignInResult =
  | { ok: true; user: SessionUser; cookie: SessionCookie }
  | { ok: false; reason: "invalid-credentials" }
  | { ok: false; reason: "throttled"; retryAfterSeconds: number };

/**
 * Checks an e-mail and password and opens a session. An unknown e-mail, a wrong password and a
 * deactivated account all give the same answer after the same amount of hashing work. The attempt
 * counts as a failure from the start (throttle.ts), so it is checked only within the limits.
 */
export async function signInWithPassword(params: { email: string; password: string; clientAddress: string }): Promise<SignInResult> {
  const { email, clientAddress } = params;
  const slot = await reserveSignInAttempt({ email, clientAddress });
  if (!slot.allowed) return { ok: false, reason: "throttled", retryAfterSeconds: slot.retryAfterSeconds };

  const user = await findUserByEmail({ email });
  const passwordMatches = user
    ? await verifyPassword(user.passwordHash, params.password)
    : await verifyAgainstDummy(params.password);
  if (!user?.active || !passwordMatches) return { ok: false, reason: "invalid-credentials" };
  await settleSuccessfulSignIn({ email, clientAddress });

  const cookie = await createSession(user.id);
  const { id, schoolId, name, role, active } = user;
  return { ok: true, user: { id, schoolId, email: user.email, name, role, active }, cookie };
}
