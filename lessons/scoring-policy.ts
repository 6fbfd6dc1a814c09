/**
 * The course's one grading policy, shared by every lab: a pass earns 60 plus credit for its
 * margins, a fail earns up to 30 for the bits it got right, and the first three graded attempts
 * are free, each later one costing 5 points. Labs set only their full-marks margins and the share
 * of their numeric questions.
 */
export const scoringPolicy = {
  passBase: 60,
  failCreditMax: 30,
  penaltyPerAttemptBeyond: 3,
  penalty: 5,
} as const;
