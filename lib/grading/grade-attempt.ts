import { labVariant, scoreAttempt, type Lab, type LabChoices, type LabVariant } from "@/lessons";
import { gradeQuestions, type GradedQuestion } from "./grade-questions";
import { gradeRuns, type GradedRun } from "./grade-runs";
import { invalidInput } from "./input-error";
import { parseLabChoices } from "./parse-choices";

export type GradingRequest = {
  lab: Lab;
  /** The learner's variant seed (see variantSeedFor). */
  seed: string;
  /** As submitted: validated here against the variant. */
  choices: unknown;
  /** Entries for the lab's numeric questions, by question id ("330 ns"). */
  answers?: Record<string, string>;
};

/** Everything about an attempt that does not depend on its number: the simulated runs and the questions. */
export type GradedWork = {
  seed: string;
  choices: LabChoices;
  runs: GradedRun[];
  questions: GradedQuestion[];
};

export type AttemptGrade = GradedWork & {
  attemptNumber: number;
  score: number;
  /** Every run meets the lab's pass rule. */
  passed: boolean;
};

/** Work whose choices and answers have been checked, and whose runs are still to simulate. */
export type CheckedWork = Omit<GradedWork, "runs"> & { variant: LabVariant };

/** The cheap half of grading: throws one 422 naming every bad choice and unreadable answer together. */
export function checkWork(request: GradingRequest): CheckedWork {
  const variant = labVariant(request.lab, request.seed);
  const { choices, issues: choiceIssues } = parseLabChoices(request.lab, variant, request.choices);
  const { questions, issues: answerIssues } = gradeQuestions(request.lab, request.answers ?? {});
  if (choiceIssues.length + answerIssues.length > 0) throw invalidInput([...choiceIssues, ...answerIssues]);
  return { seed: request.seed, choices, questions, variant };
}

/**
 * Validates and simulates on the calling thread; the heavy half, run before the attempt is
 * numbered. The server grades through gradeWorkOffThread instead.
 */
export function gradeWork(request: GradingRequest): GradedWork {
  const { variant, ...checked } = checkWork(request);
  return { ...checked, runs: gradeRuns(request.lab, variant, checked.choices) };
}

/** The score of graded work as attempt number `attemptNumber` (counted from 1; later attempts carry a penalty). */
export function scoreWork(lab: Lab, work: GradedWork, attemptNumber: number): AttemptGrade {
  const score = scoreAttempt({
    scoring: lab.scoring,
    runScores: work.runs.map((run) => run.score),
    questions: { asked: work.questions.length, correct: work.questions.filter((q) => q.correct).length },
    attemptNumber,
  });
  return { ...work, attemptNumber, score, passed: work.runs.every((run) => run.pass) };
}

export function gradeAttempt(request: GradingRequest & { attemptNumber: number }): AttemptGrade {
  return scoreWork(request.lab, gradeWork(request), request.attemptNumber);
}
