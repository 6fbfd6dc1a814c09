import { setLearnerActive, type SetActiveResult } from "@/db/queries/enrolment";
import type { Actor } from "./actor";

/** The learner can no longer sign in; everything they did stays on record. */
export function deactivateLearner(params: { actor: Actor; userId: string; now?: Date }): Promise<SetActiveResult> {
  return setLearnerActive({ schoolId: params.actor.schoolId, userId: params.userId, active: false, now: params.now ?? new Date() });
}

export function reactivateLearner(params: { actor: Actor; userId: string; now?: Date }): Promise<SetActiveResult> {
  return setLearnerActive({ schoolId: params.actor.schoolId, userId: params.userId, active: true, now: params.now ?? new Date() });
}
