/**
 * Statements the lessons make about how runs behave, checked against the simulator that grades
 * the labs (the lessons cite it as their source). Each case names the lesson that makes the claim.
 */
import { describe, expect, it } from "vitest";
import { CABLE_KINDS, cableCatalogue, parseSimInput, simulateRun, type CableKind, type SimResult } from "@/lib/sim";
import { buffer5v, controllerPin3v3 } from "@/lessons/drivers";

const BITS = "0100110101100010";

function run(options: { volts: number; cable: CableKind; length: number; seriesResistance: number }): SimResult {
  const pin = options.volts < 4;
  return simulateRun({
    driver: { highVoltage: options.volts, outputResistance: pin ? 30 : 20, edgeTime: pin ? 4e-9 : 3e-9 },
    seriesResistance: options.seriesResistance,
    cable: { kind: options.cable, length: options.length },
    receiver: { supplyVoltage: 5 },
    signal: { bits: BITS },
  });
}

const decodes = (result: SimResult) => result.decoded === BITS;
const codes = (result: SimResult) => result.verdict.reasons.map((r) => r.code);

describe("lesson 6: the field rule at 3.3 V into a 5 V pixel, 10 m", () => {
  it("lone lead: about 33 Ω rings through the thresholds and into the clamps", () => {
    const result = run({ volts: 3.3, cable: "lone-lead", length: 10, seriesResistance: 33 });
    expect(codes(result).some((c) => c.startsWith("ringing-filtered") || c.startsWith("ring-"))).toBe(true);
    expect(result.metrics.clampCurrentPeak).toBeGreaterThan(5e-3);
  });

  it("lone lead: 150 Ω decodes with 0.3 V to spare, and about 250 Ω still decodes on a thin margin", () => {
    const middle = run({ volts: 3.3, cable: "lone-lead", length: 10, seriesResistance: 150 });
    expect(decodes(middle)).toBe(true);
    expect(middle.metrics.voltageMargin).toBeGreaterThan(0.3);
    const fieldValue = run({ volts: 3.3, cable: "lone-lead", length: 10, seriesResistance: 240 });
    expect(decodes(fieldValue)).toBe(true);
    expect(fieldValue.metrics.voltageMargin).toBeLessThan(0.3);
  });

  it("lone lead: a near match (330 Ω) delivers 3.3 V and never a guaranteed high", () => {
    expect(codes(run({ volts: 3.3, cable: "lone-lead", length: 10, seriesResistance: 330 }))).toContain("never-high");
  });

  it("beside ground: about 33 Ω decodes, about 250 Ω never clears 3.5 V", () => {
    const small = run({ volts: 3.3, cable: "beside-ground", length: 10, seriesResistance: 33 });
    expect(decodes(small)).toBe(true);
    expect(small.metrics.voltageMargin).toBeGreaterThan(0.3);
    const large = run({ volts: 3.3, cable: "beside-ground", length: 10, seriesResistance: 240 });
    expect(codes(large)).toContain("never-high");
    expect(Math.max(...large.farEnd)).toBeLessThan(3.5);
  });

  it("the lone-lead and beside-ground windows do not overlap", () => {
    const ok = (cable: CableKind, seriesResistance: number) => {
      const result = run({ volts: 3.3, cable, length: 10, seriesResistance });
      return decodes(result) && result.metrics.voltageMargin >= 0.3;
    };
    const e12 = [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82, 100, 120, 150, 180, 220, 270, 330];
    const lone = e12.filter((r) => ok("lone-lead", r) && !codes(run({ volts: 3.3, cable: "lone-lead", length: 10, seriesResistance: r })).some((c) => c.startsWith("ringing-filtered")));
    const beside = e12.filter((r) => ok("beside-ground", r));
    expect(lone.length).toBeGreaterThan(3);
    expect(beside.length).toBeGreaterThan(3);
    const shared = lone.filter((r) => beside.includes(r));
    expect(shared.length).toBeLessThanOrEqual(1);
    for (const r of shared) {
      expect(r).toBe(Math.min(...lone));
      expect(r).toBe(Math.max(...beside));
    }
  });
});

describe("lesson 6: a 5 V driver tolerates much more", () => {
  it.each(CABLE_KINDS.map((kind) => [kind]))("%s, 10 m: decodes at 33 Ω and at 249 Ω", (cable) => {
    expect(decodes(run({ volts: 5, cable, length: 10, seriesResistance: 33 }))).toBe(true);
    expect(decodes(run({ volts: 5, cable, length: 10, seriesResistance: 249 }))).toBe(true);
  });

  it("three-core, 15 m: 330 Ω decodes on a thin timing margin, 390 Ω loses the 0 bits", () => {
    const thin = run({ volts: 5, cable: "three-core", length: 15, seriesResistance: 330 });
    expect(decodes(thin)).toBe(true);
    expect(thin.metrics.timingMargin!).toBeLessThan(120e-9);
    const slow = run({ volts: 5, cable: "three-core", length: 15, seriesResistance: 390 });
    expect(slow.bits.filter((b) => b.sent === 0).some((b) => b.received === "x")).toBe(true);
    expect(slow.bits.filter((b) => b.sent === 1).every((b) => b.received === "1")).toBe(true);
  });
});

describe("lessons 3 and 5: closed forms the text works with", () => {
  it("lesson 3: a large resistor on a short lead gives the RC rise time 2.2·R·C within 15 %", () => {
    const result = run({ volts: 5, cable: "beside-ground", length: 1.5, seriesResistance: 560 });
    const capacitance = 1.5 * 59.5e-12 + 5e-12;
    expect(result.metrics.riseTime! / (Math.log(9) * 580 * capacitance)).toBeGreaterThan(0.85);
    expect(result.metrics.riseTime! / (Math.log(9) * 580 * capacitance)).toBeLessThan(1.15);
  });

  it("lesson 5: below the clamp, the first far-end arrival is V·(1 − Γs)", () => {
    const result = run({ volts: 3.3, cable: "lone-lead", length: 10, seriesResistance: 250 });
    const z0 = result.line.z0;
    const gamma = (280 - z0) / (280 + z0);
    expect(Math.max(...result.farEnd)).toBeCloseTo(3.3 * (1 - gamma), 1);
  });

  it("lesson 4: up to 2–3 m nearly anything works, even at 3.3 V on a lone lead with 33 Ω", () => {
    expect(decodes(run({ volts: 5, cable: "lone-lead", length: 2, seriesResistance: 33 }))).toBe(true);
  });
});

/** The simulator's default lead-in: the driver's first edge starts here (docs/simulator.md). */
const LEAD_IN = parseSimInput({ cable: { kind: "lone-lead", length: 1 }, signal: { bits: "1" } }).signal.leadIn;

/** One rising edge (bits "10") from one of the course's drivers, sampled every 0.5 ns. */
function edge(options: { driver: typeof buffer5v | typeof controllerPin3v3; cable: CableKind; length: number; seriesResistance: number; inputCapacitance?: number }): SimResult {
  const { highVoltage, outputResistance, edgeTime } = options.driver;
  return simulateRun({
    driver: { highVoltage, outputResistance, edgeTime },
    seriesResistance: options.seriesResistance,
    cable: { kind: options.cable, length: options.length },
    receiver: { supplyVoltage: 5, ...(options.inputCapacitance === undefined ? {} : { inputCapacitance: options.inputCapacitance }) },
    signal: { bits: "10" },
    output: { sampleInterval: 0.5e-9 },
  });
}

/** Far-end voltage at `t` after the middle of the driver's first edge. */
function farAt(result: SimResult, t: number, edgeTime: number): number {
  const at = LEAD_IN + edgeTime / 2 + t;
  const i = result.time.findIndex((x) => x >= at);
  return result.farEnd[i];
}

/** Far-end voltage in the middle of the plateau after arrival n: 2n one-way delays after the edge. */
const plateau = (result: SimResult, n: number, edgeTime: number) => farAt(result, 2 * n * result.line.delay, edgeTime);

/** Lowest far-end voltage inside the first high, after the first arrival has settled onto its plateau. */
function lowestInHigh(result: SimResult, edgeTime: number): number {
  const from = LEAD_IN + edgeTime / 2 + result.line.delay + 10e-9;
  const to = LEAD_IN + 0.8e-6;
  return Math.min(...result.farEnd.filter((_, i) => result.time[i] > from && result.time[i] < to));
}

describe("lesson 5: the fourth case, 3.3 V pin with 100 Ω into 10 m of lone lead", () => {
  const case4 = { driver: controllerPin3v3, cable: "lone-lead" as const, length: 10, seriesResistance: 100 };
  const gammaS = (30 + 100 - cableCatalogue["lone-lead"].z0) / (30 + 100 + cableCatalogue["lone-lead"].z0);
  const edgeTime = controllerPin3v3.edgeTime;

  it("the bounce table's plateaus are the simulator's, and the far end is within 1 % of 3.3 V from the sixth arrival on", () => {
    const result = edge(case4);
    for (let n = 1; n <= 8; n += 1) {
      expect(Math.abs(plateau(result, n, edgeTime) - 3.3 * (1 - gammaS ** n)), `arrival ${n}`).toBeLessThan(0.02);
    }
    expect(Math.abs(plateau(result, 5, edgeTime) - 3.3)).toBeGreaterThan(0.033);
    for (let n = 6; n <= 8; n += 1) expect(Math.abs(plateau(result, n, edgeTime) - 3.3), `arrival ${n}`).toBeLessThan(0.033);
  });

  it("decodes, but the pixel's 5 pF input pulls a dip to about 2.47 V and the verdict warns of it", () => {
    const result = edge(case4);
    expect(result.decoded).toBe("10");
    const lowest = lowestInHigh(result, edgeTime);
    expect(lowest).toBeGreaterThan(2.4);
    expect(lowest).toBeLessThan(2.5);
    expect(result.verdict.reasons.map((r) => r.code)).toContain("mid-supply-dip");
  });

  it("without the input capacitance the lowest point is the 2.60 V plateau, and no dip is reported", () => {
    const result = edge({ ...case4, inputCapacitance: 1e-15 });
    expect(Math.abs(lowestInHigh(result, edgeTime) - 3.3 * (1 - gammaS ** 2))).toBeLessThan(0.02);
    expect(result.verdict.reasons.map((r) => r.code)).not.toContain("mid-supply-dip");
  });

  it("a shorter cable rings as hard: on 5 m the far end still reaches 4.81 V and drops back to 2.60 V", () => {
    const result = edge({ ...case4, length: 5 });
    expect(Math.abs(plateau(result, 1, edgeTime) - 3.3 * (1 - gammaS))).toBeLessThan(0.02);
    expect(Math.abs(plateau(result, 2, edgeTime) - 3.3 * (1 - gammaS ** 2))).toBeLessThan(0.02);
  });
});

describe("lesson 4: lesson 3's short lead (5 V buffer, 330 Ω, 2 m beside ground) as a staircase", () => {
  const beside = cableCatalogue["beside-ground"];
  const gammaS = (20 + 330 - beside.z0) / (20 + 330 + beside.z0);
  const edgeTime = buffer5v.edgeTime;
  const result = edge({ driver: buffer5v, cable: "beside-ground", length: 2, seriesResistance: 330 });

  it("climbs 5 V × (1 − Γs^n), one step per round trip", () => {
    for (let n = 1; n <= 6; n += 1) {
      expect(Math.abs(plateau(result, n, edgeTime) - 5 * (1 - gammaS ** n)), `arrival ${n}`).toBeLessThan(0.02);
    }
  });

  it("has a rise time between the staircase's 8·T_d and lesson 3's 2.2·R·C (with the 5 pF input)", () => {
    const staircase = 8 * 2 * beside.delayPerMetre;
    const rc = Math.log(9) * 350 * (2 * beside.perMetre.capacitance + 5e-12);
    expect(result.metrics.riseTime!).toBeGreaterThan(0.97 * staircase);
    expect(result.metrics.riseTime!).toBeLessThan(1.03 * rc);
  });
});
