/** The seed of a learner's variant of a lab: one scenario per learner and lab, rebuilt from it when grading. */
export function variantSeedFor(userId: string, labSlug: string): string {
  return `${userId}:${labSlug}`;
}
