/**
 * The verdict's reasons name the cause the run's own numbers show: a thin timing margin left by
 * the high times the learner chose is put down to those, not to the edges of a 2 ns driver; one
 * that slow edges eat out of well-chosen high times is put down to the edges.
 */
import { describe, expect, it } from "vitest";
import { buildSimInput, getLab, labVariant } from "@/lessons";
import { simulateRun, type VerdictReason } from "@/lib/sim";

const lab = getLab("timing-budget")!;
const scenario = labVariant(lab, "x").runs[0].scenario;

function run(choices: { zeroHigh: number; oneHigh: number }, seriesResistance = scenario.seriesResistance) {
  return simulateRun(buildSimInput({ ...scenario, seriesResistance }, choices));
}

function reasonsOf(choices: { zeroHigh: number; oneHigh: number }, seriesResistance?: number): VerdictReason[] {
  return run(choices, seriesResistance).verdict.reasons;
}

describe("the timing-margin reason", () => {
  it("blames the chosen high times when they leave the margin, with their numbers, and not the 2 ns edges", () => {
    expect(run({ zeroHigh: 0.55e-6, oneHigh: 0.8e-6 }).metrics.riseTime).toBeLessThan(2.5e-9);
    const [reason] = reasonsOf({ zeroHigh: 0.55e-6, oneHigh: 0.8e-6 });
    expect(reason.code).toBe("thin-timing-margin");
    expect(reason.message).toMatch(/of being read as a 1/);
    expect(reason.message).toMatch(/the high time chosen for a 0 \(550 ns\) is itself only 50 ns shorter than the 600 ns decision time/);
    expect(reason.message).toMatch(/The pulse widths chosen set this margin, not the edges/);
    expect(reason.message).not.toMatch(/slow|capacitance|time constant/);

    const [oneReason] = reasonsOf({ zeroHigh: 0.4e-6, oneHigh: 0.62e-6 });
    expect(oneReason.message).toMatch(/the high time chosen for a 1 \(620 ns\) is itself only 20 ns longer than the 600 ns decision time/);
    expect(oneReason.message).not.toMatch(/slow|capacitance/);
  });

  it("blames slow edges when well-chosen high times lose their margin on the line, with the resistor and capacitance", () => {
    const reasons = reasonsOf({ zeroHigh: 0.3e-6, oneHigh: 0.9e-6 }, 1050);
    const reason = reasons.find((r) => r.code === "thin-timing-margin");
    expect(reason, JSON.stringify(reasons)).toBeDefined();
    expect(reason!.message).toMatch(/the high time chosen for a 0 \(300 ns\) is 150 ns longer than the shortest pulse a pixel counts \(150 ns\), and the far end takes \d+ ns of that/);
    expect(reason!.message).toMatch(/make the rising edge too slow \(1\d{3} Ω charging \d+ pF, a time constant of about \d+ ns\)/);
    expect(reason!.message).not.toMatch(/pulse widths chosen set/);
  });

  it("puts a low too short for the pixel down to a high time chosen too long, not to the edges", () => {
    const [reason] = reasonsOf({ zeroHigh: 0.4e-6, oneHigh: 1.15e-6 });
    expect(reason.code).toBe("short-low");
    expect(reason.message).toMatch(/the high time chosen for a 1 \(1\.15 µs\) itself leaves only 100 ns of low before the next bit, less than the 150 ns a pixel needs/);
    expect(reason.message).not.toMatch(/slow/);
  });
});
