/**
 * Runs split by a regenerating pixel (lib/sim/split-run.ts) against ngspice (Debian package): each
 * segment is its own circuit (the controller's driver, or the pixel's output stage re-driving the
 * data, a lossless `T` line, the next pixel's pin with its clamps), run in ngspice with the harness
 * of ngspice-comparison.test.ts. Each segment's far end agrees within 2 % of VDD (±0.5 ns), and the
 * split run's outcome is the worse of the two segments' outcomes as the independent brute-force
 * judgement (support/receiver-decode.ts) reads them from ngspice's waveforms, naming that segment.
 * The cases are chosen with every judgement clear of the brute force's 0.05 V resolution.
 */
import { describe, expect, it } from "vitest";
import { cableCatalogue, OUTCOMES } from "@/lib/sim";
import { simulateSplitRun } from "@/lib/sim/split-run";
import { runNgspice } from "./support/ngspice-runner";
import { outcomeByBruteForce } from "./support/receiver-decode";
import type { CableKind } from "./support/cable-geometry";
import type { DocSimInput } from "./support/reference-circuit";
import { decodeSettingsOf, referenceCircuitOf } from "./support/solver-run";
import { windowedError } from "./support/waveform-compare";

type Segment = { kind: CableKind; length: number; driverVolts: number; driverResistance: number; seriesResistance: number };

/** The pixel's own output stage re-driving the data: 5 V behind 50 Ω, an assumption (pixel datasheets state no output resistance). */
const PIXEL_STAGE = { driverVolts: 5, driverResistance: 50 };
const CONTROLLER = { driverVolts: 3.3, driverResistance: 30 };

const CASES: { name: string; bits: string; segments: [Segment, Segment] }[] = [
  {
    name: "a 5 V buffer's clean first segment, then 20 m the pixel drives through too much resistance",
    bits: "0100110101",
    segments: [
      { kind: "twisted-pair", length: 10, seriesResistance: 47, driverVolts: 5, driverResistance: 20 },
      { kind: "beside-ground", length: 20, seriesResistance: 680, ...PIXEL_STAGE },
    ],
  },
  {
    name: "a 3.3 V controller short of the 5 V pixel's guaranteed high, then a clean segment",
    bits: "01101001",
    segments: [
      { kind: "twisted-pair", length: 10, seriesResistance: 68, ...CONTROLLER },
      { kind: "twisted-pair", length: 10, seriesResistance: 47, ...PIXEL_STAGE },
    ],
  },
  {
    name: "a ringing first segment, then a short one",
    bits: "10010110",
    segments: [
      { kind: "lone-lead", length: 12, seriesResistance: 0, ...CONTROLLER },
      { kind: "beside-ground", length: 2, seriesResistance: 33, ...PIXEL_STAGE },
    ],
  },
];

function segmentInput(s: Segment) {
  const { inductance, capacitance } = cableCatalogue[s.kind].perMetre;
  return {
    driver: { highVoltage: s.driverVolts, outputResistance: s.driverResistance, edgeTime: 3e-9 },
    seriesResistance: s.seriesResistance,
    cable: { perMetre: { resistance: 0, inductance, capacitance, conductance: 0 }, length: s.length },
    receiver: { supplyVoltage: 5, inputCapacitance: 5e-12, clampDiodes: true, deglitchTime: 0 },
  };
}

describe("runs split by a regenerating pixel against ngspice, segment by segment", () => {
  it.each(CASES.map((c) => [c.name, c] as const))("%s", async (_, c) => {
    const split = simulateSplitRun({ signal: { bits: c.bits }, segments: c.segments.map(segmentInput) }, { keepFullResolution: true });
    const spiceOutcomes: string[] = [];
    let clear = true;
    for (const [i, segment] of c.segments.entries()) {
      const input: DocSimInput = { ...segmentInput(segment), signal: { bits: c.bits } };
      const circuit = referenceCircuitOf(input);
      const spice = await runNgspice(circuit);
      const solver = split.segments[i];
      const spiceFar = { time: spice.time, value: spice.vectors["v(far)"] };
      const far = windowedError(spiceFar, { time: solver.full!.time, value: solver.full!.farEnd });
      expect(far.maxError / circuit.supplyVoltage, `segment ${i + 1}: far-end error ${far.maxError.toFixed(4)} V at ${far.at} s`).toBeLessThan(0.02);
      spiceOutcomes.push(outcomeByBruteForce(spiceFar, decodeSettingsOf(circuit), c.bits));
      const { guaranteed, typical } = solver.verdict;
      clear &&= Math.min(Math.abs(guaranteed.voltageMargin), Math.abs(typical.voltageMargin)) > 0.05;
    }
    const worst = spiceOutcomes.reduce((a, b) => (OUTCOMES.indexOf(b as never) > OUTCOMES.indexOf(a as never) ? b : a));
    expect(clear, "the cases are chosen with every judgement clear of the brute force's resolution").toBe(true);
    expect(split.verdict.outcome).toBe(worst);
    if (worst !== "guaranteed") expect(split.verdict.decidingStage).toMatch(`segment ${spiceOutcomes.indexOf(worst) + 1} `);
    expect(split.verdict.outcome).toBe(split.segments.map((s) => s.verdict.outcome).reduce((a, b) => (OUTCOMES.indexOf(b) > OUTCOMES.indexOf(a) ? b : a)));
  });
});
