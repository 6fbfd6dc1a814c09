import {
  deleteSignInAttemptsBefore,
  listRecentSignInFailuresByAddress,
  listRecentSignInFailuresByEmail,
  recordSignInAttempt,
} from "@/db/queries/sign-in-attempts";

// A classroom often shares one public address, so the per-address limit is far looser than the
// per-account one: it stops a sweep across many accounts, not a class having a bad morning.
export const signInLimits = {
  windowMinutes: 15,
  failuresPerAccount: 5,
  failuresPerAddress: 50,
} as const;

const windowMs = signInLimits.windowMinutes * 60_000;
const attemptRetentionMs = 24 * 60 * 60_000;

export type ThrottleDecision = { allowed: true } | { allowed: false; retryAfterMinutes: number };

export async function checkSignInThrottle(params: {
  email: string;
  clientAddress: string;
  now: Date;
}): Promise<ThrottleDecision> {
  const since = new Date(params.now.getTime() - windowMs);
  const [byEmail, byAddress] = await Promise.all([
    listRecentSignInFailuresByEmail({ email: params.email, since, limit: signInLimits.failuresPerAccount }),
    listRecentSignInFailuresByAddress({
      clientAddress: params.clientAddress,
      since,
      limit: signInLimits.failuresPerAddress,
    }),
  ]);
  const unlockTimes = [
    unlockTime(byEmail, signInLimits.failuresPerAccount),
    unlockTime(byAddress, signInLimits.failuresPerAddress),
  ].filter((time): time is number => time !== null);
  if (unlockTimes.length === 0) return { allowed: true };
  const waitMs = Math.max(...unlockTimes) - params.now.getTime();
  return { allowed: false, retryAfterMinutes: Math.max(1, Math.ceil(waitMs / 60_000)) };
}

/** With the limit reached, the lock lifts when the oldest of the counted failures leaves the window. */
function unlockTime(newestFirst: Date[], limit: number): number | null {
  if (newestFirst.length < limit) return null;
  return newestFirst[limit - 1]!.getTime() + windowMs;
}

export async function noteSignInAttempt(params: {
  email: string;
  clientAddress: string;
  succeeded: boolean;
  now: Date;
}): Promise<void> {
  await recordSignInAttempt({ email: params.email, clientAddress: params.clientAddress, succeeded: params.succeeded });
  if (params.succeeded) {
    await deleteSignInAttemptsBefore({ before: new Date(params.now.getTime() - attemptRetentionMs) });
  }
}
