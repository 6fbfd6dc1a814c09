/**
 * Runs ngspice in batch mode (`ngspice -b`) on a netlist and reads the vectors back from the file
 * its `wrdata` command writes (one shared time column: `set wr_singlescale`, names on the first line:
 * `set wr_vecnames`).
 */
import { execFile } from "node:child_process";
import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { buildNgspiceNetlist, ngspiceProbes, type NetlistOptions } from "./ngspice-netlist";
import type { ReferenceCircuit } from "./reference-circuit";

const run = promisify(execFile);

const NGSPICE_BINARY = process.env.NGSPICE ?? "ngspice";

export interface NgspiceResult {
  time: Float64Array;
  vectors: Record<string, Float64Array>;
  /** ngspice's own "Transient analysis time", in seconds. */
  analysisSeconds: number;
  /** Wall time of the whole ngspice process, in milliseconds. */
  wallMilliseconds: number;
}

export function parseWrdata(text: string): { time: Float64Array; vectors: Record<string, Float64Array> } {
  const lines = text.split("\n").filter((line) => line.trim() !== "");
  const names = lines[0].trim().split(/\s+/);
  if (names[0] !== "time") throw new Error(`wrdata header does not start with time: ${lines[0]}`);
  const rows = lines.length - 1;
  const columns = names.map(() => new Float64Array(rows));
  for (let r = 0; r < rows; r++) {
    const fields = lines[r + 1].trim().split(/\s+/);
    if (fields.length !== names.length) throw new Error(`wrdata row ${r + 1} has ${fields.length} fields`);
    for (let c = 0; c < names.length; c++) columns[c][r] = Number(fields[c]);
  }
  const vectors: Record<string, Float64Array> = {};
  names.slice(1).forEach((name, c) => (vectors[name.toLowerCase()] = columns[c + 1]));
  return { time: columns[0], vectors };
}

function analysisSecondsFrom(stdout: string): number {
  const match = /Transient analysis time\s*=\s*([0-9.eE+-]+)/.exec(stdout);
  if (!match) throw new Error("ngspice printed no transient analysis time");
  return Number(match[1]);
}

async function runNetlist(netlist: string, directory: string): Promise<{ stdout: string; wallMilliseconds: number }> {
  const path = join(directory, "run.cir");
  await writeFile(path, netlist);
  const started = performance.now();
  const { stdout, stderr } = await run(NGSPICE_BINARY, ["-b", path], { maxBuffer: 64 * 1024 * 1024 });
  const wallMilliseconds = performance.now() - started;
  if (/^Error|error on line|fatal/im.test(stderr + stdout)) throw new Error(`ngspice reported an error:\n${stderr}\n${stdout}`);
  return { stdout, wallMilliseconds };
}

export async function runNgspice(circuit: ReferenceCircuit, options: Omit<NetlistOptions, "outputFile"> = {}): Promise<NgspiceResult> {
  const directory = await mkdtemp(join(tmpdir(), "sim-reference-"));
  try {
    const outputFile = join(directory, "result.txt");
    const { stdout, wallMilliseconds } = await runNetlist(buildNgspiceNetlist(circuit, { ...options, outputFile }), directory);
    const { time, vectors } = parseWrdata(await readFile(outputFile, "utf8"));
    for (const probe of ngspiceProbes(circuit)) {
      if (!vectors[probe]) throw new Error(`ngspice wrote no ${probe}`);
    }
    return { time, vectors, analysisSeconds: analysisSecondsFrom(stdout), wallMilliseconds };
  } finally {
    await rm(directory, { recursive: true, force: true });
  }
}

/**
 * Runs a netlist written elsewhere (support/differential-netlist.ts) whose control block writes
 * `probes` with wrdata to the file named by `outputFileOf`.
 */
export async function runNgspiceNetlist(netlistFor: (outputFile: string) => string, probes: string[]): Promise<NgspiceResult> {
  const directory = await mkdtemp(join(tmpdir(), "sim-reference-"));
  try {
    const outputFile = join(directory, "result.txt");
    const { stdout, wallMilliseconds } = await runNetlist(netlistFor(outputFile), directory);
    const { time, vectors } = parseWrdata(await readFile(outputFile, "utf8"));
    for (const probe of probes) {
      if (!vectors[probe]) throw new Error(`ngspice wrote no ${probe}`);
    }
    return { time, vectors, analysisSeconds: analysisSecondsFrom(stdout), wallMilliseconds };
  } finally {
    await rm(directory, { recursive: true, force: true });
  }
}

/** Runs the circuit without writing results, for timing the solve alone. */
export async function timeNgspice(circuit: ReferenceCircuit, options: Omit<NetlistOptions, "outputFile"> = {}): Promise<{ analysisSeconds: number; wallMilliseconds: number }> {
  const directory = await mkdtemp(join(tmpdir(), "sim-reference-"));
  try {
    const { stdout, wallMilliseconds } = await runNetlist(buildNgspiceNetlist(circuit, options), directory);
    return { analysisSeconds: analysisSecondsFrom(stdout), wallMilliseconds };
  } finally {
    await rm(directory, { recursive: true, force: true });
  }
}
