import "server-only";
import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { db } from "@/db/client";
import { rulesOf, type LimitedAction, type LimitSubject, type RateLimitRule } from "./limits";

// The counters live in the rate_limits table (db/schema/rate-limits.ts, created by a migration),
// through rate-limiter-flexible's PostgreSQL store: spending a point is one INSERT … ON CONFLICT
// DO UPDATE … RETURNING on the key's row, so every app server on the database counts against the
// same row and concurrent requests are counted one after another, never both against one count.

export type LimitDecision = { allowed: true } | { allowed: false; retryAfterSeconds: number };
export type LimitSubjects = Partial<Record<LimitSubject, string>>;

const limiters = new Map<RateLimitRule, RateLimiterPostgres>();

function limiterOf(rule: RateLimitRule): RateLimiterPostgres {
  let limiter = limiters.get(rule);
  if (!limiter) {
    limiter = new RateLimiterPostgres({
      storeClient: db.$client,
      tableName: "rate_limits",
      tableCreated: true,
      keyPrefix: `${rule.action}:${rule.per}`,
      points: rule.points,
      duration: rule.windowSeconds,
    });
    limiters.set(rule, limiter);
  }
  return limiter;
}

/** The rules of the action that apply, each with the key it counts under. */
function countersOf(action: LimitedAction, subjects: LimitSubjects): { rule: RateLimitRule; key: string }[] {
  return rulesOf(action).flatMap((rule) => {
    const key = subjects[rule.per];
    return key === undefined ? [] : [{ rule, key }];
  });
}

/**
 * Spends one point of each of the action's limits for the given person and address, each in one
 * statement; refused when any is over. The over-limit counters keep what was spent, so hammering
 * stays refused until the window ends; the others get their point back, so one person refused
 * does not use up the limit of the address they share with a class. Failures of the database are
 * thrown (and answered as an outage).
 */
export async function spendRateLimits(action: LimitedAction, subjects: LimitSubjects): Promise<LimitDecision> {
  const counters = countersOf(action, subjects);
  const waits = await Promise.all(
    counters.map(({ rule, key }) =>
      limiterOf(rule).consume(key).then(
        () => null,
        (reason: unknown) => {
          if (reason instanceof RateLimiterRes) return reason.msBeforeNext;
          throw reason;
        },
      ),
    ),
  );
  const refused = waits.filter((wait): wait is number => wait !== null);
  if (refused.length === 0) return { allowed: true };
  await Promise.all(counters.filter((_, i) => waits[i] === null).map(({ rule, key }) => limiterOf(rule).reward(key)));
  return { allowed: false, retryAfterSeconds: Math.max(1, Math.ceil(Math.max(...refused) / 1000)) };
}

/** Gives back a point spent by spendRateLimits, for a request that in the end did not count. */
export async function refundRateLimit(action: LimitedAction, per: LimitSubject, key: string): Promise<void> {
  await Promise.all(countersOf(action, { [per]: key }).map(({ rule }) => limiterOf(rule).reward(key)));
}

/** Clears a count altogether (a successful sign-in clears the account's failures). */
export async function clearRateLimit(action: LimitedAction, per: LimitSubject, key: string): Promise<void> {
  await Promise.all(countersOf(action, { [per]: key }).map(({ rule }) => limiterOf(rule).delete(key)));
}
