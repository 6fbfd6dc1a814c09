import { describe, expect, it } from "vitest";
import { parseSimInput, SimInputError, simulateRun, type SimInput } from "@/lib/sim";

/** A line too short to have a delay: the pin's DC levels follow from the resistors alone. */
const shortRun = (termination: SimInput["termination"]): SimInput => ({
  driver: { highVoltage: 5, outputResistance: 20 },
  seriesResistance: 33,
  cable: { kind: "beside-ground", length: 0.001 },
  receiver: { supplyVoltage: 5, clampDiodes: false },
  termination,
  signal: { bits: "1" },
});

const lastOf = (values: number[]) => values[values.length - 1];

describe("far-end terminations", () => {
  it("rejects an unknown kind and missing or out-of-range values, naming the field", () => {
    expect(() => parseSimInput({ ...shortRun(undefined), termination: { kind: "diode" } })).toThrow(/termination/);
    expect(() => parseSimInput({ ...shortRun(undefined), termination: { kind: "thevenin", toSupply: 220 } })).toThrow(/termination\.toGround/);
    expect(() => parseSimInput({ ...shortRun(undefined), termination: { kind: "parallel", resistance: 0 } })).toThrow(SimInputError);
  });

  it("parallel: the high level is the divider of source and termination (5 V × 100/(53 + 100) = 3.27 V)", () => {
    const result = simulateRun(shortRun({ kind: "parallel", resistance: 100 }), { keepFullResolution: true });
    expect(Math.max(...result.full!.farEnd)).toBeCloseTo((5 * 100) / 153, 2);
    expect(result.metrics.overshoot).toBeLessThan(0.01);
  });

  it("Thevenin: the idle level is the divider's, 5 V × (53 ∥ 330)/((53 ∥ 330) + 220)", () => {
    const result = simulateRun(shortRun({ kind: "thevenin", toSupply: 220, toGround: 330 }));
    const lower = 1 / (1 / 53 + 1 / 330);
    expect(lastOf(result.farEnd)).toBeCloseTo((5 * lower) / (lower + 220), 3);
  });

  it("RC: no DC current, so the levels stay the driver's, and the edge slows while the 220 pF charges (τ = 153 Ω × 220 pF, 34 ns)", () => {
    const bare = simulateRun(shortRun(undefined));
    const rc = simulateRun(shortRun({ kind: "rc", resistance: 100, capacitance: 220e-12 }));
    expect(Math.max(...rc.farEnd)).toBeCloseTo(5, 2);
    expect(rc.metrics.riseTime!).toBeGreaterThan(2 * bare.metrics.riseTime!);
  });

  it("a parallel termination matched to the line ends the ringing a low source leaves on 20 m of twisted pair", () => {
    const run = (termination: SimInput["termination"]) =>
      simulateRun({ ...shortRun(termination), seriesResistance: 0, cable: { kind: "twisted-pair", length: 20 }, signal: { bits: "0110" } });
    const bare = run(undefined);
    const matched = run({ kind: "parallel", resistance: 100 });
    expect(bare.metrics.overshoot).toBeGreaterThan(0.5);
    expect(matched.metrics.overshoot).toBeLessThan(0.1 * bare.metrics.overshoot);
  });
});
