/**
 * A numeric check asks for a number the lesson has not printed above it, for every learner: the
 * learner's seed picks the check's given, and no number the learner has read before the check
 * would be accepted as its answer.
 */
import { describe, expect, it } from "vitest";
import { getCourse } from "@/lessons";
import { numericCheckFor, quickCheckSeed } from "@/lib/quick-checks";
import { answerPrintedIn, textBeforeCheck } from "@/lib/quick-checks/printed-before";

const SEEDS = ["learner-1", "learner-2", "learner-3", "learner-4", "learner-5", "learner-6"];
const checks = getCourse().lessons.flatMap((lesson) =>
  lesson.blocks.flatMap((block) => (block.kind === "check" ? [[`${lesson.slug}/${block.id}`, lesson, block] as const] : [])),
);

describe("finding a printed answer", () => {
  it("reads numbers with their units and thousands separators, within the answer's tolerance", () => {
    const text = "The frame takes 7.20 ms; at most 1,041 pixels; a 10 µs gap.";
    expect(answerPrintedIn(text, { value: 7.2e-3, unit: "ms", tolerance: 0.01 })).toEqual(["7.20 ms"]);
    expect(answerPrintedIn(text, { value: 7200e-6, unit: "us", tolerance: 0.01 })).toEqual(["7.20 ms"]);
    expect(answerPrintedIn(text, { value: 1041, unit: "", tolerance: 0 })).toEqual(["1,041"]);
    expect(answerPrintedIn(text, { value: 1042, unit: "", tolerance: 0 })).toEqual([]);
    expect(answerPrintedIn(text, { value: 8e-3, unit: "ms", tolerance: 0.01 })).toEqual([]);
  });
});

describe.each(checks)("%s", (_, lesson, block) => {
  it.each(SEEDS)("does not print the answer before the check for %s", (learner) => {
    const seedOf = (checkId: string) => quickCheckSeed(learner, lesson.slug, checkId);
    const given = numericCheckFor(block, seedOf(block.id));
    expect(answerPrintedIn(textBeforeCheck(lesson, block.id, seedOf), given.answer)).toEqual([]);
  });
});

describe("seeded checks", () => {
  it.each(checks.filter(([, , b]) => b.variants.length > 1))("%s gives different learners different answers", (_, lesson, block) => {
    const answers = new Set(SEEDS.map((learner) => numericCheckFor(block, quickCheckSeed(learner, lesson.slug, block.id)).answer.value));
    expect(answers.size).toBeGreaterThan(1);
  });
});
