import { gradeNumericAnswer, type NumericGrade } from "@/lib/answers";
import type { CheckBlock, CheckVariant } from "@/lessons/schema";
import { seededIndex } from "./seed";

export { quickCheckSeed } from "./seed";
export { correctChoice, gradeChoiceCheck, presentChoiceCheck, revealedTraces, type DrawnTrace, type PresentedChoiceCheck } from "./choice-check";

/** The given a learner's seed picks for a numeric check (the only one when the check has no givens). */
export function numericCheckFor(block: CheckBlock, seed: string): CheckVariant {
  return block.variants[seededIndex(seed, `${block.id}:given`, block.variants.length)];
}

/**
 * Grades an entry against the learner's own given, as the trade writes values too: a resistance
 * may be typed as the resistor code ("4k7", "321R") or with the unit's name ("321 Ohm").
 */
export function gradeNumericCheck(block: CheckBlock, seed: string, entry: string): NumericGrade {
  return gradeNumericAnswer(entry, numericCheckFor(block, seed).answer);
}
