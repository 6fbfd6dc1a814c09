/**
 * The solver against ngspice (Debian package, lossless `T` element, 0.1 ns step) on the same circuits,
 * as docs/simulator.md ("Reference tools: what to trust") prescribes: R' = 0 on both sides (the
 * catalogue's L' and C' passed as perMetre), far end within 2 % of VDD with each instant's error the
 * smallest difference within ±0.5 ns, and the decoded bits identical, the ngspice waveform decoded by
 * the independent receiver rule in support/receiver-decode.ts. The clamp current peak, where clamps
 * conduct more than 0.1 mA, agrees within 10 %. Both sides use the same clamp diode law: IS and N of
 * CLAMP_DIODE_MODEL behind the receiver's clampSeriesResistance, ngspice's RS (its default, or the
 * case's own value).
 */
import { describe, expect, it } from "vitest";
import { cableCatalogue, CLAMP_DIODE_MODEL } from "@/lib/sim";
import { runNgspice } from "./support/ngspice-runner";
import { decodeWaveform, outcomeByBruteForce } from "./support/receiver-decode";
import type { CableKind } from "./support/cable-geometry";
import type { DocSimInput } from "./support/reference-circuit";
import { decodeSettingsOf, referenceCircuitOf, runSolver } from "./support/solver-run";
import { windowedError } from "./support/waveform-compare";

interface ComparisonCase {
  kind: CableKind;
  length: number;
  seriesResistance: number;
  driverVolts: 3.3 | 5;
  clamps: boolean;
  bits: string;
  supplyVoltage?: number;
  /** The clamps' series resistance when not the default (Ω). */
  clampSeriesResistance?: number;
}

/** Driver output resistances: 5 V → 20 Ω, 3.3 V → 30 Ω, as in the standard cases of docs/simulator.md. */
const DRIVER_RESISTANCE = { 3.3: 30, 5: 20 };

const CASES: ComparisonCase[] = [
  { kind: "lone-lead", length: 10, seriesResistance: 249, driverVolts: 3.3, clamps: true, bits: "0100110101" },
  { kind: "lone-lead", length: 10, seriesResistance: 33, driverVolts: 3.3, clamps: true, bits: "0100110101" },
  { kind: "lone-lead", length: 1, seriesResistance: 0, driverVolts: 5, clamps: false, bits: "01101001" },
  { kind: "lone-lead", length: 20, seriesResistance: 470, driverVolts: 5, clamps: true, bits: "10010110" },
  { kind: "lone-lead", length: 5, seriesResistance: 100, driverVolts: 5, clamps: false, bits: "00111010" },
  { kind: "beside-ground", length: 10, seriesResistance: 33, driverVolts: 5, clamps: true, bits: "0100110101" },
  { kind: "beside-ground", length: 10, seriesResistance: 249, driverVolts: 3.3, clamps: true, bits: "0100110101" },
  { kind: "beside-ground", length: 20, seriesResistance: 100, driverVolts: 5, clamps: false, bits: "11001010" },
  { kind: "beside-ground", length: 2, seriesResistance: 0, driverVolts: 3.3, clamps: false, bits: "01011001" },
  { kind: "beside-ground", length: 3, seriesResistance: 33, driverVolts: 5, clamps: true, bits: "01101100", supplyVoltage: 3.3 },
  { kind: "twisted-pair", length: 15, seriesResistance: 100, driverVolts: 5, clamps: true, bits: "01100101" },
  { kind: "twisted-pair", length: 5, seriesResistance: 0, driverVolts: 3.3, clamps: true, bits: "10100110" },
  { kind: "twisted-pair", length: 20, seriesResistance: 470, driverVolts: 5, clamps: false, bits: "01011100" },
  { kind: "coax-75", length: 20, seriesResistance: 47, driverVolts: 5, clamps: true, bits: "01100110" },
  { kind: "coax-75", length: 1, seriesResistance: 220, driverVolts: 3.3, clamps: false, bits: "10011010" },
  { kind: "coax-75", length: 8, seriesResistance: 0, driverVolts: 5, clamps: true, bits: "11010010" },
  { kind: "coax-75", length: 8, seriesResistance: 0, driverVolts: 5, clamps: true, bits: "11010010", clampSeriesResistance: 0 },
  { kind: "beside-ground", length: 3, seriesResistance: 33, driverVolts: 5, clamps: true, bits: "01101100", supplyVoltage: 3.3, clampSeriesResistance: 50 },
];

function inputOf(c: ComparisonCase): DocSimInput {
  const { inductance, capacitance } = cableCatalogue[c.kind].perMetre;
  return {
    driver: { highVoltage: c.driverVolts, outputResistance: DRIVER_RESISTANCE[c.driverVolts], edgeTime: 3e-9 },
    seriesResistance: c.seriesResistance,
    cable: { perMetre: { resistance: 0, inductance, capacitance, conductance: 0 }, length: c.length },
    receiver: {
      supplyVoltage: c.supplyVoltage ?? 5,
      inputCapacitance: 5e-12,
      clampDiodes: c.clamps,
      deglitchTime: 10e-9,
      ...(c.clampSeriesResistance === undefined ? {} : { clampSeriesResistance: c.clampSeriesResistance }),
    },
    signal: { bits: c.bits },
  };
}

const peakMagnitude = (values: Float64Array) => values.reduce((peak, v) => Math.max(peak, Math.abs(v)), 0);

const describeCase = (c: ComparisonCase) =>
  `${c.kind}, ${c.length} m, ${c.seriesResistance} Ω, ${c.driverVolts} V driver into a ${c.supplyVoltage ?? 5} V pixel, ` +
  (c.clamps ? `clamped (${c.clampSeriesResistance ?? CLAMP_DIODE_MODEL.seriesResistance} Ω in series)` : "no clamps");

describe("solver against ngspice, lossless T element (docs/simulator.md: within 2 % of VDD, ±0.5 ns)", () => {
  it("covers all four catalogue kinds, 1–20 m, 0–470 Ω, 3.3 V and 5 V drivers, with and without clamps", () => {
    expect(new Set(CASES.map((c) => c.kind)).size).toBe(4);
    expect(Math.min(...CASES.map((c) => c.length))).toBe(1);
    expect(Math.max(...CASES.map((c) => c.length))).toBe(20);
    expect(Math.min(...CASES.map((c) => c.seriesResistance))).toBe(0);
    expect(Math.max(...CASES.map((c) => c.seriesResistance))).toBe(470);
    expect(new Set(CASES.map((c) => `${c.driverVolts}/${c.clamps}`)).size).toBe(4);
    const clampResistances = CASES.filter((c) => c.clamps).map((c) => c.clampSeriesResistance ?? CLAMP_DIODE_MODEL.seriesResistance);
    expect(new Set(clampResistances)).toEqual(new Set([0, CLAMP_DIODE_MODEL.seriesResistance, 50]));
  });

  it("the clamps' series resistance is visible at that tolerance: on 8 m of coax driven hard it moves ngspice's clamped far end by more than 2 % of VDD", async () => {
    const hard = CASES.find((c) => c.kind === "coax-75" && c.length === 8)!;
    const withDefault = referenceCircuitOf(inputOf({ ...hard, clampSeriesResistance: undefined }));
    const without = referenceCircuitOf(inputOf({ ...hard, clampSeriesResistance: 0 }));
    expect(withDefault.diode.seriesResistance).toBe(CLAMP_DIODE_MODEL.seriesResistance);
    const [a, b] = [await runNgspice(withDefault), await runNgspice(without)];
    const moved = windowedError({ time: a.time, value: a.vectors["v(far)"] }, { time: b.time, value: b.vectors["v(far)"] });
    expect(moved.maxError).toBeGreaterThan(0.02 * withDefault.supplyVoltage);
  });

  it.each(CASES.map((c) => [describeCase(c), c] as const))("%s", async (_, c) => {
    const input = inputOf(c);
    const circuit = referenceCircuitOf(input);
    const [spice, solver] = [await runNgspice(circuit), runSolver(input)];
    const vdd = circuit.supplyVoltage;

    const far = windowedError({ time: spice.time, value: spice.vectors["v(far)"] }, { time: solver.time, value: solver.farEnd });
    expect(far.maxError / vdd, `far-end error ${far.maxError.toFixed(4)} V at ${far.at} s`).toBeLessThan(0.02);
    const near = windowedError({ time: spice.time, value: spice.vectors["v(near)"] }, { time: solver.time, value: solver.nearEnd });
    expect(near.maxError / vdd, `near-end error ${near.maxError.toFixed(4)} V at ${near.at} s`).toBeLessThan(0.02);

    const settings = decodeSettingsOf(circuit);
    const spiceFar = { time: spice.time, value: spice.vectors["v(far)"] };
    expect(decodeWaveform({ time: solver.time, value: solver.farEnd }, settings).decoded).toBe(decodeWaveform(spiceFar, settings).decoded);
    // The brute force reads each switching point with 0.1 V of hysteresis standing in for the
    // solver's edge-bump tolerance, so outcomes are compared where both judgements clear by more than half of it.
    const { guaranteed, typical } = solver.result.verdict;
    if (Math.min(Math.abs(guaranteed.voltageMargin), Math.abs(typical.voltageMargin)) > 0.05) {
      expect(solver.result.verdict.outcome).toBe(outcomeByBruteForce(spiceFar, settings, c.bits));
    }

    if (c.clamps) {
      const spiceClampPeak = Math.max(peakMagnitude(spice.vectors["i(vclamphigh)"]), peakMagnitude(spice.vectors["i(vclamplow)"]));
      expect(Math.abs(solver.result.metrics.clampCurrentPeak - spiceClampPeak)).toBeLessThanOrEqual(0.1 * spiceClampPeak + 1e-4);
    }
  });
});
