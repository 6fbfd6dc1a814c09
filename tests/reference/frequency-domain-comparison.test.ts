/**
 * The solver against the exact frequency-domain solution of lossy linear runs (no clamps), as
 * docs/simulator.md ("Reference tools: what to trust") prescribes for loss: line ABCD matrix with
 * γ = sqrt((R' + jωL')(G' + jωC')), source resistance and load Cin, applied to the Fourier series of
 * the pulse train (support/frequency-domain.ts, own radix-2 FFT). Far end within 1 % of VDD, each
 * instant's error the smallest difference within ±0.5 ns.
 */
import { describe, expect, it } from "vitest";
import { cableCatalogue } from "@/lib/sim";
import { solveInFrequencyDomain } from "./support/frequency-domain";
import type { DocSimInput } from "./support/reference-circuit";
import { referenceCircuitOf, runSolver } from "./support/solver-run";
import { windowedError } from "./support/waveform-compare";

type PerMetre = { resistance: number; inductance: number; capacitance: number; conductance: number };

interface LossyCase {
  name: string;
  perMetre: PerMetre;
  length: number;
  seriesResistance: number;
  driverVolts: 3.3 | 5;
  bits: string;
}

const catalogue = (kind: keyof typeof cableCatalogue): PerMetre => ({ ...cableCatalogue[kind].perMetre });

const CASES: LossyCase[] = [
  { name: "twisted-pair, 60 m (R'·l ≈ 10 Ω)", perMetre: catalogue("twisted-pair"), length: 60, seriesResistance: 47, driverVolts: 5, bits: "0110" },
  { name: "twisted-pair, 30 m", perMetre: catalogue("twisted-pair"), length: 30, seriesResistance: 100, driverVolts: 5, bits: "010110" },
  { name: "beside-ground, 10 m", perMetre: catalogue("beside-ground"), length: 10, seriesResistance: 33, driverVolts: 5, bits: "010110" },
  { name: "lone-lead, 20 m, ringing", perMetre: catalogue("lone-lead"), length: 20, seriesResistance: 33, driverVolts: 3.3, bits: "0110" },
  { name: "coax-75, 30 m", perMetre: catalogue("coax-75"), length: 30, seriesResistance: 47, driverVolts: 5, bits: "0110" },
  { name: "three-core, 15 m", perMetre: catalogue("three-core"), length: 15, seriesResistance: 249, driverVolts: 5, bits: "0110" },
  {
    name: "given constants with shunt conductance, 25 m",
    perMetre: { resistance: 0.2, inductance: 5e-7, capacitance: 6e-11, conductance: 2e-4 },
    length: 25,
    seriesResistance: 68,
    driverVolts: 5,
    bits: "0110",
  },
];

function inputOf(c: LossyCase): DocSimInput {
  return {
    driver: { highVoltage: c.driverVolts, outputResistance: c.driverVolts === 5 ? 20 : 30, edgeTime: 3e-9 },
    seriesResistance: c.seriesResistance,
    cable: { perMetre: c.perMetre, length: c.length },
    receiver: { supplyVoltage: 5, inputCapacitance: 5e-12, clampDiodes: false, deglitchTime: 10e-9 },
    signal: { bits: c.bits },
  };
}

describe("solver against the exact frequency-domain solution of lossy linear runs (within 1 % of VDD)", () => {
  it.each(CASES.map((c) => [c.name, c] as const))("%s", (_, c) => {
    const input = inputOf(c);
    const circuit = referenceCircuitOf(input);
    const exact = solveInFrequencyDomain(circuit);
    expect(exact.quietBeforeLeadIn, "the quiet tail lets the circuit come to rest").toBeLessThan(1e-3);
    const solver = runSolver(input);
    const far = windowedError({ time: exact.time, value: exact.farEnd }, { time: solver.time, value: solver.farEnd });
    expect(far.maxError / circuit.supplyVoltage, `far-end error ${far.maxError.toFixed(4)} V at ${far.at} s`).toBeLessThan(0.01);
    const near = windowedError({ time: exact.time, value: exact.nearEnd }, { time: solver.time, value: solver.nearEnd });
    expect(near.maxError / circuit.supplyVoltage, `near-end error ${near.maxError.toFixed(4)} V at ${near.at} s`).toBeLessThan(0.01);
  });

  it("the loss is visible at that tolerance: on 60 m of twisted pair R' moves the far end by more than 2 % of VDD", () => {
    const lossy = referenceCircuitOf(inputOf(CASES[0]));
    const lossless = { ...lossy, line: { ...lossy.line, resistance: 0 } };
    const [a, b] = [solveInFrequencyDomain(lossy), solveInFrequencyDomain(lossless)];
    expect(windowedError({ time: a.time, value: a.farEnd }, { time: b.time, value: b.farEnd }).maxError).toBeGreaterThan(0.02 * 5);
  });
});
