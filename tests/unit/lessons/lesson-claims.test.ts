/**
 * Statements the lessons make about how runs behave, checked against the simulator that grades
 * the labs (the lessons cite it as their source). Each case names the lesson that makes the claim.
 */
import { describe, expect, it } from "vitest";
import { CABLE_KINDS, cableCatalogue, eSeriesValues, parseSimInput, simulateRun, type CableKind, type SimResult } from "@/lib/sim";
import { numbers as edges } from "@/lessons/03-edges/numbers";
import { numbers as seriesTermination } from "@/lessons/06-series-termination/numbers";
import { PIN_3V3_WINDOW } from "@/lessons/source-window";
import { buffer5v, controllerPin3v3 } from "@/lessons/drivers";
import { sharedNumbers } from "@/lessons/numbers/shared-numbers";

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
const outcome = (result: SimResult) => result.verdict.outcome;
const codes = (result: SimResult) => result.verdict.reasons.map((r) => r.code);
const window3v3 = (z0: number) => ({ from: PIN_3V3_WINDOW.lower * z0 - 30, to: PIN_3V3_WINDOW.upper * z0 - 30 });
const E24 = eSeriesValues("E24", 10, 1000);
/** Meets lesson 6's 3.3 V criterion on the workbench: works on typical pixels with 0.3 V of margin. */
const typicalWithMargin = (result: SimResult) => result.verdict.typical.pass && result.verdict.typical.voltageMargin >= 0.3;

describe("lesson 6: the field rule at 3.3 V into a 5 V pixel, 10 m", () => {
  it("lone lead: about 33 Ω fails, typical pixels misread it (lesson 5's classic failing run)", () => {
    const result = run({ volts: 3.3, cable: "lone-lead", length: 10, seriesResistance: 33 });
    expect(outcome(result)).toBe("fails");
    expect(codes(result).some((c) => c.startsWith("ring-"))).toBe(true);
  });

  it("lone lead: about 250 Ω works on typical pixels with 0.3 V to spare, and is not guaranteed", () => {
    const result = run({ volts: 3.3, cable: "lone-lead", length: 10, seriesResistance: 240 });
    expect(outcome(result)).toBe("typical");
    expect(typicalWithMargin(result)).toBe(true);
  });

  it("beside ground: about 250 Ω fails on typical pixels (the staircase), about 33 Ω works on them", () => {
    expect(outcome(run({ volts: 3.3, cable: "beside-ground", length: 10, seriesResistance: 240 }))).toBe("fails");
    expect(outcome(run({ volts: 3.3, cable: "beside-ground", length: 10, seriesResistance: 33 }))).toBe("typical");
  });

  it("no 3.3 V run into a 5 V pixel is guaranteed, on any cable, with any E24 resistor", () => {
    for (const cable of ["lone-lead", "beside-ground"] as const) {
      for (const seriesResistance of E24.filter((_, i) => i % 4 === 0)) {
        expect(run({ volts: 3.3, cable, length: 10, seriesResistance }).verdict.guaranteed.pass, `${cable} ${seriesResistance} Ω`).toBe(false);
      }
    }
  });

  it.each(CABLE_KINDS.map((kind) => [kind]))("%s: the workbench's window is the arithmetic's within one E24 step at each edge", (cable) => {
    const { from, to } = window3v3(cableCatalogue[cable].z0);
    const passing = E24.filter((r) => typicalWithMargin(run({ volts: 3.3, cable, length: 10, seriesResistance: r })));
    const inside = E24.filter((r) => r >= from && r <= to);
    expect(passing.length).toBeGreaterThan(0);
    const below = E24.filter((r) => r < from);
    const above = E24.filter((r) => r > to);
    // Every passing value lies inside the arithmetic's window or one E24 step beyond an edge.
    for (const r of passing) expect(r >= (below.at(-1) ?? 0) && r <= (above[0] ?? Infinity), `${r} Ω`).toBe(true);
    // The middle of the arithmetic's window passes.
    const middle = inside[Math.floor(inside.length / 2)];
    if (middle !== undefined) expect(passing).toContain(middle);
  });

  it("the workbench's windows the lesson quotes (committed numbers) do not overlap, and the lone lead's holds the field rule's 250 Ω", () => {
    const { simulator, field } = seriesTermination;
    expect(simulator.besideHighest.value).toBeLessThan(simulator.loneLowest.value);
    expect(field.lone.value).toBeGreaterThanOrEqual(simulator.loneLowest.value);
    expect(field.lone.value).toBeLessThanOrEqual(simulator.loneHighest.value);
  });

  it("the lone-lead and beside-ground windows do not overlap", () => {
    const ok = (cable: CableKind, seriesResistance: number) => typicalWithMargin(run({ volts: 3.3, cable, length: 10, seriesResistance }));
    const lone = E24.filter((r) => r >= 100 && ok("lone-lead", r));
    const beside = E24.filter((r) => r <= 100 && ok("beside-ground", r));
    expect(lone.length).toBeGreaterThan(1);
    expect(beside.length).toBeGreaterThan(1);
    expect(Math.max(...beside)).toBeLessThan(Math.min(...lone));
    const { to: besideTo } = window3v3(cableCatalogue["beside-ground"].z0);
    const { from: loneFrom } = window3v3(cableCatalogue["lone-lead"].z0);
    expect(besideTo).toBeLessThan(loneFrom);
  });

  it("up to 2–3 m at 3.3 V, a short lone lead with a small resistor still rings through the typical band, and beside ground with 33 Ω works", () => {
    expect(outcome(run({ volts: 3.3, cable: "lone-lead", length: 2, seriesResistance: 33 }))).toBe("fails");
    expect(outcome(run({ volts: 3.3, cable: "beside-ground", length: 2, seriesResistance: 33 }))).toBe("typical");
  });
});

describe("lesson 6: a 5 V driver tolerates much more", () => {
  const { fiveVolt, run: standardRun } = seriesTermination;
  it.each(CABLE_KINDS.map((kind) => [kind]))(`%s, ${standardRun.length.value} m: works on every pixel that meets its datasheet with ${fiveVolt.low.value} Ω`, (cable) => {
    expect(outcome(run({ volts: 5, cable, length: standardRun.length.value, seriesResistance: fiveVolt.low.value }))).toBe("guaranteed");
  });

  it(`with ${fiveVolt.high.value} Ω the lone lead is still guaranteed, the low-impedance cables only typical, and three-core fails`, () => {
    const at = (cable: CableKind) => outcome(run({ volts: 5, cable, length: standardRun.length.value, seriesResistance: fiveVolt.high.value }));
    expect(at("lone-lead")).toBe("guaranteed");
    for (const cable of ["beside-ground", "twisted-pair", "coax-75"] as const) expect(at(cable), cable).toBe("typical");
    expect(at("three-core")).toBe("fails");
  });

  it("three-core, 15 m: 330 Ω and 390 Ω lose the 0 bits, and the limit lies lower still", () => {
    for (const seriesResistance of [330, 390]) {
      const result = run({ volts: 5, cable: "three-core", length: 15, seriesResistance });
      expect(outcome(result)).toBe("fails");
      expect(result.bits.filter((b) => b.sent === 0).some((b) => b.received !== "0")).toBe(true);
    }
    expect(outcome(run({ volts: 5, cable: "three-core", length: 15, seriesResistance: 270 }))).toBe("fails");
  });
});

describe("lesson 3: the long run in the RC picture", () => {
  const { longRun } = edges;
  const longRunAt = (volts: number) => run({ volts, cable: "beside-ground", length: longRun.length.value, seriesResistance: longRun.series.value });

  it("works on typical pixels at 5 V and is not guaranteed", () => {
    expect(outcome(longRunAt(5))).toBe("typical");
  });

  it("fails from the 3.3 V pin, as lesson 6 shows", () => {
    expect(outcome(longRunAt(3.3))).toBe("fails");
  });
});

describe("lesson 1: the latch gap the lessons quote is the simulator's", () => {
  const latchRun = (latchGap: number) =>
    simulateRun({ cable: { kind: "beside-ground", length: 1 }, receiver: { supplyVoltage: 5 }, signal: { bits: "10", latchGap } });

  it("accepts a low of that length as a latch, and warns of one a microsecond shorter", () => {
    const gap = sharedNumbers.sim.latchGap.value;
    expect(codes(latchRun(gap))).not.toContain("latch-gap-short");
    expect(codes(latchRun(gap - 1e-6))).toContain("latch-gap-short");
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

  it("the 2.60 V plateau breaks the pulse for pixels switching above it: typical pixels misread the run", () => {
    const result = edge(case4);
    expect(result.verdict.outcome).toBe("fails");
    expect(Math.abs(lowestInHigh(edge({ ...case4, inputCapacitance: 1e-15 }), edgeTime) - 3.3 * (1 - gammaS ** 2))).toBeLessThan(0.02);
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
