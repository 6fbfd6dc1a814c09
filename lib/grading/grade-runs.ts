import { buildSimInput, judgeRun, ruleMargins, scoreRun, type Lab, type LabVariant, type RuleFailure, type RunChoices } from "@/lessons";
import { simulateRun, type RunMetrics, type Verdict } from "@/lib/sim";

export type GradedRun = {
  runId: string;
  label: string;
  /** Passes the lab's pass rule: the simulator's judgement the lab names, held to the lab's margins and limits. */
  pass: boolean;
  verdict: Verdict;
  metrics: RunMetrics;
  /** Where the run misses the lab's pass rule, in the rule's terms. */
  failures: RuleFailure[];
  bitsCorrect: number;
  bitsSent: number;
  decoded: string;
  /** The run's score out of 100 before the attempt penalty (lessons/scoring.ts). */
  score: number;
};

/** Simulates every run of the learner's variant with their (already validated) choices and judges it by the lab's rule. */
export function gradeRuns(lab: Lab, variant: LabVariant, choices: Record<string, RunChoices>): GradedRun[] {
  return variant.runs.map((run) => {
    const result = simulateRun(buildSimInput(run.scenario, choices[run.id]));
    const judgement = judgeRun(lab.passRule, run.scenario.receiver.supplyVoltage, result);
    return {
      runId: run.id,
      label: run.label,
      pass: judgement.pass,
      verdict: result.verdict,
      metrics: result.metrics,
      failures: judgement.failures,
      bitsCorrect: judgement.bitsCorrect,
      bitsSent: judgement.bitsSent,
      decoded: result.decoded,
      score: scoreRun(lab.passRule, lab.scoring, judgement, ruleMargins(lab.passRule, result)),
    };
  });
}
