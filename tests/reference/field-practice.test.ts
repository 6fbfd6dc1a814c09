/**
 * Field practice (common practice of the trade, no published source), as docs/simulator.md states it
 * ("What the physics says about the two classic cases"): on about 10 m a data lead run on its own
 * decodes with about 250 Ω and poorly with about 33 Ω; beside a ground conductor about 250 Ω corrupts
 * and about 33 Ω decodes; up to 2–3 m nearly anything works. Under the receiver's two judgements
 * (docs/simulator.md, "The receiver: two judgements") the physics says: at 10 m and a 3.3 V driver,
 * about 250 Ω on a lone lead and about 33 Ω beside ground work on typical pixels and the crossed
 * pairs fail; with a 5 V driver most of these runs are guaranteed. Each outcome of the solver (with
 * the cable's resistance) is checked against ngspice's waveform on the lossless line, judged
 * independently by brute force over each band of switching points.
 */
import { describe, expect, it } from "vitest";
import { cableCatalogue, type Outcome } from "@/lib/sim";
import { runNgspice, type NgspiceResult } from "./support/ngspice-runner";
import { outcomeByBruteForce } from "./support/receiver-decode";
import type { CableKind } from "./support/cable-geometry";
import type { DocSimInput } from "./support/reference-circuit";
import { decodeSettingsOf, referenceCircuitOf, runSolver } from "./support/solver-run";

const BITS = "0101101011000011";
const VDD = 5;

interface Run {
  kind: CableKind;
  length: number;
  seriesResistance: number;
  driverVolts: 3.3 | 5;
}

function inputOf(run: Run, lossless = false): DocSimInput {
  const perMetre = { ...cableCatalogue[run.kind].perMetre, resistance: 0 };
  return {
    driver: { highVoltage: run.driverVolts, outputResistance: run.driverVolts === 5 ? 20 : 30, edgeTime: 3e-9 },
    seriesResistance: run.seriesResistance,
    cable: lossless ? { perMetre, length: run.length } : { kind: run.kind, length: run.length },
    receiver: { supplyVoltage: VDD, inputCapacitance: 5e-12, clampDiodes: true, deglitchTime: 0 },
    signal: { bits: BITS },
  };
}

/** ngspice's far end judged both ways by brute force, as an outcome in the simulator's terms. */
async function ngspiceOutcome(run: Run): Promise<Outcome> {
  const circuit = referenceCircuitOf(inputOf(run, true));
  const spice: NgspiceResult = await runNgspice(circuit);
  return outcomeByBruteForce({ time: spice.time, value: spice.vectors["v(far)"] }, decodeSettingsOf(circuit), BITS);
}

async function expectOutcome(run: Run, expected: Outcome) {
  expect(runSolver(inputOf(run)).result.verdict.outcome, "the solver").toBe(expected);
  expect(await ngspiceOutcome(run), "ngspice, judged by brute force").toBe(expected);
}

describe("field practice at 10 m, 3.3 V driver (30 Ω) into a 5 V pixel: decisive (common practice of the trade, no published source)", () => {
  it.each([
    ["lone-lead", 249, "typical"],
    ["lone-lead", 33, "fails"],
    ["beside-ground", 249, "fails"],
    ["beside-ground", 47, "typical"],
  ] as const)("%s, %s Ω: %s", async (kind, seriesResistance, expected) => {
    await expectOutcome({ kind, length: 10, seriesResistance, driverVolts: 3.3 }, expected);
  });

  it("an input filter set on the classic failing run (lone lead, 33 Ω) does not turn it into a pass", () => {
    const run: Run = { kind: "lone-lead", length: 10, seriesResistance: 33, driverVolts: 3.3 };
    const input = inputOf(run);
    const filtered = runSolver({ ...input, receiver: { ...input.receiver, deglitchTime: 10e-9 } }).result;
    expect(filtered.verdict.outcome).toBe("fails");
  });
});

describe("field practice at 2 m (common practice of the trade, no published source)", () => {
  it.each([
    ["lone-lead", 33],
    ["lone-lead", 249],
    ["beside-ground", 33],
    ["beside-ground", 249],
    ["twisted-pair", 249],
    ["coax-75", 249],
  ] as const)("5 V driver, %s, %s Ω: guaranteed", async (kind, seriesResistance) => {
    await expectOutcome({ kind, length: 2, seriesResistance, driverVolts: 5 }, "guaranteed");
  });

  it("3.3 V driver, lone lead at 249 Ω and beside ground at 47 Ω: typical, never guaranteed (the driver settles below 3.5 V)", async () => {
    await expectOutcome({ kind: "lone-lead", length: 2, seriesResistance: 249, driverVolts: 3.3 }, "typical");
    await expectOutcome({ kind: "beside-ground", length: 2, seriesResistance: 47, driverVolts: 3.3 }, "typical");
  });
});

describe("with a 5 V driver (20 Ω) the 10 m pattern is mostly absent: the band is crossed on the staircase, only later (docs/simulator.md)", () => {
  it.each(
    (["lone-lead", "beside-ground"] as const).flatMap((kind) => [33, 47, 100].map((rs) => [kind, rs] as const)),
  )("%s, %s Ω: guaranteed", async (kind, seriesResistance) => {
    await expectOutcome({ kind, length: 10, seriesResistance, driverVolts: 5 }, "guaranteed");
  });

  it("beside ground, 249 Ω: the slow staircase costs the guarantee; typical pixels still read it", async () => {
    await expectOutcome({ kind: "beside-ground", length: 10, seriesResistance: 249, driverVolts: 5 }, "typical");
  });
});
