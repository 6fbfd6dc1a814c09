// Every rate limit of the app, in one table (the README repeats it). Each counts per person (a
// signed-in user's id, or the e-mail typed into a sign-in or reset form) or per client address
// (lib/client-address), in fixed windows that start with the first request counted. A request
// over any of its action's limits is refused with the wait until that window ends.
//
// A school's learners often share one public address, so per-address limits allow a whole class
// and per-person limits stop one account; both are far above what a person at the workbench does.

export type LimitedAction = "grading" | "workbench-save" | "upload" | "sign-in-failure" | "password-reset" | "certificate-lookup";
export type LimitSubject = "person" | "address";
export type RateLimitRule = { action: LimitedAction; per: LimitSubject; points: number; windowSeconds: number };

export const rateLimitRules = [
  // A learner submits a lab every few seconds at most; a class of 40 at once stays under 1200.
  { action: "grading", per: "person", points: 60, windowSeconds: 60 },
  { action: "grading", per: "address", points: 1200, windowSeconds: 60 },
  // The workbench saves a learner's choices 0.7 s after the last change, one save at a time: a
  // control dragged for a whole minute sends under 90.
  { action: "workbench-save", per: "person", points: 120, windowSeconds: 60 },
  { action: "workbench-save", per: "address", points: 2400, windowSeconds: 60 },
  // Upload requests from the browser (the service's signed callbacks are not counted): a bench
  // exercise takes a few photos, each request signs up to the exercise's photo limit.
  { action: "upload", per: "person", points: 30, windowSeconds: 600 },
  { action: "upload", per: "address", points: 300, windowSeconds: 600 },
  // Failed sign-ins only: a success clears the account's count and does not use up the address's.
  { action: "sign-in-failure", per: "person", points: 5, windowSeconds: 900 },
  { action: "sign-in-failure", per: "address", points: 50, windowSeconds: 900 },
  // Each request may send an e-mail, so one inbox gets at most three links an hour.
  { action: "password-reset", per: "person", points: 3, windowSeconds: 3600 },
  { action: "password-reset", per: "address", points: 20, windowSeconds: 3600 },
  // Codes carry 80 random bits, so this protects the database, not the codes; a school's office
  // checking a batch of certificates stays under it.
  { action: "certificate-lookup", per: "address", points: 30, windowSeconds: 300 },
] as const satisfies readonly RateLimitRule[];

export function rulesOf(action: LimitedAction): RateLimitRule[] {
  return rateLimitRules.filter((rule) => rule.action === action);
}

export function ruleOf(action: LimitedAction, per: LimitSubject): RateLimitRule {
  const rule = rateLimitRules.find((candidate) => candidate.action === action && candidate.per === per);
  if (!rule) throw new Error(`No ${per} limit for ${action}`);
  return rule;
}
