import { describe, expect, it } from "vitest";
import { MAX_SOLVER_STEPS, simulateRun, SimInputError, SimSolveBudgetError, type SimInput } from "@/lib/sim";

const pattern = "010011010110";

function run(input: Omit<SimInput, "signal"> & { signal?: SimInput["signal"] }) {
  return simulateRun({ signal: { bits: pattern }, ...input } as SimInput);
}

describe("simulateRun output", () => {
  it("gives uniform decimated waveforms of at most 4000 points by default", () => {
    const result = run({ cable: { kind: "beside-ground", length: 10 } });
    expect(result.time.length).toBeLessThanOrEqual(4000);
    expect(result.time.length).toBe(result.farEnd.length);
    expect(result.time.length).toBe(result.nearEnd.length);
    const step = result.time[1] - result.time[0];
    expect(result.time[200] - result.time[199]).toBeCloseTo(step, 15);
    expect(result.full).toBeUndefined();
  });

  it("samples at output.sampleInterval when given", () => {
    const result = run({ cable: { kind: "beside-ground", length: 2 }, output: { sampleInterval: 1e-9 } });
    expect(result.time[1]).toBe(1e-9);
    expect(result.time[1000]).toBe(1e-6);
  });

  it("keeps the solver's own steps on request", () => {
    const result = simulateRun({ cable: { kind: "beside-ground", length: 2 }, signal: { bits: "1" } }, { keepFullResolution: true });
    const full = result.full!;
    expect(full.time.length).toBe(full.farEnd.length);
    expect(full.time[1] - full.time[0]).toBeLessThanOrEqual(1e-10);
  });

  it("reports the line it solved: Z0 and delay from the catalogue constants", () => {
    const result = run({ cable: { kind: "coax-75", length: 10 } });
    expect(result.line.z0).toBeCloseTo(75, 0);
    expect(result.line.delay).toBeCloseTo(50e-9, 9);
    expect(result.metrics.delay).toBe(result.line.delay);
  });

  it("throws SimInputError on bad input", () => {
    expect(() => simulateRun({ cable: { kind: "lone-lead", length: -1 }, signal: { bits: "1" } })).toThrow(SimInputError);
  });
});

describe("the step budget", () => {
  it("refuses a case needing more steps than the budget, with a message", () => {
    const colours = Array.from({ length: 200 }, () => [255, 255, 255] as [number, number, number]);
    const attempt = () => simulateRun({ cable: { kind: "beside-ground", length: 10 }, signal: { colours } });
    expect(attempt).toThrow(SimSolveBudgetError);
    expect(attempt).toThrow(/solver steps .* more than the budget of 5,000,000/);
    expect(MAX_SOLVER_STEPS).toBe(5_000_000);
  });

  it("refuses an output grid finer than the point budget", () => {
    expect(() => run({ cable: { kind: "beside-ground", length: 1 }, output: { sampleInterval: 1e-12 } })).toThrow(SimSolveBudgetError);
  });
});

describe("verdicts name the physics", () => {
  it("a clean 5 V run is guaranteed, with no reasons", () => {
    const result = run({ driver: { highVoltage: 5, outputResistance: 20 }, seriesResistance: 33, cable: { kind: "beside-ground", length: 10 } });
    expect(result.decoded).toBe(pattern);
    expect(result.verdict.outcome).toBe("guaranteed");
    expect(result.verdict.reasons).toEqual([]);
    expect(result.verdict.guaranteed.bitErrors).toBe(0);
  });

  it("a 3.3 V driver with a large resistor beside ground: the far end never reaches where typical pixels switch", () => {
    const result = run({
      driver: { highVoltage: 3.3, outputResistance: 30 },
      seriesResistance: 249,
      cable: { kind: "beside-ground", length: 10 },
    });
    expect(result.verdict.outcome).toBe("fails");
    const reasons = result.verdict.reasons.filter((r) => r.judgement === "typical");
    expect(reasons.length).toBeGreaterThan(0);
    expect(reasons.some((r) => r.code === "never-high" || r.code === "shortened-one")).toBe(true);
    expect(reasons[0].at?.time).toBeGreaterThan(1e-6);
  });

  it("a 3.3 V driver behind a near match: typical pixels read it, and the reason it is not guaranteed is the driver's level", () => {
    const result = run({ driver: { highVoltage: 3.3, outputResistance: 30 }, seriesResistance: 68, cable: { kind: "beside-ground", length: 10 } });
    expect(result.verdict.outcome).toBe("typical");
    const reason = result.verdict.reasons.find((r) => r.code === "never-high");
    expect(reason?.judgement).toBe("guaranteed");
    expect(reason?.message).toContain("never rises above the datasheet's high threshold (3.50 V)");
    expect(reason?.message).toContain("3.30 V high level sits below that level");
  });

  it("blames the resistor and the cable capacitance when a 5 V edge is too slow", () => {
    const result = run({ seriesResistance: 2200, cable: { kind: "three-core", length: 20 } });
    const reason = result.verdict.reasons.find((r) => r.code === "never-high");
    expect(result.verdict.outcome).toBe("fails");
    expect(reason?.message).toContain("the resistor and the cable capacitance make the rising edge too slow");
    expect(reason?.message).toContain("staircase");
  });

  it("blames the wrong-signed reflection for ringing through the band, and warns of a filter set for the run without passing it", () => {
    const input = { driver: { highVoltage: 3.3, outputResistance: 30 }, seriesResistance: 33, cable: { kind: "lone-lead" as const, length: 10 } };
    const unfiltered = run(input);
    expect(unfiltered.verdict.outcome).toBe("fails");
    const reason = unfiltered.verdict.reasons.find((r) => r.code === "ring-after-rise");
    expect(reason?.message).toContain("the reflection returns with the wrong sign");

    const filtered = run({ ...input, receiver: { deglitchTime: 40e-9 } });
    expect(filtered.verdict.outcome).toBe("fails");
    expect(filtered.verdict.reasons.some((r) => r.code.startsWith("ringing-filtered") && r.severity === "warning")).toBe(true);
  });

  it("reports the clamp current and overshoot of a hard-driven unterminated line", () => {
    const result = run({ driver: { highVoltage: 5, outputResistance: 5 }, cable: { kind: "lone-lead", length: 10 } });
    expect(result.metrics.clampCurrentPeak).toBeGreaterThan(10e-3);
    expect(result.metrics.overshoot).toBeGreaterThan(0.5);
    expect(result.verdict.reasons.find((r) => r.code === "clamp-current")?.at?.time).toBeGreaterThan(1e-6);
  });
});
