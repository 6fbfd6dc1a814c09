import { z } from "zod";
import type { LabAttempt } from "@/db/schema";
import { buildSimInput, labVariant, type Lab, type RunChoices } from "@/lessons";
import { runChoicesSchema, type Scenario } from "@/lessons/schema";
import { storedOutcomeSchema } from "@/lib/grading";
import { cableCatalogue, type SimInput } from "@/lib/sim";

/** One run of a stored attempt: what was chosen, in words, and the simulator input that redraws it. */
export type AttemptRunRecord = {
  runId: string;
  label: string;
  /** The learner's own choices ("150 Ω, Twisted pair"). */
  chosen: string;
  /** The run those choices were fitted to ("Data lead on its own, 12 m, 3.3 V controller pin"). */
  setting: string;
  pass: boolean | null;
  /** The grader's reasons for a failing run, as stored with the attempt. */
  failures: string[];
  /** Null when the stored attempt can no longer be rebuilt (the lab has changed since). */
  input: SimInput | null;
};

export type AttemptRecord = {
  id: string;
  attemptNumber: number;
  createdAt: Date;
  score: number;
  passed: boolean;
  runs: AttemptRunRecord[];
  questions: { id: string; entry: string; correct: boolean }[];
};

const storedChoicesSchema = z.record(z.string(), runChoicesSchema);

function ohms(value: number): string {
  return value >= 1000 ? `${Number((value / 1000).toPrecision(3))} kΩ` : `${Number(value.toPrecision(3))} Ω`;
}

function metres(value: number): string {
  return `${Number(value.toPrecision(4))} m`;
}

function nanoseconds(seconds: number): string {
  return `${Math.round(seconds * 1e9)} ns`;
}

function driverLabel(scenario: Scenario, id: string | undefined): string {
  if (id === undefined) return scenario.driver.label;
  return scenario.driverOptions?.find((driver) => driver.id === id)?.label ?? id;
}

function describeChosen(scenario: Scenario, choices: RunChoices): string {
  const parts: string[] = [];
  if (choices.driver !== undefined) parts.push(driverLabel(scenario, choices.driver));
  if (choices.cable !== undefined) parts.push(cableCatalogue[choices.cable].label);
  if (choices.length !== undefined) parts.push(metres(choices.length));
  if (choices.seriesResistance !== undefined) parts.push(ohms(choices.seriesResistance));
  if (choices.zeroHigh !== undefined) parts.push(`0-bit high ${nanoseconds(choices.zeroHigh)}`);
  if (choices.oneHigh !== undefined) parts.push(`1-bit high ${nanoseconds(choices.oneHigh)}`);
  return parts.length > 0 ? parts.join(", ") : "nothing chosen";
}

function describeSetting(scenario: Scenario, choices: RunChoices): string {
  const cable = cableCatalogue[choices.cable ?? scenario.cable].label;
  return `${cable}, ${metres(choices.length ?? scenario.length)}, ${driverLabel(scenario, choices.driver)}`;
}

function rebuild(scenario: Scenario, choices: RunChoices): SimInput | null {
  try {
    return buildSimInput(scenario, choices);
  } catch {
    return null;
  }
}

/**
 * A stored attempt made readable and redrawable: the learner's variant is rebuilt from the stored
 * seed, their choices put in, and the grader's stored verdict attached to each run.
 */
export function attemptRecord(lab: Lab, attempt: LabAttempt): AttemptRecord {
  const variant = labVariant(lab, attempt.variantSeed);
  const choices = storedChoicesSchema.safeParse(attempt.choices);
  const outcome = storedOutcomeSchema.safeParse(attempt.outcome);
  const runs = variant.runs.map((run): AttemptRunRecord => {
    const chosen = choices.success ? choices.data[run.id] : undefined;
    const stored = outcome.success ? outcome.data.runs.find((r) => r.runId === run.id) : undefined;
    return {
      runId: run.id,
      label: run.label,
      chosen: chosen ? describeChosen(run.scenario, chosen) : "choices not readable",
      setting: describeSetting(run.scenario, chosen ?? {}),
      pass: stored?.pass ?? null,
      failures: stored?.failures.map((failure) => failure.message) ?? [],
      input: chosen ? rebuild(run.scenario, chosen) : null,
    };
  });
  return {
    id: attempt.id,
    attemptNumber: attempt.attemptNumber,
    createdAt: attempt.createdAt,
    score: attempt.score,
    passed: attempt.passed,
    runs,
    questions: outcome.success ? outcome.data.questions.map(({ id, entry, correct }) => ({ id, entry, correct })) : [],
  };
}
