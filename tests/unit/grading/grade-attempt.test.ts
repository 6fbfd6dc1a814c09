/**
 * The grader on real lab definitions: choices are checked against the learner's own variant, the
 * runs are simulated and judged by the lab's rule, and the score follows lessons/scoring.ts.
 */
import { describe, expect, it } from "vitest";
import { getLab, labVariant, type Lab } from "@/lessons";
import { formatInUnit } from "@/lib/answers";
import { gradeAttempt, variantSeedFor } from "@/lib/grading";
import { AppError } from "@/lib/http/errors";

function lab(slug: string): Lab {
  const found = getLab(slug);
  if (!found) throw new Error(`no lab ${slug}`);
  return found;
}

function fieldErrorsOf(run: () => unknown): Record<string, string[]> {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).code).toBe("invalid-input");
    return (error as AppError).fieldErrors ?? {};
  }
  throw new Error("expected the grader to refuse the input");
}

/** The lab's questions answered right, as a learner would type them. */
function rightAnswers(lab: Lab): Record<string, string> {
  return Object.fromEntries(lab.questions.map((q) => [q.id, formatInUnit(q.answer.value, q.answer.unit)]));
}

const loneLead = lab("lone-lead-termination");
const loneLeadSeed = variantSeedFor("learner-7f3a", loneLead.slug);

describe("variant seed", () => {
  it("is the learner and the lab, so each learner keeps one scenario per lab", () => {
    expect(variantSeedFor("u-1", "thresholds")).toBe("u-1:thresholds");
  });
});

describe("a long lone lead from a 3.3 V pin", () => {
  it("passes with a resistor a little below a match, judged for typical pixels as the lab states", () => {
    const grade = gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices: { main: { seriesResistance: 240 } }, attemptNumber: 1 });
    expect(loneLead.passRule.judgement).toBe("typical");
    expect(grade.runs[0].verdict.outcome).toBe("typical");
    expect(grade.passed).toBe(true);
    expect(grade.runs).toHaveLength(1);
    expect(grade.runs[0]).toMatchObject({ runId: "main", pass: true, failures: [] });
    expect(grade.runs[0].bitsCorrect).toBe(grade.runs[0].bitsSent);
    expect(grade.score).toBeGreaterThanOrEqual(loneLead.scoring.passBase);
    expect(grade.score).toBeLessThanOrEqual(100);
  });

  it("fails a small resistor: the ringing falls back through where typical pixels switch", () => {
    const grade = gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices: { main: { seriesResistance: 33 } }, attemptNumber: 1 });
    expect(grade.passed).toBe(false);
    const run = grade.runs[0];
    expect(run.verdict.outcome).toBe("fails");
    expect(run.failures.map((f) => f.code)).toEqual(expect.arrayContaining(["bits-not-decoded", "voltage-margin"]));
    expect(run.verdict.reasons.find((r) => r.severity === "fail")?.code).toBe("ring-after-rise");
    expect(grade.score).toBeLessThanOrEqual(loneLead.scoring.failCreditMax);
  });

  it("fails a large resistor: with no overshoot the far end clears the typical band by less than the lab's margin", () => {
    const grade = gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices: { main: { seriesResistance: 470 } }, attemptNumber: 1 });
    expect(grade.passed).toBe(false);
    expect(grade.runs[0].failures.map((f) => f.code)).toContain("voltage-margin");
    expect(grade.runs[0].verdict.reasons.find((r) => r.judgement === "guaranteed")).toMatchObject({ code: "never-high", severity: "warning" });
  });

  it("takes the attempt penalty beyond the free attempts, never below zero", () => {
    const choices = { main: { seriesResistance: 240 } };
    const first = gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices, attemptNumber: 1 });
    const free = loneLead.scoring.penaltyPerAttemptBeyond;
    expect(gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices, attemptNumber: free }).score).toBe(first.score);
    expect(gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices, attemptNumber: free + 2 }).score).toBe(
      first.score - 2 * loneLead.scoring.penalty,
    );
    expect(gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices, attemptNumber: 500 }).score).toBe(0);
  });

  it("grades the same stored choices and seed to the same result again", () => {
    const choices = { main: { seriesResistance: 180 } };
    const once = gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices, attemptNumber: 2 });
    const again = gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices, attemptNumber: 2 });
    expect(again).toEqual(once);
  });

  it("refuses a value outside the offered E-series, naming the field", () => {
    const errors = fieldErrorsOf(() =>
      gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices: { main: { seriesResistance: 155 } }, attemptNumber: 1 }),
    );
    expect(Object.keys(errors)).toEqual(["choices.main.seriesResistance"]);
    expect(errors["choices.main.seriesResistance"][0]).toMatch(/E24/);
  });

  it("refuses an E24 value outside the lab's range and a choice the lab does not offer", () => {
    expect(
      Object.keys(fieldErrorsOf(() => gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices: { main: { seriesResistance: 1200 } }, attemptNumber: 1 }))),
    ).toEqual(["choices.main.seriesResistance"]);
    const errors = fieldErrorsOf(() =>
      gradeAttempt({ lab: loneLead, seed: loneLeadSeed, choices: { main: { seriesResistance: 150, cable: "coax-75" } }, attemptNumber: 1 }),
    );
    expect(errors["choices.main.cable"]).toEqual(["is not a choice in this lab"]);
  });
});

describe("a cable choice", () => {
  const cableLab = lab("cable-spec");
  const seed = variantSeedFor("learner-7f3a", cableLab.slug);

  it("accepts only a cable on offer", () => {
    const errors = fieldErrorsOf(() =>
      gradeAttempt({ lab: cableLab, seed, choices: { main: { cable: "garden-hose" } }, answers: rightAnswers(cableLab), attemptNumber: 1 }),
    );
    expect(Object.keys(errors)).toEqual(["choices.main.cable"]);
  });

  it("grades every cable on offer, and at least one passes and one fails the specification", () => {
    const offered = labVariant(cableLab, seed).runs[0].scenario.cableOptions ?? [];
    const grades = offered.map((cable) =>
      gradeAttempt({ lab: cableLab, seed, choices: { main: { cable } }, answers: rightAnswers(cableLab), attemptNumber: 1 }),
    );
    expect(grades.some((g) => g.passed)).toBe(true);
    expect(grades.some((g) => !g.passed)).toBe(true);
  });
});

describe("the capstone", () => {
  const capstone = lab("capstone-installation");
  const seed = variantSeedFor("learner-7f3a", capstone.slug);

  it("needs a choice for every run", () => {
    const errors = fieldErrorsOf(() =>
      gradeAttempt({ lab: capstone, seed, choices: { arch: { seriesResistance: 150 }, canopy: { seriesResistance: 20 } }, attemptNumber: 1 }),
    );
    expect(Object.keys(errors)).toEqual(["choices.facade"]);
  });

  it("scores the weakest run: one run on the wrong resistor fails the installation", () => {
    const good = gradeAttempt({ lab: capstone, seed, choices: capstone.reference.solution, attemptNumber: 1 });
    expect(good.passed).toBe(true);
    expect(good.runs.map((r) => r.pass)).toEqual([true, true, true]);

    const facadeWrong = { ...capstone.reference.solution, facade: { seriesResistance: 150 } };
    const bad = gradeAttempt({ lab: capstone, seed, choices: facadeWrong, attemptNumber: 1 });
    expect(bad.passed).toBe(false);
    expect(bad.runs.map((r) => [r.runId, r.pass])).toEqual([
      ["arch", true],
      ["facade", false],
      ["canopy", true],
    ]);
    expect(bad.score).toBe(Math.round(Math.min(...bad.runs.map((r) => r.score))));
    expect(bad.score).toBeLessThan(good.score);
  });
});

describe("lab questions", () => {
  const timing = lab("timing-budget");
  const seed = variantSeedFor("learner-7f3a", timing.slug);
  const choices = { main: { zeroHigh: 0.4e-6, oneHigh: 0.8e-6 } };
  // 360 pixels × 24 bits × 1.25 µs + 300 µs = 11.1 ms, hence 90.1 Hz.
  const right = { "frame-time": "11.1 ms", "refresh-rate": "90 Hz" };

  it("reads answers with units and counts them in the score", () => {
    const full = gradeAttempt({ lab: timing, seed, choices, answers: right, attemptNumber: 1 });
    expect(full.passed).toBe(true);
    expect(full.questions.map((q) => [q.id, q.correct])).toEqual([
      ["frame-time", true],
      ["refresh-rate", true],
    ]);
    expect(full.questions[0].value).toBeCloseTo(11.1e-3, 9);

    const oneWrong = gradeAttempt({ lab: timing, seed, choices, answers: { ...right, "refresh-rate": "60 Hz" }, attemptNumber: 1 });
    expect(oneWrong.questions.map((q) => q.correct)).toEqual([true, false]);
    expect(oneWrong.score).toBeLessThan(full.score);
    expect(oneWrong.passed).toBe(true);
  });

  it("accepts the same quantity written another way", () => {
    const grade = gradeAttempt({ lab: timing, seed, choices, answers: { "frame-time": "0.0111 s", "refresh-rate": "0.09 kHz" }, attemptNumber: 1 });
    expect(grade.questions.every((q) => q.correct)).toBe(true);
  });

  it("refuses an unreadable entry, a missing one and an unknown question, naming each", () => {
    const errors = fieldErrorsOf(() =>
      gradeAttempt({ lab: timing, seed, choices, answers: { "frame-time": "eleven ms", "latch-time": "300 us" }, attemptNumber: 1 }),
    );
    expect(Object.keys(errors).sort()).toEqual(["answers.frame-time", "answers.latch-time", "answers.refresh-rate"]);
    expect(errors["answers.frame-time"][0]).toMatch(/Could not read/);
  });

  it("names a bad choice and an unreadable answer in the same refusal", () => {
    const errors = fieldErrorsOf(() =>
      gradeAttempt({ lab: timing, seed, choices: { main: { zeroHigh: 0.42e-6, oneHigh: 0.8e-6 } }, answers: { ...right, "refresh-rate": "90" }, attemptNumber: 1 }),
    );
    expect(Object.keys(errors).sort()).toEqual(["answers.refresh-rate", "choices.main.zeroHigh"]);
    expect(errors["answers.refresh-rate"][0]).toMatch(/has no unit/);
  });

  it("refuses a quantity of the wrong kind", () => {
    const errors = fieldErrorsOf(() =>
      gradeAttempt({ lab: timing, seed, choices, answers: { ...right, "frame-time": "11.1 V" }, attemptNumber: 1 }),
    );
    expect(errors["answers.frame-time"][0]).toMatch(/a voltage; this asks for a time/);
  });
});
