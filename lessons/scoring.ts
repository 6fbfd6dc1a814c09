import type { PassRule, Scoring } from "./schema";
import type { RunJudgement } from "./pass-rule";

export interface RunMargins {
  timingMargin: number | null;
  voltageMargin: number;
}

const clip01 = (x: number) => (Number.isFinite(x) ? Math.min(1, Math.max(0, x)) : 0);

/** One run's score out of 100, before the attempt penalty (formula in lessons/schema.ts). */
export function scoreRun(rule: PassRule, scoring: Scoring, judgement: RunJudgement, margins: RunMargins): number {
  if (!judgement.pass) return scoring.failCreditMax * (judgement.bitsCorrect / Math.max(1, judgement.bitsSent));
  const progress = (value: number, min: number, full: number) => (full > min ? clip01((value - min) / (full - min)) : 1);
  const timing = margins.timingMargin === null ? 0 : progress(margins.timingMargin, rule.minTimingMargin, scoring.fullMarksMargin.timing);
  const voltage = progress(margins.voltageMargin, rule.minVoltageMargin, scoring.fullMarksMargin.voltage);
  return scoring.passBase + (100 - scoring.passBase) * Math.min(timing, voltage);
}

/**
 * An attempt's score: the weakest run counts (every run of an installation must work), lab
 * questions weigh `questionShare`, and attempts beyond the free ones cost `penalty` each.
 * `attemptNumber` counts graded attempts from 1.
 */
export function scoreAttempt(options: {
  scoring: Scoring;
  runScores: number[];
  questions: { asked: number; correct: number };
  attemptNumber: number;
}): number {
  const { scoring, runScores, questions, attemptNumber } = options;
  const runs = Math.min(...runScores);
  const share = questions.asked > 0 ? scoring.questionShare : 0;
  const questionScore = questions.asked > 0 ? (100 * questions.correct) / questions.asked : 0;
  const raw = (1 - share) * runs + share * questionScore;
  const penalty = scoring.penalty * Math.max(0, attemptNumber - scoring.penaltyPerAttemptBeyond);
  return Math.max(0, Math.round(raw - penalty));
}
