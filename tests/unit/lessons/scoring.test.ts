import { describe, expect, it } from "vitest";
import { simulateRun } from "@/lib/sim";
import { buildSimInput, COURSE_CLAMP_CURRENT_LIMIT, getLab, judgeRun, scoreAttempt, scoreRun, type PassRule, type RunJudgement, type Scoring } from "@/lessons";

const scoring: Scoring = {
  fullMarksMargin: { timing: 180e-9, voltage: 1.0 },
  passBase: 60,
  failCreditMax: 30,
  questionShare: 0,
  penaltyPerAttemptBeyond: 3,
  penalty: 5,
};
const rule: PassRule = { judgement: "typical", judgementWhy: "a test rule", allBitsDecode: true, minTimingMargin: 120e-9, minVoltageMargin: 0.3 };
const passed: RunJudgement = { pass: true, failures: [], bitsCorrect: 16, bitsSent: 16 };

describe("scoreRun", () => {
  it("gives the pass base at the rule's minimum margins and 100 at the full-marks margins", () => {
    expect(scoreRun(rule, scoring, passed, { timingMargin: 120e-9, voltageMargin: 0.3 })).toBeCloseTo(60, 9);
    expect(scoreRun(rule, scoring, passed, { timingMargin: 180e-9, voltageMargin: 1.0 })).toBeCloseTo(100, 9);
    expect(scoreRun(rule, scoring, passed, { timingMargin: 250e-9, voltageMargin: 3 })).toBeCloseTo(100, 9);
  });

  it("credits the weaker margin's progress: a run never outscores one with more of both", () => {
    expect(scoreRun(rule, scoring, passed, { timingMargin: 180e-9, voltageMargin: 0.3 })).toBeCloseTo(60, 9);
    expect(scoreRun(rule, scoring, passed, { timingMargin: 150e-9, voltageMargin: 0.65 })).toBeCloseTo(80, 9);
    expect(scoreRun(rule, scoring, passed, { timingMargin: 150e-9, voltageMargin: 1.0 })).toBeCloseTo(80, 9);
  });

  it("gives a failing run partial credit for the bits it got right, below any pass", () => {
    const failed: RunJudgement = { pass: false, failures: [{ code: "bits-not-decoded", message: "" }], bitsCorrect: 8, bitsSent: 16 };
    expect(scoreRun(rule, scoring, failed, { timingMargin: null, voltageMargin: -0.2 })).toBeCloseTo(15, 9);
    expect(scoreRun(rule, scoring, { ...failed, bitsCorrect: 16 }, { timingMargin: 200e-9, voltageMargin: 0.1 })).toBeLessThan(60);
  });
});

describe("scoreAttempt", () => {
  it("counts the weakest run and charges for attempts beyond the free ones", () => {
    const base = { scoring, runScores: [100, 72, 90], questions: { asked: 0, correct: 0 } };
    expect(scoreAttempt({ ...base, attemptNumber: 1 })).toBe(72);
    expect(scoreAttempt({ ...base, attemptNumber: 3 })).toBe(72);
    expect(scoreAttempt({ ...base, attemptNumber: 5 })).toBe(62);
    expect(scoreAttempt({ ...base, runScores: [10], attemptNumber: 9 })).toBe(0);
  });

  it("weighs lab questions by the lab's question share", () => {
    const withQuestions = { ...scoring, questionShare: 0.3 };
    expect(scoreAttempt({ scoring: withQuestions, runScores: [100], questions: { asked: 2, correct: 1 }, attemptNumber: 1 })).toBe(85);
    expect(scoreAttempt({ scoring: withQuestions, runScores: [80], questions: { asked: 0, correct: 0 }, attemptNumber: 1 })).toBe(80);
  });
});

describe("judgeRun on simulated runs", () => {
  const lab = getLab("lone-lead-termination")!;
  const scenario = lab.runs[0].scenario;
  const run = (seriesResistance: number) => simulateRun(buildSimInput(scenario, { seriesResistance }));

  it("passes a resistor inside the 3.3 V window and fails the ones either side for the reasons the lesson gives", () => {
    expect(judgeRun(lab.passRule, 5, run(240)).pass).toBe(true);
    const under = judgeRun(lab.passRule, 5, run(100));
    expect(under.failures.map((f) => f.code)).toEqual(expect.arrayContaining(["bits-not-decoded", "voltage-margin"]));
    expect(under.bitsCorrect).toBe(0);
    // Above Z0: typical pixels read it, but with less than the 0.3 V the rule asks.
    const over = judgeRun(lab.passRule, 5, run(470));
    expect(over.failures.map((f) => f.code)).toContain("voltage-margin");
    expect(over.failures.map((f) => f.code)).not.toContain("bits-not-decoded");
  });

  it("holds every run to the course's one clamp-current limit", () => {
    const hard = simulateRun(buildSimInput({ ...scenario, cable: "beside-ground" }, { seriesResistance: 0 }));
    expect(hard.metrics.clampCurrentPeak).toBeGreaterThan(COURSE_CLAMP_CURRENT_LIMIT);
    expect(judgeRun(lab.passRule, 5, hard).failures.map((f) => f.code)).toContain("clamp-current");
  });

  it("applies each optional limit of the rule", () => {
    const result = run(240);
    const { metrics } = result;
    const tight: PassRule = {
      ...lab.passRule,
      maxOvershoot: (0.5 * metrics.overshoot) / 5,
      maxRiseTime: 0.5 * metrics.riseTime!,
      cableSpec: { minZ0: 80, maxZ0: 120, maxDelayPerMetre: 6e-9, maxCapacitancePerMetre: 70e-12 },
    };
    expect(judgeRun(tight, 5, result).failures.map((f) => f.code).sort()).toEqual(["cable-spec", "overshoot", "rise-time"]);
  });
});
