import { describe, expect, it } from "vitest";
import { colourBits, simulateRun, type SimInput } from "@/lib/sim";

/**
 * Bit replays (lib/sim/bit-replays.ts) copy a bit on from an earlier one whose starting state
 * lies within the tolerance: the copy must stay within 1 % of VDD of solving every bit (issue 14's
 * bound for the planner's sweep), read the same bits, and actually copy bits where states repeat.
 */
const colours = colourBits(
  [
    [255, 96, 0],
    [18, 52, 86],
    [0, 200, 120],
    [171, 205, 239],
  ],
  "GRB",
);

const run = (seriesResistance: number, kind: "lone-lead" | "twisted-pair", bits: string): SimInput => ({
  driver: { highVoltage: 3.3, outputResistance: 30, edgeTime: 4e-9 },
  seriesResistance,
  cable: { kind, length: 20 },
  receiver: { supplyVoltage: 5 },
  signal: { bits },
});

const largestDifference = (a: Float64Array, b: Float64Array) => a.reduce((worst, v, i) => Math.max(worst, Math.abs(v - b[i])), 0);

describe("bit replays", () => {
  it.each([
    ["20 m of lone lead behind 33 Ω, ringing throughout, four pixels' colours", run(33, "lone-lead", colours)],
    ["the same with a run of equal bits, whose state repeats", run(33, "lone-lead", "0".repeat(24) + "1".repeat(24))],
    ["20 m of twisted pair behind 1 kΩ, a staircase that never rests", run(1000, "twisted-pair", colours)],
  ])("%s: within a hundredth of VDD of solving every bit", (_, input) => {
    const solved = simulateRun(input, { keepFullResolution: true });
    const copied = simulateRun(input, { keepFullResolution: true, bitReplayTolerance: 5e-3 });
    const vdd = 5;
    expect(solved.line.copiedBits).toBe(0);
    expect(copied.line.copiedBits).toBeGreaterThan(0);
    expect(largestDifference(solved.full!.farEnd, copied.full!.farEnd)).toBeLessThan(0.01 * vdd);
    expect(largestDifference(solved.full!.nearEnd, copied.full!.nearEnd)).toBeLessThan(0.01 * vdd);
    expect(copied.decoded).toBe(solved.decoded);
    expect(copied.verdict.outcome).toBe(solved.verdict.outcome);
    for (const judgement of ["guaranteed", "typical"] as const) {
      expect(Math.abs(copied.verdict[judgement].voltageMargin - solved.verdict[judgement].voltageMargin)).toBeLessThan(0.01 * vdd);
    }
  });

  it("copies nothing when no two starting states agree within the tolerance", () => {
    const copied = simulateRun(run(33, "lone-lead", "0110"), { bitReplayTolerance: 5e-3 });
    expect(copied.line.copiedBits).toBe(0);
  });
});
