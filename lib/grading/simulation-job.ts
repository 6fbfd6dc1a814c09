import { getLab, labVariant, type LabChoices } from "@/lessons";
import { gradeRuns, type GradedRun } from "./grade-runs";

/** What grading a submission's runs needs: plain data, as it crosses to a grading thread by structured clone. */
export type SimulationJob = { labSlug: string; seed: string; choices: LabChoices };

export type SimulationReply = { runs: GradedRun[] } | { error: string };

/** Simulates and judges the runs of already validated choices, on whichever thread calls it. */
export function simulateJob({ labSlug, seed, choices }: SimulationJob): GradedRun[] {
  const lab = getLab(labSlug);
  if (!lab) throw new Error(`there is no lab "${labSlug}" to grade`);
  return gradeRuns(lab, labVariant(lab, seed), choices);
}
