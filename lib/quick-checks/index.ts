import type { CheckBlock, CheckVariant } from "@/lessons/schema";
import { seededIndex } from "./seed";

export { quickCheckSeed } from "./seed";
export { correctChoice, gradeChoiceCheck, presentChoiceCheck, revealedTraces, type DrawnTrace, type PresentedChoiceCheck } from "./choice-check";

/** The given a learner's seed picks for a numeric check (the only one when the check has no givens). */
export function numericCheckFor(block: CheckBlock, seed: string): CheckVariant {
  return block.variants[seededIndex(seed, `${block.id}:given`, block.variants.length)];
}
