export { gradeAttempt, gradeWork, scoreWork, type AttemptGrade, type GradedWork, type GradingRequest } from "./grade-attempt";
export type { GradedRun } from "./grade-runs";
export type { GradedQuestion } from "./grade-questions";
export { variantSeedFor } from "./variant-seed";
export { outcomeOf, toAttemptView, storedOutcomeSchema, type AttemptView, type AttemptRunOutcome, type AttemptReason, type StoredOutcome } from "./attempt-view";
export { verdictLines, type VerdictLine } from "./verdict-lines";
