import { cableCatalogue, simulateRun, type SimInput, type SimResult } from "@/lib/sim";
import type { CheckRun } from "@/lessons/schema";

/**
 * What every non-numeric check sends: two 1 bits between 0 bits, so the far end shows a rising
 * edge, a long high that has time to ring or climb, and both kinds of pulse. The pixel is the
 * simulator's default 5 V pixel with its clamp diodes.
 */
export const CHECK_BITS = "0110";
const SUPPLY = 5;

export function checkSimInput(run: CheckRun): SimInput {
  return {
    driver: { highVoltage: run.driver.highVoltage, outputResistance: run.driver.outputResistance, edgeTime: run.driver.edgeTime },
    seriesResistance: run.seriesResistance,
    cable: { kind: run.cable, length: run.length },
    receiver: { supplyVoltage: SUPPLY, clampDiodes: true },
    signal: { bits: CHECK_BITS },
  };
}

// A lesson page draws the same few runs for every learner; runs are deterministic, so keep them.
const runs = new Map<string, SimResult>();
const KEPT_RUNS = 200;

/** The simulator's run for a check, computed once per process. */
export function simulateCheckRun(run: CheckRun): SimResult {
  const key = JSON.stringify(run);
  const known = runs.get(key);
  if (known) return known;
  const result = simulateRun(checkSimInput(run), { grid: { finestInterval: 0, maxPoints: 4000 } });
  if (runs.size >= KEPT_RUNS) runs.delete(runs.keys().next().value!);
  runs.set(key, result);
  return result;
}

/** A label inside a sentence: its first letter in lower case, units such as "Ω" and "V" left as they are. */
export const inSentence = (label: string) => label.charAt(0).toLowerCase() + label.slice(1);

const ohms = (value: number) => (value === 0 ? "no series resistor" : `a ${Number(value.toPrecision(3))} Ω series resistor`);

/** The run in an installer's words, from its data: "5 V buffered output, 12 m of twisted pair, a 33 Ω series resistor". */
export function describeCheckRun(run: CheckRun): string {
  const cable = inSentence(cableCatalogue[run.cable].label);
  return `${run.driver.label}, ${Number(run.length.toPrecision(3))} m of ${cable}, ${ohms(run.seriesResistance)}`;
}
