import { z } from "zod";
import { runControlValuesSchemaFor, startingChoices, type Lab, type LabChoices, type LabVariant } from "@/lessons";

/** The learner's latest work at a lab's workbench: every run's choices and the answers typed so far. */
export type LabDraft = { choices: LabChoices; answers: Record<string, string> };

/** The longest answer kept, as long as a graded submission's. */
export const DRAFT_ANSWER_MAX = 200;

/**
 * A draft as the workbench saves it: a value on offer for every choice of every run and text for
 * the lab's own questions only. A 0's high time above a 1's is kept (the learner may be midway
 * between two settings); grading refuses it, not saving.
 */
export function labDraftSchemaFor(lab: Lab, variant: LabVariant) {
  const runs = Object.fromEntries(lab.runs.map((run, i) => [run.id, runControlValuesSchemaFor(run, variant.runs[i].scenario)]));
  const answer = z.string({ error: "must be text" }).max(DRAFT_ANSWER_MAX, { error: `must be at most ${DRAFT_ANSWER_MAX} characters` });
  const answers = Object.fromEntries(lab.questions.map((question) => [question.id, answer.optional()]));
  return z.strictObject({ choices: z.strictObject(runs), answers: z.strictObject(answers) });
}

/** The scenario's own starting point: every run's starting choices and no answers. */
export function scenarioDraft(lab: Lab, variant: LabVariant): LabDraft {
  return { choices: Object.fromEntries(lab.runs.map((run, i) => [run.id, startingChoices(run, variant.runs[i].scenario)])), answers: {} };
}

/**
 * What the workbench opens with: the saved draft, run by run and answer by answer, wherever it
 * still fits the learner's variant (the course may have changed since it was saved), and the
 * scenario's own starting point elsewhere.
 */
export function openingDraft(lab: Lab, variant: LabVariant, saved: { choices: unknown; answers: unknown } | null): LabDraft {
  const start = scenarioDraft(lab, variant);
  if (!saved) return start;
  const savedChoices = z.record(z.string(), z.unknown()).catch({}).parse(saved.choices);
  const savedAnswers = z.record(z.string(), z.unknown()).catch({}).parse(saved.answers);
  const choices = Object.fromEntries(
    lab.runs.map((run, i) => {
      const parsed = runControlValuesSchemaFor(run, variant.runs[i].scenario).safeParse(savedChoices[run.id]);
      return [run.id, parsed.success ? parsed.data : start.choices[run.id]];
    }),
  );
  const answers = Object.fromEntries(
    lab.questions.flatMap((question) => {
      const entry = savedAnswers[question.id];
      return typeof entry === "string" && entry.length <= DRAFT_ANSWER_MAX ? [[question.id, entry]] : [];
    }),
  );
  return { choices, answers };
}
