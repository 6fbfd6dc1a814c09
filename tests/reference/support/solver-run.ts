/**
 * The solver under test (lib/sim) run on the same JSON input as the references, with its waveforms
 * at full resolution, plus the settings the independent receiver rule needs.
 */
import { CLAMP_DIODE_MODEL, simulateRun, type SimResult } from "@/lib/sim";
import type { DecodeSettings } from "./receiver-decode";
import { lineDelay, resolveReferenceCircuit, type DocSimInput, type ReferenceCircuit } from "./reference-circuit";

export interface SolverRun {
  result: SimResult;
  time: Float64Array;
  nearEnd: Float64Array;
  farEnd: Float64Array;
}

export function runSolver(input: DocSimInput): SolverRun {
  const result = simulateRun(input, { keepFullResolution: true });
  if (!result.full) throw new Error("the solver returned no full-resolution waveforms");
  return { result, ...result.full };
}

/** The reference circuit of an input, with the solver's clamp-diode law (read from lib/sim, matched in ngspice). */
export function referenceCircuitOf(input: DocSimInput, quietTail?: number): ReferenceCircuit {
  return resolveReferenceCircuit(input, CLAMP_DIODE_MODEL, quietTail);
}

export function decodeSettingsOf(circuit: ReferenceCircuit): DecodeSettings {
  return {
    supplyVoltage: circuit.supplyVoltage,
    ...circuit.receiver,
    leadIn: circuit.leadIn,
    bitPeriod: circuit.bitPeriod,
    bitCount: circuit.bits.length,
    slotOffset: lineDelay(circuit),
  };
}
