/**
 * Benchmark of the run planner's resistor sweep (issue 14, point 6): 49 E24 values from 10 Ω to
 * 1 kΩ on a 20 m lone lead from a 3.3 V controller pin into a 5 V pixel, 96 bits (four pixels'
 * colours), a run that rings throughout at the low values. Printed, all measured in this process:
 *
 * - the sweep (sweepSeriesResistance) against today's solver on the same values (simulateRun per
 *   value, what a page would call without the sweep), and against ngspice (lossless T element,
 *   0.1 ns step, on the lossless line: its transient analysis time for a spread of the values,
 *   scaled to the 49);
 * - one ringing run (33 Ω) the same three ways;
 * - how far the sweep's margins lie from full-accuracy runs, as a share of VDD.
 * Wall times and CPU times are medians; the load average is printed beside them. Targets are
 * printed as met or not met; nothing here fails a build.
 */
import { cableCatalogue, eSeriesValues, simulateRun, sweepSeriesResistance, type SimInput } from "@/lib/sim";
import { SWEEP_REPLAY_TOLERANCE } from "@/lib/sim/sweep";
import { timeNgspice } from "@/tests/reference/support/ngspice-runner";
import { referenceCircuitOf } from "@/tests/reference/support/solver-run";
import type { DocSimInput } from "@/tests/reference/support/reference-circuit";
import { cpuTimeOf, loadNote, median, table, verdict } from "./bench-sim-support";

const TARGETS = { sweepMs: 300, accuracyShareOfVdd: 0.01 };
const VALUES = eSeriesValues("E24", 10, 1000);
const COLOURS: [number, number, number][] = [
  [255, 96, 0],
  [18, 52, 86],
  [0, 200, 120],
  [171, 205, 239],
];
const RINGING_VALUE = 33;
const REPEATS = Number(process.env.PLANNER_REPEATS ?? 3);
/** ngspice takes seconds a run: timed on every NGSPICE_STRIDE-th value and scaled to all of them. */
const NGSPICE_STRIDE = Number(process.env.PLANNER_NGSPICE_STRIDE ?? 8);

function runInput(lossless: boolean): DocSimInput {
  const perMetre = cableCatalogue["lone-lead"].perMetre;
  return {
    driver: { highVoltage: 3.3, outputResistance: 30, edgeTime: 4e-9 },
    seriesResistance: 0,
    cable: lossless ? { perMetre: { ...perMetre, resistance: 0 }, length: 20 } : { kind: "lone-lead", length: 20 },
    receiver: { supplyVoltage: 5, inputCapacitance: 5e-12, clampDiodes: true, deglitchTime: 0 },
    signal: { colours: COLOURS, byteOrder: "GRB" },
  };
}

function timed(work: () => unknown): { wallMs: number; cpuMs: number } {
  work();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < REPEATS; i++) {
    const t0 = performance.now();
    cpu.push(cpuTimeOf(work));
    wall.push(performance.now() - t0);
  }
  return { wallMs: median(wall), cpuMs: median(cpu) };
}

const ms = (x: number) => x.toFixed(x < 10 ? 2 : 0);
const ratio = (a: number, b: number) => `${(a / b).toFixed(2)}×`;
const speedup = (ours: number, theirs: number) => `${Math.round(theirs / ours)}× faster`;

async function main() {
  console.log(`run planner benchmark: Node ${process.version}, one thread; ${VALUES.length} E24 values 10 Ω–1 kΩ, 20 m lone lead, 3.3 V pin → 5 V pixel, 96 bits`);
  console.log(`at start: ${loadNote()}\n`);
  const input = runInput(false) as SimInput;

  const sweep = timed(() => sweepSeriesResistance(input, VALUES));
  const today = timed(() => VALUES.map((r) => simulateRun({ ...input, seriesResistance: r })));
  const single = timed(() => sweepSeriesResistance(input, [RINGING_VALUE]));
  const singleToday = timed(() => simulateRun({ ...input, seriesResistance: RINGING_VALUE }));

  const sampled = VALUES.filter((_, i) => i % NGSPICE_STRIDE === 0);
  const spiceMs: number[] = [];
  for (const r of sampled) spiceMs.push((await timeNgspice(referenceCircuitOf({ ...runInput(true), seriesResistance: r }))).analysisSeconds * 1e3);
  const spiceSweepMs = (spiceMs.reduce((a, b) => a + b, 0) / spiceMs.length) * VALUES.length;
  const spiceSingleMs = (await timeNgspice(referenceCircuitOf({ ...runInput(true), seriesResistance: RINGING_VALUE }))).analysisSeconds * 1e3;

  console.log(
    table(
      ["", "wall ms", "CPU ms", "today's solver: wall ms", "CPU ms", "ours / today (CPU)", "ngspice ms", "vs ngspice (CPU)"],
      [
        ["sweep, 49 values", ms(sweep.wallMs), ms(sweep.cpuMs), ms(today.wallMs), ms(today.cpuMs), ratio(sweep.cpuMs, today.cpuMs), `${ms(spiceSweepMs)} (est.)`, speedup(sweep.cpuMs, spiceSweepMs)],
        [`one run, ${RINGING_VALUE} Ω`, ms(single.wallMs), ms(single.cpuMs), ms(singleToday.wallMs), ms(singleToday.cpuMs), ratio(single.cpuMs, singleToday.cpuMs), ms(spiceSingleMs), speedup(single.cpuMs, spiceSingleMs)],
      ],
    ),
  );
  console.log(`ngspice: transient analysis time of ${sampled.length} of the values (every ${NGSPICE_STRIDE}th), mean × ${VALUES.length}; the lossless line it solves`);

  const points = sweepSeriesResistance(input, VALUES);
  const copied = VALUES.map((r) => simulateRun({ ...input, seriesResistance: r }, { bitReplayTolerance: SWEEP_REPLAY_TOLERANCE }).line.copiedBits);
  console.log(`bits copied by bit replays: ${copied.reduce((a, b) => a + b, 0)} of ${VALUES.length * 96} (${copied.filter((c) => c > 0).length} of ${VALUES.length} values copy some)`);
  let worst = 0;
  for (const point of points) {
    const { verdict: full } = simulateRun({ ...input, seriesResistance: point.resistance });
    worst = Math.max(worst, Math.abs(point.guaranteed.voltageMargin - full.guaranteed.voltageMargin), Math.abs(point.typical.voltageMargin - full.typical.voltageMargin));
  }
  const vdd = 5;
  console.log(`\nat end: ${loadNote()}`);
  console.log("\ntargets (issue 14, point 6; benchmark figures, not tests):");
  console.log(`  sweep under ${TARGETS.sweepMs} ms: ${ms(sweep.wallMs)} ms wall, ${ms(sweep.cpuMs)} ms CPU — ${verdict(sweep.cpuMs < TARGETS.sweepMs)} (CPU time, nearer a free core's wall time)`);
  console.log(`  margins within 1 % of VDD of full-accuracy runs: worst ${((worst / vdd) * 100).toFixed(3)} % — ${verdict(worst / vdd <= TARGETS.accuracyShareOfVdd)}`);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
