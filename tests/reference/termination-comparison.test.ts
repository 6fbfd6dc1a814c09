/**
 * Far-end terminations (lib/sim/termination.ts) against ngspice (Debian package), with the harness
 * and tolerances of ngspice-comparison.test.ts: the lossless `T` element (R' = 0 on both sides),
 * the same clamp diode law, far and near end within 2 % of VDD with each instant's error the
 * smallest difference within ±0.5 ns (docs/simulator.md, "Reference tools: what to trust"), and
 * the same decoded bits. The terminations are plain elements in the netlist: `R` to ground for
 * parallel, `R` to a DC source at the pixel's supply and `R` to ground for Thevenin, `R` then `C`
 * to ground for RC. Each case's termination moves ngspice's own far end by more than 5 % of VDD
 * against the same run unterminated, so the comparison sees it.
 */
import { describe, expect, it } from "vitest";
import { cableCatalogue } from "@/lib/sim";
import { runNgspice } from "./support/ngspice-runner";
import { decodeWaveform } from "./support/receiver-decode";
import type { CableKind } from "./support/cable-geometry";
import type { DocSimInput, ReferenceTermination } from "./support/reference-circuit";
import { decodeSettingsOf, referenceCircuitOf, runSolver } from "./support/solver-run";
import { windowedError } from "./support/waveform-compare";

interface TerminationCase {
  kind: CableKind;
  length: number;
  seriesResistance: number;
  driverVolts: 3.3 | 5;
  termination: ReferenceTermination;
  bits: string;
}

/** Driver output resistances as in the standard cases of docs/simulator.md: 5 V → 20 Ω, 3.3 V → 30 Ω. */
const DRIVER_RESISTANCE = { 3.3: 30, 5: 20 };

const CASES: TerminationCase[] = [
  { kind: "twisted-pair", length: 20, seriesResistance: 0, driverVolts: 5, termination: { kind: "parallel", resistance: 100 }, bits: "01100101" },
  { kind: "lone-lead", length: 10, seriesResistance: 33, driverVolts: 3.3, termination: { kind: "parallel", resistance: 330 }, bits: "0100110101" },
  { kind: "beside-ground", length: 10, seriesResistance: 33, driverVolts: 5, termination: { kind: "thevenin", toSupply: 150, toGround: 220 }, bits: "0100110101" },
  { kind: "coax-75", length: 8, seriesResistance: 0, driverVolts: 5, termination: { kind: "thevenin", toSupply: 220, toGround: 220 }, bits: "11010010" },
  { kind: "twisted-pair", length: 15, seriesResistance: 33, driverVolts: 5, termination: { kind: "rc", resistance: 100, capacitance: 1e-9 }, bits: "01100101" },
  { kind: "lone-lead", length: 10, seriesResistance: 0, driverVolts: 3.3, termination: { kind: "rc", resistance: 330, capacitance: 220e-12 }, bits: "10100110" },
];

/** The case's input, or with `terminated` false the same run without its termination. */
function inputOf(c: TerminationCase, terminated = true): DocSimInput {
  const { inductance, capacitance } = cableCatalogue[c.kind].perMetre;
  return {
    driver: { highVoltage: c.driverVolts, outputResistance: DRIVER_RESISTANCE[c.driverVolts], edgeTime: 3e-9 },
    seriesResistance: c.seriesResistance,
    cable: { perMetre: { resistance: 0, inductance, capacitance, conductance: 0 }, length: c.length },
    receiver: { supplyVoltage: 5, inputCapacitance: 5e-12, clampDiodes: true, deglitchTime: 10e-9 },
    ...(terminated ? { termination: c.termination } : {}),
    signal: { bits: c.bits },
  };
}

const describeCase = (c: TerminationCase) =>
  `${c.termination.kind} ${JSON.stringify(c.termination).replace(/"kind":"\w+",?/, "")}: ${c.kind}, ${c.length} m, ${c.seriesResistance} Ω, ${c.driverVolts} V driver`;

describe("far-end terminations against ngspice (within 2 % of VDD, ±0.5 ns)", () => {
  it("covers each termination twice", () => {
    const kinds = CASES.map((c) => c.termination.kind);
    for (const kind of ["parallel", "thevenin", "rc"]) expect(kinds.filter((k) => k === kind)).toHaveLength(2);
  });

  it.each(CASES.map((c) => [describeCase(c), c] as const))("%s", async (_, c) => {
    const input = inputOf(c);
    const circuit = referenceCircuitOf(input);
    expect(circuit.termination).toEqual(c.termination);
    const [spice, bare, solver] = [await runNgspice(circuit), await runNgspice(referenceCircuitOf(inputOf(c, false))), runSolver(input)];
    const vdd = circuit.supplyVoltage;
    const spiceFar = { time: spice.time, value: spice.vectors["v(far)"] };

    const moved = windowedError(spiceFar, { time: bare.time, value: bare.vectors["v(far)"] });
    expect(moved.maxError / vdd, "the termination changes ngspice's far end").toBeGreaterThan(0.05);

    const far = windowedError(spiceFar, { time: solver.time, value: solver.farEnd });
    expect(far.maxError / vdd, `far-end error ${far.maxError.toFixed(4)} V at ${far.at} s`).toBeLessThan(0.02);
    const near = windowedError({ time: spice.time, value: spice.vectors["v(near)"] }, { time: solver.time, value: solver.nearEnd });
    expect(near.maxError / vdd, `near-end error ${near.maxError.toFixed(4)} V at ${near.at} s`).toBeLessThan(0.02);

    const settings = decodeSettingsOf(circuit);
    expect(decodeWaveform({ time: solver.time, value: solver.farEnd }, settings).decoded).toBe(decodeWaveform(spiceFar, settings).decoded);
  });
});
