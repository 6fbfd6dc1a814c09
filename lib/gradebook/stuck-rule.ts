// When an instructor should look at a learner. The thresholds are our own teaching judgement,
// not a published figure: five failed tries at one lab without a pass suggests the learner is
// guessing rather than reasoning, and a week without any work is long in an evening course.

export const stuckRule = { failedAttempts: 5, idleDays: 7 } as const;

const dayMs = 86_400_000;

/** Failing a lab over and over: at least `stuckRule.failedAttempts` failed attempts and no pass yet. */
export function isStuckOnLab(cell: { passed: boolean; failedAttempts: number }): boolean {
  return !cell.passed && cell.failedAttempts >= stuckRule.failedAttempts;
}

export type IdleReason = { idleDays: number; lastActivityAt: Date | null };

/**
 * A learner with no activity for `stuckRule.idleDays` whole days. Without any activity yet, the
 * clock starts when they could first have started: the later of joining and the cohort's start.
 * Nobody is idle before the cohort begins.
 */
export function findIdleReason(params: {
  lastActivityAt: Date | null;
  enrolledAt: Date;
  cohortStartsOn: string;
  now: Date;
}): IdleReason | null {
  const cohortStart = new Date(`${params.cohortStartsOn}T00:00:00Z`);
  const since = params.lastActivityAt ?? new Date(Math.max(params.enrolledAt.getTime(), cohortStart.getTime()));
  if (params.now < cohortStart) return null;
  const idleDays = Math.floor((params.now.getTime() - since.getTime()) / dayMs);
  return idleDays >= stuckRule.idleDays ? { idleDays, lastActivityAt: params.lastActivityAt } : null;
}
