/**
 * The "preview" quality redraws a run while a control is dragged: coarser steps, the same
 * picture within 1 % of VDD (compared as docs/simulator.md says, the smallest difference within
 * ±0.5 ns) and the same bits. Grading always uses the default, full accuracy.
 */
import { describe, expect, it } from "vitest";
import { simulateRun, type SimInput } from "@/lib/sim";
import { windowedError } from "@/tests/reference/support/waveform-compare";

const colours: [number, number, number][] = [[255, 96, 0]];
const cases: [string, SimInput][] = [
  ["ringing lone lead, 3.3 V, 33 Ω, 10 m", { driver: { highVoltage: 3.3, outputResistance: 30 }, seriesResistance: 33, cable: { kind: "lone-lead", length: 10 }, signal: { colours } }],
  ["staircase beside ground, 5 V, 249 Ω, 20 m", { seriesResistance: 249, cable: { kind: "beside-ground", length: 20 }, signal: { colours } }],
  ["coax, 5 V, 47 Ω, 30 m", { seriesResistance: 47, cable: { kind: "coax-75", length: 30 }, signal: { colours } }],
  ["three-core, 5 V, 0 Ω, 3 m, 30 pF pin", { cable: { kind: "three-core", length: 3 }, receiver: { inputCapacitance: 30e-12 }, signal: { colours } }],
];

describe("preview quality", () => {
  it.each(cases)("%s: within 1 percent of VDD of the graded run, same bits, at least twice the step", (_, input) => {
    const graded = simulateRun(input, { keepFullResolution: true });
    const preview = simulateRun(input, { keepFullResolution: true, quality: "preview" });
    expect(preview.line.timeStep).toBeGreaterThanOrEqual(1.9 * graded.line.timeStep);
    expect(preview.decoded).toBe(graded.decoded);
    const supply = 5;
    for (const end of ["farEnd", "nearEnd"] as const) {
      const error = windowedError({ time: graded.full!.time, value: graded.full![end] }, { time: preview.full!.time, value: preview.full![end] });
      expect(error.maxError / supply, `${end} at ${error.at} s`).toBeLessThan(0.01);
    }
  });

  it("is not the default: a run without options takes the full-accuracy step (0.1 ns for 3 ns edges)", () => {
    const result = simulateRun(cases[0][1]);
    expect(result.line.timeStep).toBeLessThanOrEqual(1e-10);
    expect(simulateRun(cases[0][1], { quality: "grade" }).line.timeStep).toBe(result.line.timeStep);
  });
});
