import "server-only";
import { checkWork, type GradedWork, type GradingRequest } from "./grade-attempt";
import { simulateOffThread } from "./grading-pool";

/** gradeWork for the server: the same checks on the request thread, the simulation on a grading thread. */
export async function gradeWorkOffThread(request: GradingRequest): Promise<GradedWork> {
  const { seed, choices, questions } = checkWork(request);
  return { seed, choices, questions, runs: await simulateOffThread({ labSlug: request.lab.slug, seed, choices }) };
}
