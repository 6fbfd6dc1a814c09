/**
 * Benchmark of the line simulator on the standard cases of docs/simulator.md, against ngspice
 * (lossless T element, 0.1 ns step) measured in the same run on the same circuits.
 *
 * Per case: the solver's median time on the lossless line (the circuit ngspice solves) and on the
 * catalogue cable with its resistance (what a lab runs); ngspice's own transient analysis time and
 * the wall time of its process; their ratio; the median time of a full grade (JSON text in,
 * validation, simulation, decoding, metrics, verdict, JSON text out); and the largest far-end
 * difference from ngspice (smallest difference within ±0.5 ns, docs/simulator.md).
 * Targets are printed as met or not met; nothing here fails a build.
 */
import { parseSimInput, simulateRun } from "@/lib/sim";
import { runNgspice, timeNgspice } from "@/tests/reference/support/ngspice-runner";
import { decodeWaveform } from "@/tests/reference/support/receiver-decode";
import { decodeSettingsOf, referenceCircuitOf } from "@/tests/reference/support/solver-run";
import { windowedError } from "@/tests/reference/support/waveform-compare";
import { inputOf, loadNote, median, medianTime, STANDARD_CASES, table, verdict, type StandardCase } from "./bench-sim-support";

const TARGETS = { tenMetreMedianMs: 5, speedup: 200, gradeMs: 10 };
const NGSPICE_TIMED_RUNS = 1;

function grade(json: string): string {
  const result = simulateRun(parseSimInput(JSON.parse(json)));
  return JSON.stringify(result);
}

interface Row {
  name: string;
  bits: number;
  timeStepNs: number;
  losslessMs: number;
  catalogueMs: number;
  gradeMs: number;
  ngspiceAnalysisMs: number;
  ngspiceWallMs: number;
  speedup: number;
  maxErrorMv: number;
  errorPercentVdd: number;
  decodedMatch: boolean;
  isTenMetreFull: boolean;
}

async function benchCase(c: StandardCase): Promise<Row> {
  const lossless = inputOf(c, true);
  const catalogue = inputOf(c, false);
  const losslessMs = medianTime(() => simulateRun(lossless));
  const catalogueMs = medianTime(() => simulateRun(catalogue));
  const json = JSON.stringify(catalogue);
  const gradeMs = medianTime(() => grade(json));

  const circuit = referenceCircuitOf(lossless);
  const timed: { analysisSeconds: number; wallMilliseconds: number }[] = [];
  for (let i = 0; i < NGSPICE_TIMED_RUNS; i++) timed.push(await timeNgspice(circuit));
  const spice = await runNgspice(circuit);
  const ngspiceAnalysisMs = median([...timed.map((t) => t.analysisSeconds), spice.analysisSeconds]) * 1e3;
  const ngspiceWallMs = median(timed.map((t) => t.wallMilliseconds));

  const ours = simulateRun(lossless, { keepFullResolution: true });
  const full = ours.full!;
  const error = windowedError({ time: spice.time, value: spice.vectors["v(far)"] }, { time: full.time, value: full.farEnd });
  const fromSpice = decodeWaveform({ time: spice.time, value: spice.vectors["v(far)"] }, decodeSettingsOf(circuit)).decoded;

  return {
    name: c.name,
    bits: circuit.bits.length,
    timeStepNs: ours.line.timeStep * 1e9,
    losslessMs,
    catalogueMs,
    gradeMs,
    ngspiceAnalysisMs,
    ngspiceWallMs,
    speedup: ngspiceAnalysisMs / losslessMs,
    maxErrorMv: error.maxError * 1e3,
    errorPercentVdd: (error.maxError / circuit.supplyVoltage) * 100,
    decodedMatch: fromSpice === ours.decoded,
    isTenMetreFull: c.length === 10 && circuit.bits.length === 96,
  };
}

function rowTable(rows: Row[]): string {
  const header = ["case", "bits", "step ns", "ours lossless ms", "ours with R' ms", "grade ms", "ngspice ms", "ngspice wall ms", "ratio", "max err mV", "% VDD", "bits match"];
  const body = rows.map((r) => [
    r.name,
    String(r.bits),
    r.timeStepNs.toFixed(4),
    r.losslessMs.toFixed(3),
    r.catalogueMs.toFixed(3),
    r.gradeMs.toFixed(3),
    r.ngspiceAnalysisMs.toFixed(0),
    r.ngspiceWallMs.toFixed(0),
    `${r.speedup.toFixed(0)}×`,
    r.maxErrorMv.toFixed(1),
    r.errorPercentVdd.toFixed(2),
    r.decodedMatch ? "yes" : "NO",
  ]);
  return table(header, body);
}

async function main() {
  console.log(`line simulator benchmark: Node ${process.version}, one thread; ngspice lossless T, 0.1 ns step, same circuits`);
  console.log(`at start: ${loadNote()}`);
  console.log("ours: median of simulateRun; grade: JSON in → validate → simulate → decode → verdict → JSON out; ngspice ms: its transient analysis time\n");
  const rows: Row[] = [];
  for (const c of STANDARD_CASES) rows.push(await benchCase(c));
  console.log(rowTable(rows));
  console.log(`at end: ${loadNote()}`);

  const tenMetre = rows.filter((r) => r.isTenMetreFull);
  const worstTenMetre = Math.max(...tenMetre.map((r) => r.catalogueMs));
  const leastSpeedup = Math.min(...tenMetre.map((r) => r.speedup));
  const worstGrade = Math.max(...rows.map((r) => r.gradeMs));
  const worstError = Math.max(...rows.map((r) => r.errorPercentVdd));
  console.log("\ntargets (issue 3, benchmark figures, not tests):");
  console.log(`  10 m, 96-bit case under ${TARGETS.tenMetreMedianMs} ms median: worst ${worstTenMetre.toFixed(3)} ms — ${verdict(worstTenMetre < TARGETS.tenMetreMedianMs)}`);
  console.log(`  at least ${TARGETS.speedup}× faster than ngspice on the 10 m cases: least ${leastSpeedup.toFixed(0)}× — ${verdict(leastSpeedup >= TARGETS.speedup)}`);
  console.log(`  full grade under ${TARGETS.gradeMs} ms: worst ${worstGrade.toFixed(3)} ms — ${verdict(worstGrade < TARGETS.gradeMs)}`);
  console.log(`  accuracy within 2 % of VDD of ngspice with identical bits: worst ${worstError.toFixed(2)} % — ${verdict(worstError < 2 && rows.every((r) => r.decodedMatch))}`);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
