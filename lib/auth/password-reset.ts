import {
  completePasswordReset as completePasswordResetRecord,
  createPasswordReset,
  describePasswordResetState,
  findPasswordResetByTokenHash,
  type PasswordResetState,
} from "@/db/queries/password-resets";
import { findUserByEmail } from "@/db/queries/users";
import type { Role } from "@/db/schema";
import { readAppEnv } from "@/lib/env";
import { sendPasswordResetEmail } from "@/lib/mail/send";
import { spendRateLimits, type LimitDecision } from "@/lib/rate-limit/rate-limiter";
import { hashPassword } from "./password";
import { createSession, invalidateUserSessions, type SessionCookie } from "./session-store";
import { generateToken, hashToken } from "./tokens";

export const passwordResetLifetimeMinutes = 60;

/**
 * Counts a reset request against the limits per e-mail (so the form cannot flood an inbox) and
 * per client address (lib/rate-limit/limits.ts), before anything is looked up: the answer is the
 * same whether or not the e-mail has an account.
 */
export async function admitPasswordResetRequest(params: { email: string; clientAddress: string }): Promise<LimitDecision> {
  return spendRateLimits("password-reset", { person: params.email, address: params.clientAddress });
}

/**
 * Sends a reset link when the address belongs to an active account and quietly does nothing
 * otherwise; the caller answers the same either way. Admit the request first.
 */
export async function requestPasswordReset(params: { email: string; now?: Date }): Promise<void> {
  const now = params.now ?? new Date();
  const user = await findUserByEmail({ email: params.email });
  if (!user?.active) return;

  const token = generateToken();
  const expiresAt = new Date(now.getTime() + passwordResetLifetimeMinutes * 60_000);
  await createPasswordReset({ userId: user.id, tokenHash: hashToken(token), expiresAt });
  await sendPasswordResetEmail({
    schoolId: user.schoolId,
    to: user.email,
    name: user.name,
    resetUrl: `${readAppEnv().APP_URL}/reset-password/${token}`,
    expiresAt,
  });
}

export async function checkPasswordResetToken(params: { token: string; now?: Date }): Promise<PasswordResetState> {
  const reset = await findPasswordResetByTokenHash({ tokenHash: hashToken(params.token) });
  return describePasswordResetState(reset, params.now ?? new Date());
}

export type CompletePasswordResetResult =
  | { ok: true; userId: string; role: Role; cookie: SessionCookie }
  | { ok: false; reason: Exclude<PasswordResetState, "usable"> };

/** Sets the new password, signs the account out everywhere and opens one fresh session here. */
export async function completePasswordReset(params: {
  token: string;
  password: string;
  now?: Date;
}): Promise<CompletePasswordResetResult> {
  const tokenHash = hashToken(params.token);
  const now = params.now ?? new Date();
  const state = describePasswordResetState(await findPasswordResetByTokenHash({ tokenHash }), now);
  if (state !== "usable") return { ok: false, reason: state };

  const result = await completePasswordResetRecord({ tokenHash, passwordHash: await hashPassword(params.password), now });
  if (!result.ok) return result;
  await invalidateUserSessions(result.userId);
  return { ok: true, userId: result.userId, role: result.role, cookie: await createSession(result.userId) };
}
