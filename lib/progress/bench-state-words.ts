import type { BenchState } from "./course-progress";

/** How each state of bench work is named to the learner, on the course map and the home page. */
export const benchStateWords: Record<BenchState, string> = {
  "not-started": "Not started",
  draft: "Started, not handed in",
  submitted: "Handed in, waiting for review",
  returned: "Returned for rework",
  accepted: "Accepted",
};
