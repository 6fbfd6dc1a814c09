/**
 * The solver against closed forms of standard transmission-line textbooks: the bounce (lattice)
 * diagram of a lossless line with a resistive source and an open end, reflection coefficients
 * ρ = (ZL − Z0)/(ZL + Z0), the RC rise of an electrically short line (10–90 % = ln 9·R·C ≈ 2.2·R·C)
 * and the delay length·sqrt(L'C').
 */
import { describe, expect, it } from "vitest";
import { launchedStep, openEndNearLevels, openEndStaircase, rcRiseTime, reflectionCoefficient } from "./support/bounce-diagram";
import type { DocSimInput } from "./support/reference-circuit";
import { runSolver } from "./support/solver-run";

const LOSSLESS_100_OHM = { resistance: 0, inductance: 5e-7, capacitance: 5e-11, conductance: 0 };
const Z0 = 100;
const DELAY_PER_METRE = 5e-9;
const EDGE = 3e-9;

/** One long 1 bit: a step that holds for 8 µs. */
function stepInput(sourceResistance: number, length: number, inputCapacitance = 0): DocSimInput {
  return {
    driver: { highVoltage: 5, outputResistance: 0, edgeTime: EDGE },
    seriesResistance: sourceResistance,
    cable: { perMetre: LOSSLESS_100_OHM, length },
    receiver: { supplyVoltage: 5, inputCapacitance, clampDiodes: false, deglitchTime: 10e-9 },
    signal: { bits: "1", bitPeriod: 10e-6, zeroHigh: 1e-6, oneHigh: 8e-6, leadIn: 1e-6 },
  };
}

function valueAt(time: Float64Array, value: Float64Array, t: number): number {
  let lo = 0;
  let hi = time.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (time[mid] <= t) lo = mid;
    else hi = mid;
  }
  return value[lo] + ((t - time[lo]) / (time[hi] - time[lo])) * (value[hi] - value[lo]);
}

function firstCrossing(time: Float64Array, value: Float64Array, level: number, after: number): number {
  for (let i = 1; i < time.length; i++) {
    if (time[i] > after && value[i - 1] < level && value[i] >= level) {
      return time[i - 1] + ((level - value[i - 1]) / (value[i] - value[i - 1])) * (time[i] - time[i - 1]);
    }
  }
  return Number.NaN;
}

describe("reflection coefficient ρ = (ZL − Z0)/(ZL + Z0) (textbook definition)", () => {
  it("gives 1 open, −1 shorted, 0 matched, and docs/simulator.md's −0.75 for 50 Ω on a 350 Ω lead", () => {
    expect(reflectionCoefficient(Infinity, 100)).toBe(1);
    expect(reflectionCoefficient(0, 100)).toBe(-1);
    expect(reflectionCoefficient(100, 100)).toBe(0);
    expect(reflectionCoefficient(50, 350)).toBeCloseTo(-0.75, 12);
  });
});

describe("bounce diagram of a lossless 100 Ω line, 20 m (TD = 100 ns), open end (textbook lattice diagram)", () => {
  const length = 20;
  const td = length * DELAY_PER_METRE;
  const leadIn = 1e-6;

  it.each([
    ["source above Z0: staircase, ρS = +0.5", 300],
    ["source below Z0: ringing, ρS = −0.6", 25],
    ["matched source: one clean step, ρS = 0", 100],
  ])("%s", (_, rs) => {
    const run = runSolver(stepInput(rs, length));
    const far = openEndStaircase(5, rs, Z0, 6);
    far.forEach((level, k) => {
      const middle = leadIn + (2 * k + 2) * td + EDGE / 2;
      expect(Math.abs(valueAt(run.time, run.farEnd, middle) - level), `far-end plateau ${k}`).toBeLessThan(2e-3);
    });
    const near = openEndNearLevels(5, rs, Z0, 6);
    near.forEach((level, j) => {
      const middle = leadIn + (2 * j + 1) * td + EDGE / 2;
      expect(Math.abs(valueAt(run.time, run.nearEnd, middle) - level), `near-end plateau ${j}`).toBeLessThan(2e-3);
    });
    // Successive far-end increments shrink by ρS·ρL, with ρL = 1 at an open end.
    const increments = far.map((level, k) => level - (k === 0 ? 0 : far[k - 1]));
    const measured = [1, 2].map((k) => {
      const at = (n: number) => valueAt(run.time, run.farEnd, leadIn + (2 * n + 2) * td + EDGE / 2);
      return (at(k) - at(k - 1)) / (k === 1 ? at(0) : at(k - 1) - at(k - 2));
    });
    if (rs !== Z0) measured.forEach((ratio) => expect(ratio).toBeCloseTo(reflectionCoefficient(rs, Z0), 2));
    expect(increments[0]).toBeCloseTo(2 * launchedStep(5, rs, Z0), 12);
  });

  it("nothing reaches the far end before one delay: it stays at 0 V until leadIn + TD", () => {
    const run = runSolver(stepInput(100, length));
    for (let i = 0; i < run.time.length && run.time[i] < leadIn + td; i++) expect(Math.abs(run.farEnd[i])).toBeLessThan(1e-6);
    expect(run.result.line.delay).toBeCloseTo(length * Math.sqrt(5e-7 * 5e-11), 15);
  });

  it("the far end's 50 % point trails the near end's by length·sqrt(L'C') (matched source, 5 pF pin)", () => {
    const run = runSolver(stepInput(100, length, 5e-12));
    const nearHalf = firstCrossing(run.time, run.nearEnd, 1.25, 0);
    const farHalf = firstCrossing(run.time, run.farEnd, 2.5, 0);
    // A 5 pF pin on 100 Ω adds a first-order lag of Z0·Cin/2·ln 2 … Z0·Cin·ln 2 at most (0.35 ns).
    expect(Math.abs(farHalf - nearHalf - td)).toBeLessThan(0.5e-9);
  });
});

describe("RC rise of an electrically short line (10–90 % = ln 9·R·C ≈ 2.2·R·C)", () => {
  it.each([
    ["0.3 m of beside-ground-like line, 1 kΩ", 0.3, 1000, 5e-12],
    ["no cable at all, 470 Ω into 47 pF", 0, 470, 47e-12],
  ])("%s", (_, length, rs, cin) => {
    const input: DocSimInput = {
      driver: { highVoltage: 5, outputResistance: 20, edgeTime: EDGE },
      seriesResistance: rs,
      cable: { perMetre: { resistance: 0, inductance: 5.23e-7, capacitance: 5.95e-11, conductance: 0 }, length },
      receiver: { supplyVoltage: 5, inputCapacitance: cin, clampDiodes: false, deglitchTime: 10e-9 },
      signal: { bits: "1" },
    };
    const run = runSolver(input);
    const expected = rcRiseTime(20 + rs, cin + 5.95e-11 * length);
    const rise = firstCrossing(run.time, run.farEnd, 4.5, 0) - firstCrossing(run.time, run.farEnd, 0.5, 0);
    // Electrically short: the rise lasts more than ten round trips of the line.
    expect(expected).toBeGreaterThan(10 * 2 * length * Math.sqrt(5.23e-7 * 5.95e-11));
    expect(Math.abs(rise - expected) / expected).toBeLessThan(0.03);
    expect(Math.abs((run.result.metrics.riseTime ?? Number.NaN) - expected) / expected).toBeLessThan(0.03);
  });
});
