import { z } from "zod";
import type { LabAttempt } from "@/db/schema";
import type { LabChoices } from "@/lessons";
import { runChoicesSchema } from "@/lessons/schema";
import { JUDGEMENTS, OUTCOMES } from "@/lib/sim";
import type { AttemptGrade } from "./grade-attempt";

/**
 * What is stored in lab_attempts.outcome and what the workbench is sent. The stored outcome is
 * read back through this schema, so a row written by an older grader fails loudly rather than
 * reaching the page half-formed.
 */
const reasonSchema = z.object({
  code: z.string(),
  severity: z.enum(["fail", "warning"]),
  judgement: z.enum(JUDGEMENTS).optional(),
  message: z.string(),
  at: z.object({ time: z.number(), bit: z.number().optional() }).optional(),
});

const judgementSchema = z.object({
  pass: z.boolean(),
  timingMargin: z.number().nullable(),
  voltageMargin: z.number(),
  bitErrors: z.number().int(),
});

/**
 * Attempts graded before runs were judged two ways stored only pass and reasons; they are shown
 * with their reasons and no outcome rather than re-judged.
 */
const storedVerdictSchema = z.union([
  z.object({
    outcome: z.enum(OUTCOMES),
    summary: z.string(),
    guaranteed: judgementSchema,
    typical: judgementSchema,
    reasons: z.array(reasonSchema),
  }),
  z.object({ pass: z.boolean(), reasons: z.array(reasonSchema) }).transform(({ reasons }) => ({ outcome: null, reasons })),
]);

const storedRunSchema = z.object({
  runId: z.string(),
  label: z.string(),
  pass: z.boolean(),
  score: z.number(),
  bitsCorrect: z.number().int(),
  bitsSent: z.number().int(),
  decoded: z.string(),
  failures: z.array(z.object({ code: z.string(), message: z.string() })),
  verdict: storedVerdictSchema,
  metrics: z.record(z.string(), z.number().nullable()),
});

const storedQuestionSchema = z.object({
  id: z.string(),
  entry: z.string(),
  value: z.number(),
  correct: z.boolean(),
  message: z.string(),
});

export const storedOutcomeSchema = z.object({
  runs: z.array(storedRunSchema),
  questions: z.array(storedQuestionSchema),
});

export type StoredOutcome = z.infer<typeof storedOutcomeSchema>;
export type AttemptRunOutcome = z.infer<typeof storedRunSchema>;
export type AttemptReason = z.infer<typeof reasonSchema>;

export function outcomeOf(grade: AttemptGrade): StoredOutcome {
  return {
    runs: grade.runs.map((run) => ({ ...run, metrics: { ...run.metrics } })),
    questions: grade.questions,
  };
}

/** One attempt as the workbench shows it in the history and after a submit. */
export type AttemptView = {
  id: string;
  attemptNumber: number;
  score: number;
  passed: boolean;
  createdAt: string;
  choices: LabChoices;
  runs: AttemptRunOutcome[];
  questions: StoredOutcome["questions"];
};

const storedChoicesSchema = z.record(z.string(), runChoicesSchema);

export function toAttemptView(attempt: LabAttempt): AttemptView {
  const outcome = storedOutcomeSchema.parse(attempt.outcome);
  return {
    id: attempt.id,
    attemptNumber: attempt.attemptNumber,
    score: attempt.score,
    passed: attempt.passed,
    createdAt: attempt.createdAt.toISOString(),
    choices: storedChoicesSchema.parse(attempt.choices),
    runs: outcome.runs,
    questions: outcome.questions,
  };
}
