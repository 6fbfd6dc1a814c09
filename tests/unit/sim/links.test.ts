import { describe, expect, it } from "vitest";
import { OUTCOME_WORDS, SimInputError } from "@/lib/sim";
import { DIFFERENTIAL_DEFAULTS, simulateDifferentialLink, type DifferentialLinkInput } from "@/lib/sim/differential-link";
import { simulateSplitRun } from "@/lib/sim/split-run";

const bits = "0100110101";
const buffer = { highVoltage: 5, outputResistance: 20 };

describe("a run split by a regenerating pixel", () => {
  const clean = { driver: buffer, seriesResistance: 47, cable: { kind: "twisted-pair" as const, length: 10 } };
  const slow = { driver: buffer, seriesResistance: 1000, cable: { kind: "beside-ground" as const, length: 20 } };

  it("is as good as its worse segment, and the reasons name the segment that fails first", () => {
    const result = simulateSplitRun({ signal: { bits }, segments: [clean, slow] });
    expect(result.segments.map((s) => s.verdict.outcome)).toEqual(["guaranteed", "fails"]);
    expect(result.verdict.outcome).toBe("fails");
    expect(result.verdict.summary).toBe(OUTCOME_WORDS.fails);
    expect(result.verdict.decidingStage).toMatch(/^segment 2 /);
    expect(result.verdict.reasons[0].message).toMatch(/^segment 2 \(regenerating pixel to the end, 20 m\) decides the run/);
    expect(result.verdict.reasons.every((r) => r.message.startsWith(r.stage))).toBe(true);
    expect(result.verdict.typical.pass).toBe(false);
  });

  it("each segment starts afresh: the clean segment after a failing one is judged as the same run alone", () => {
    const result = simulateSplitRun({ signal: { bits }, segments: [slow, clean] });
    const alone = simulateSplitRun({ signal: { bits }, segments: [clean, clean] }).segments[0];
    expect(result.segments[1].verdict.guaranteed.voltageMargin).toBe(alone.verdict.guaranteed.voltageMargin);
    expect(result.verdict.decidingStage).toMatch(/^segment 1 /);
  });

  it("needs at least two segments", () => {
    expect(() => simulateSplitRun({ signal: { bits }, segments: [clean] })).toThrow(SimInputError);
  });
});

describe("a differential link", () => {
  const link = (overrides: Partial<DifferentialLinkInput> = {}): DifferentialLinkInput => ({
    signal: { bits },
    cable: { kind: "twisted-pair", length: 50 },
    local: { driver: buffer, seriesResistance: 33, cable: { kind: "beside-ground", length: 0.3 } },
    ...overrides,
  });

  it("is judged at the receiver on its own thresholds: ±200 mV guaranteed, near 0 V typical", () => {
    const result = simulateDifferentialLink(link());
    expect(result.link.verdict.guaranteed.band).toMatchObject({ lowest: expect.closeTo(-0.2, 9), highest: expect.closeTo(0.2, 9), hysteresis: 0 });
    expect(result.link.verdict.typical.band.hysteresis).toBeCloseTo(DIFFERENTIAL_DEFAULTS.typicalHysteresis, 9);
    // 120 Ω across the far end of a 99 Ω pair behind 27 Ω: the far end settles near ±3 V × 120/(27 + 120 + line) ≈ ±2.4 V.
    expect(Math.max(...result.link.farEnd)).toBeGreaterThan(2.2);
    expect(Math.min(...result.link.farEnd)).toBeLessThan(-2.2);
    expect(result.link.verdict.guaranteed.voltageMargin).toBeGreaterThan(1.5);
    expect(result.link.decoded).toBe(bits);
  });

  it("a receiver that needs more than the pair delivers is not guaranteed, and the reason names its thresholds", () => {
    const weak = simulateDifferentialLink(link({ receiver: { threshold: 2.5 }, transmitter: { openCircuitLevel: 3 } }));
    expect(weak.link.verdict.outcome).not.toBe("guaranteed");
    expect(weak.verdict.outcome).toBe(weak.link.verdict.outcome);
    expect(weak.verdict.reasons.some((r) => /the pair .*guaranteed ±2500 mV/.test(r.message))).toBe(true);
  });

  it("the pixel after the receiver sees the local run: a failing local lead fails the link", () => {
    const result = simulateDifferentialLink(link({ local: { driver: buffer, seriesResistance: 1000, cable: { kind: "beside-ground", length: 20 } } }));
    expect(result.link.verdict.outcome).toBe("guaranteed");
    expect(result.verdict.outcome).toBe("fails");
    expect(result.verdict.decidingStage).toMatch(/local lead/);
  });

  it("rejects thresholds outside the transmitter's swing", () => {
    expect(() => simulateDifferentialLink(link({ receiver: { threshold: 4 } }))).toThrow(SimInputError);
  });
});
