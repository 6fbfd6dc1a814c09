import { quantity as q, type NumberTree } from "../numbers/lesson-number";
import { RECEIVER_DEFAULTS } from "@/lib/sim";

/**
 * Lesson 2's own numbers. Its text still computes its receiver figures in place; it quotes the
 * shared numbers through the receiver-model block it prints (lessons/receiver-model.ts).
 */
export const numbers = {} satisfies NumberTree;

const GIVEN = "the learner's given (a premise; lib/quick-checks picks one per learner)";
const HIGH = RECEIVER_DEFAULTS.highThreshold;
/** JEDEC JESD8 TTL-compatible input: high guaranteed above 2.0 V. */
const TTL_HIGH = 2.0;
const PIXEL_SUPPLY = 5;

/** Each learner's premises for the quick checks, away from the lesson's worked 5 V and 3.3 V, and the answers computed from them. */
export const checkGivens = {
  highThreshold: [4.6, 4.8, 5.2, 5.4].map((supply) => ({
    supply: q(supply, "V", 1, GIVEN),
    threshold: q(HIGH * supply, "V", 2, "0.7 × VDD"),
  })),
  shifterMargin: [2.9, 3.0, 3.1, 3.2].map((high) => ({
    high: q(high, "V", 1, GIVEN),
    margin: q(high - TTL_HIGH, "V", 1, "V_OH − 2.0 V (JEDEC JESD8 TTL-compatible V_IH)"),
  })),
  midSupplyMargin: [2.85, 2.95, 3.05, 3.15].map((high) => ({
    high: q(high, "V", 2, GIVEN),
    mid: q(PIXEL_SUPPLY / 2, "V", 1, "VDD / 2"),
    margin: q(high - PIXEL_SUPPLY / 2, "V", 2, "V_OH − VDD / 2"),
  })),
};
