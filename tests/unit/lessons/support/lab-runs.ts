import { simulateRun, type SimResult } from "@/lib/sim";
import { buildSimInput, judgeRun, resistorValuesOnOffer, type Lab, type LabVariant, type RunChoices, type RunJudgement } from "@/lessons";

export interface GradedRun {
  result: SimResult;
  judgement: RunJudgement;
}

/** Every run of a lab variant with the given choices, simulated and judged by the lab's rule. */
export function gradeChoices(lab: Lab, variant: LabVariant, choices: Record<string, RunChoices>): GradedRun[] {
  return variant.runs.map((run) => {
    const result = simulateRun(buildSimInput(run.scenario, choices[run.id]));
    return { result, judgement: judgeRun(lab.passRule, run.scenario.receiver.supplyVoltage, result) };
  });
}

/**
 * The candidate choices for one run, most promising first: resistors ordered by distance (in
 * log terms) from the reference solution's value, cables and drivers in offer order, timing from
 * the reference outwards. Ordering only saves simulations; every candidate is a real offer.
 */
export function candidateChoices(lab: Lab, variant: LabVariant, runIndex: number): RunChoices[] {
  const spec = lab.runs[runIndex];
  const scenario = variant.runs[runIndex].scenario;
  const reference = lab.reference.solution[spec.id];
  const near = (values: number[], target: number | undefined) =>
    target === undefined ? values : [...values].sort((a, b) => Math.abs(Math.log(a / target)) - Math.abs(Math.log(b / target)));
  const resistors = spec.choices.seriesResistance ? near(resistorValuesOnOffer(spec), reference.seriesResistance) : [undefined];
  const cables = spec.choices.cable ? scenario.cableOptions! : [undefined];
  const drivers = spec.choices.driver ? scenario.driverOptions!.map((d) => d.id) : [undefined];
  const timings = spec.choices.timing
    ? [
        { zeroHigh: reference.zeroHigh, oneHigh: reference.oneHigh },
        { zeroHigh: scenario.signal.zeroHigh, oneHigh: scenario.signal.oneHigh },
        { zeroHigh: spec.choices.timing.zeroHigh.min, oneHigh: spec.choices.timing.oneHigh.max },
      ]
    : [{}];
  const out: RunChoices[] = [];
  for (const cable of cables)
    for (const driver of drivers)
      for (const seriesResistance of resistors)
        for (const timing of timings)
          out.push({
            ...(cable !== undefined && { cable }),
            ...(driver !== undefined && { driver }),
            ...(seriesResistance !== undefined && { seriesResistance }),
            ...timing,
          });
  return out;
}
