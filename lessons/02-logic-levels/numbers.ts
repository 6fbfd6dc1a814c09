import type { NumberTree } from "../numbers/lesson-number";

/**
 * Lesson 2's own numbers. Its text still computes its receiver figures in place; it quotes the
 * shared numbers through the receiver-model block it prints (lessons/receiver-model.ts).
 */
export const numbers = {} satisfies NumberTree;
