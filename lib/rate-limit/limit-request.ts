import "server-only";
import { clientAddressOf } from "@/lib/client-address/client-address";
import { describeWait, RateLimitedError } from "@/lib/http/errors";
import type { LimitedAction } from "./limits";
import { spendRateLimits } from "./rate-limiter";

const refusals: Partial<Record<LimitedAction, (wait: string) => string>> = {
  grading: (wait) => `That is a lot of submissions in a short time. Wait ${wait}, then submit again.`,
  "workbench-save": (wait) => `Your choices are changing faster than they can be saved. Wait ${wait}; they are kept in this browser until then.`,
  upload: (wait) => `That is a lot of uploads in a short time. Wait ${wait}, then try again.`,
};

/**
 * Counts a route handler's request against the action's limits, for the signed-in person when
 * there is one and for the client's address; over a limit it throws the 429 (lib/http adds
 * Retry-After). Called before the request's body is read.
 */
export async function limitRequest(request: Request, action: LimitedAction, personId?: string): Promise<void> {
  const decision = await spendRateLimits(action, { person: personId, address: clientAddressOf(request.headers) });
  if (decision.allowed) return;
  const message = refusals[action]?.(describeWait(decision.retryAfterSeconds));
  throw new RateLimitedError(decision.retryAfterSeconds, message);
}
