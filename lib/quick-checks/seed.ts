import { seededRandom } from "@/lessons/variant";

/**
 * The seed of one learner's copy of one quick check: the learner's id with the lesson and check
 * mixed in, so two checks of one learner are unrelated and two learners see different givens.
 */
export function quickCheckSeed(userId: string, lessonSlug: string, checkId: string): string {
  return `${userId}\u0000${lessonSlug}\u0000${checkId}`;
}

/** An index below `count` drawn from the seed; `salt` keeps separate draws of one seed apart. */
export function seededIndex(seed: string, salt: string, count: number): number {
  return Math.floor(seededRandom(`${salt}\u0000${seed}`)() * count);
}

/** A permutation of 0..count−1 drawn from the seed (Fisher–Yates). */
export function seededOrder(seed: string, salt: string, count: number): number[] {
  const random = seededRandom(`${salt}\u0000${seed}`);
  const order = Array.from({ length: count }, (_, i) => i);
  for (let i = count - 1; i > 0; i -= 1) {
    const j = Math.floor(random() * (i + 1));
    [order[i], order[j]] = [order[j], order[i]];
  }
  return order;
}
