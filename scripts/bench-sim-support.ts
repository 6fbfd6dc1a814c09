/**
 * What the simulator's benchmarks share: the standard cases of docs/simulator.md, a median timer
 * and a note on the machine's load beside the figures.
 */
import { availableParallelism, loadavg } from "node:os";
import { cableCatalogue, CABLE_KINDS } from "@/lib/sim";
import type { DocSimInput } from "@/tests/reference/support/reference-circuit";

export type Kind = (typeof CABLE_KINDS)[number];

export interface StandardCase {
  name: string;
  kind: Kind;
  length: number;
  seriesResistance: number;
  driverVolts: number;
  driverResistance: number;
  pixels: number;
}

/** docs/simulator.md, "Standard benchmark cases": 3 ns edges, 5 pF clamped receiver on a 5 V pixel. */
export const STANDARD_CASES: StandardCase[] = [
  { name: "1 beside-ground 10 m 33 Ω 5 V", kind: "beside-ground", length: 10, seriesResistance: 33, driverVolts: 5, driverResistance: 20, pixels: 4 },
  { name: "2 lone-lead 10 m 249 Ω 3.3 V", kind: "lone-lead", length: 10, seriesResistance: 249, driverVolts: 3.3, driverResistance: 30, pixels: 4 },
  { name: "3 twisted-pair 20 m 100 Ω 5 V", kind: "twisted-pair", length: 20, seriesResistance: 100, driverVolts: 5, driverResistance: 20, pixels: 4 },
  { name: "4 coax-75 30 m 47 Ω 5 V", kind: "coax-75", length: 30, seriesResistance: 47, driverVolts: 5, driverResistance: 20, pixels: 4 },
  { name: "5 beside-ground 1 m 0 Ω 5 V, 24 bits", kind: "beside-ground", length: 1, seriesResistance: 0, driverVolts: 5, driverResistance: 20, pixels: 1 },
];

const COLOURS: [number, number, number][] = [
  [255, 96, 0],
  [18, 52, 86],
  [0, 200, 120],
  [171, 205, 239],
];

/** The case as simulator input: the catalogue cable, or the same line without its resistance (what ngspice's T element solves). */
export function inputOf(c: StandardCase, lossless = false): DocSimInput {
  const cable = lossless
    ? { perMetre: { ...cableCatalogue[c.kind].perMetre, resistance: 0 }, length: c.length }
    : { kind: c.kind as "lone-lead", length: c.length };
  return {
    driver: { highVoltage: c.driverVolts, outputResistance: c.driverResistance, edgeTime: 3e-9 },
    seriesResistance: c.seriesResistance,
    cable,
    receiver: { supplyVoltage: 5, inputCapacitance: 5e-12, clampDiodes: true, deglitchTime: 10e-9 },
    signal: { colours: COLOURS.slice(0, c.pixels), byteOrder: "GRB" },
  };
}

export function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

const WARM_UP = 5;
const MIN_REPEATS = 20;
const MIN_MEASURE_MS = 500;

/** Median wall time in ms of `work`, after a warm-up, over at least MIN_REPEATS runs and MIN_MEASURE_MS. */
export function medianTime(work: () => unknown): number {
  return medianTimes(work).wallMs;
}

function cpuMs(): number {
  const { user, system } = process.cpuUsage();
  return (user + system) / 1e3;
}

/** CPU time of this process in ms over one run of `work`. */
export function cpuTimeOf(work: () => unknown): number {
  const started = cpuMs();
  work();
  return cpuMs() - started;
}

/**
 * Median wall time and median CPU time of this process in ms. On a machine shared with other
 * work the wall time counts the waits for a core too; the CPU time stays near what an idle
 * machine's wall time would be (it includes the collector's helper threads, so errs high).
 */
export function medianTimes(work: () => unknown): { wallMs: number; cpuMs: number } {
  for (let i = 0; i < WARM_UP; i++) work();
  const wall: number[] = [];
  const cpu: number[] = [];
  const started = performance.now();
  while (wall.length < MIN_REPEATS || performance.now() - started < MIN_MEASURE_MS) {
    const t0 = performance.now();
    cpu.push(cpuTimeOf(work));
    wall.push(performance.now() - t0);
  }
  return { wallMs: median(wall), cpuMs: median(cpu) };
}

/** Columns padded to their widest cell; the first left-aligned, the rest right-aligned. */
export function table(header: string[], body: string[][]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...body.map((row) => row[i].length)));
  const line = (cells: string[]) => cells.map((cell, i) => (i === 0 ? cell.padEnd(widths[i]) : cell.padStart(widths[i]))).join("  ");
  return [line(header), widths.map((w) => "-".repeat(w)).join("  "), ...body.map(line)].join("\n");
}

/** Wall-clock medians mean little when other work competes for the cores: say so beside the figures. */
export function loadNote(): string {
  const load = loadavg()[0];
  const cores = availableParallelism();
  const busy = load > cores * 0.75 ? " — machine busy, times are inflated; the ratios, measured side by side, suffer less" : "";
  return `load average ${load.toFixed(2)} on ${cores} cores${busy}`;
}

export const verdict = (ok: boolean) => (ok ? "met" : "NOT MET");
