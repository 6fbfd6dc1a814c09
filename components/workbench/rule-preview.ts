import type { LiveRun } from "@/components/simulation";
import { judgeRun, type RunJudgement } from "@/lessons/pass-rule";
import type { PassRule } from "@/lessons/schema";

/**
 * The lab's own pass rule applied to the bench preview, so the learner sees what grading will
 * look at before spending an attempt. The rule reads the decoded bits, metrics, verdict and line
 * of a run, never its sampled traces, so those are handed over empty.
 */
export function previewJudgement(rule: PassRule, run: LiveRun): RunJudgement {
  return judgeRun(rule, run.receiver.supplyVoltage, {
    time: [],
    nearEnd: [],
    farEnd: [],
    decoded: run.decoded,
    bits: run.bits,
    metrics: run.metrics,
    verdict: run.verdict,
    line: run.line,
  });
}
