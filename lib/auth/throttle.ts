import "server-only";
import { clearRateLimit, refundRateLimit, spendRateLimits, type LimitDecision } from "@/lib/rate-limit/rate-limiter";

// Failed sign-ins are limited per account (the e-mail as typed, whether or not it has an account)
// and per client address (lib/rate-limit/limits.ts). The failure is counted before the password
// is checked: each attempt first takes a slot in one atomic statement per counter, and only an
// attempt holding a slot is checked. So however many attempts arrive at once, no more passwords
// are checked than the limit; the slot is given back when the password turns out right.

export async function reserveSignInAttempt(params: { email: string; clientAddress: string }): Promise<LimitDecision> {
  return spendRateLimits("sign-in-failure", { person: params.email, address: params.clientAddress });
}

/** A right password: the account starts counting afresh and the address gets its slot back. */
export async function settleSuccessfulSignIn(params: { email: string; clientAddress: string }): Promise<void> {
  await Promise.all([
    clearRateLimit("sign-in-failure", "person", params.email),
    refundRateLimit("sign-in-failure", "address", params.clientAddress),
  ]);
}
