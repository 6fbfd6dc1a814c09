/**
 * The labs are winnable and not trivial, and their worked answers fail for the reason the lesson
 * teaches: every claim here is the simulator's physics, run on the lab's own scenario.
 */
import { describe, expect, it } from "vitest";
import { defaultVariant, getCourse, labVariant, ruleMargins, scoreRun, type Lab, type LabVariant, type RunChoices } from "@/lessons";
import type { Mechanism } from "@/lessons/schema";
import { candidateChoices, gradeChoices, type GradedRun } from "./support/lab-runs";

const labs = getCourse().lessons.map((l) => l.lab!) as Lab[];
const SEEDS = ["learner-1", "learner-2", "learner-3", "learner-4"];

const farEndMax = (run: GradedRun) => Math.max(...run.result.farEnd);
const codes = (run: GradedRun) => run.judgement.failures.map((f) => f.code);
const verdictCodes = (run: GradedRun) => run.result.verdict.reasons.map((r) => r.code);

/**
 * What a failing run must show for each mechanism a mistake names. The verdict's reasons explain
 * the judgement that decides the outcome (lib/sim/verdict.ts): why typical pixels misread the run,
 * or else why it is not guaranteed.
 */
const shows: Record<Mechanism, (run: GradedRun, supply: number) => boolean> = {
  ringing: (run) => codes(run).includes("clamp-current") || verdictCodes(run).some((c) => c.startsWith("ring-")),
  overshoot: (run) => codes(run).some((c) => c === "overshoot" || c === "clamp-current"),
  "slow-edge": (run) => codes(run).includes("rise-time") || verdictCodes(run).includes("slow-fall"),
  staircase: (run, supply) =>
    verdictCodes(run).some((c) => c === "never-high" || c === "shortened-one" || c === "narrow-pulse") &&
    run.result.metrics.overshoot < 0.05 &&
    farEndMax(run) < 0.7 * supply,
  "low-level": (run, supply) => verdictCodes(run).some((c) => c === "never-high" || c === "high-level-too-low") && run.result.metrics.overshoot < 0.05 * supply,
  timing: (run) => codes(run).includes("timing-margin"),
  "off-spec-cable": (run) => codes(run).includes("cable-spec"),
};

function findPassing(lab: Lab, variant: LabVariant): Record<string, RunChoices> | null {
  const found: Record<string, RunChoices> = {};
  for (const [i, run] of lab.runs.entries()) {
    const single = { ...variant, runs: [variant.runs[i]] };
    const singleLab = { ...lab, runs: [run] };
    const hit = candidateChoices(lab, variant, i).find((choices) => gradeChoices(singleLab, single, { [run.id]: choices })[0].judgement.pass);
    if (!hit) return null;
    found[run.id] = hit;
  }
  return found;
}

function findFailing(lab: Lab, variant: LabVariant): Record<string, RunChoices> | null {
  for (const mistake of lab.reference.mistakes) {
    if (gradeChoices(lab, variant, mistake.choices).some((run) => !run.judgement.pass)) return mistake.choices;
  }
  const base = lab.reference.solution;
  for (const [i, run] of lab.runs.entries()) {
    for (const choices of [...candidateChoices(lab, variant, i)].reverse()) {
      const attempt = { ...base, [run.id]: choices };
      if (gradeChoices(lab, variant, attempt).some((r) => !r.judgement.pass)) return attempt;
    }
  }
  return null;
}

describe.each(labs.map((lab) => [lab.slug, lab] as const))("lab %s", (_, lab) => {
  const authored = defaultVariant(lab);

  it("passes with its reference solution in the authored scenario", () => {
    const graded = gradeChoices(lab, authored, lab.reference.solution);
    graded.forEach((run, i) => expect(run.judgement.failures, lab.runs[i].id).toEqual([]));
  });

  it.each(lab.reference.mistakes.map((m, i) => [i, m.mechanism, m] as const))("fails mistake %i for the reason it names (%s)", (_i, mechanism, mistake) => {
    const graded = gradeChoices(lab, authored, mistake.choices);
    const failing = graded.map((run, i) => ({ run, supply: authored.runs[i].scenario.receiver.supplyVoltage })).filter(({ run }) => !run.judgement.pass);
    expect(failing.length).toBeGreaterThan(0);
    for (const { run, supply } of failing) expect(shows[mechanism](run, supply), `${codes(run)} / ${verdictCodes(run)}`).toBe(true);
  });

  it.each(SEEDS)("can be passed and can be failed by learner %s", (seed) => {
    const variant = labVariant(lab, seed);
    const passing = findPassing(lab, variant);
    expect(passing, "a passing choice").not.toBeNull();
    expect(gradeChoices(lab, variant, passing!).every((run) => run.judgement.pass)).toBe(true);
    expect(findFailing(lab, variant), "a failing choice").not.toBeNull();
  });

  it("never scores a run above one with at least as much of both margins under the lab's judgement", () => {
    const variant = defaultVariant(lab);
    lab.runs.forEach((run, i) => {
      const single = { ...variant, runs: [variant.runs[i]] };
      const singleLab = { ...lab, runs: [run] };
      const scored = candidateChoices(lab, variant, i).map((choices) => {
        const graded = gradeChoices(singleLab, single, { [run.id]: choices })[0];
        const margins = ruleMargins(lab.passRule, graded.result);
        return { choices, margins, score: scoreRun(lab.passRule, lab.scoring, graded.judgement, margins), pass: graded.judgement.pass };
      });
      const passing = scored.filter((entry) => entry.pass);
      for (const a of passing) {
        for (const b of passing) {
          const aHasMore = (a.margins.timingMargin ?? -Infinity) >= (b.margins.timingMargin ?? -Infinity) && a.margins.voltageMargin >= b.margins.voltageMargin;
          if (aHasMore) expect(a.score, `${JSON.stringify(a.choices)} against ${JSON.stringify(b.choices)}`).toBeGreaterThanOrEqual(b.score);
        }
      }
      for (const entry of scored) if (!entry.pass) expect(entry.score).toBeLessThan(lab.scoring.passBase);
    });
  });
});
