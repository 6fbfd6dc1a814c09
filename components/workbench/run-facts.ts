import type { RunChoices } from "@/lessons/schema";
import type { WorkbenchRun, CableOption, DriverOption } from "./workbench-types";
import { formatMetres, formatNanoseconds, formatOhms } from "./quantities";

/** The run as it stands with the learner's choices put in: what the drawing and the words show. */
export type RunFacts = {
  driver: DriverOption;
  cable: CableOption;
  length: number;
  seriesResistance: number;
  zeroHigh: number | null;
  oneHigh: number | null;
  supplyVoltage: number;
};

export function runFacts(run: WorkbenchRun, choices: RunChoices): RunFacts {
  const { scenario } = run;
  const driverId = choices.driver ?? scenario.driver.id;
  const cableKind = choices.cable ?? scenario.cable;
  return {
    driver: run.drivers.find((d) => d.id === driverId) ?? run.drivers[0],
    cable: run.cables.find((c) => c.kind === cableKind) ?? run.cables[0],
    length: choices.length ?? scenario.length,
    seriesResistance: choices.seriesResistance ?? scenario.seriesResistance,
    zeroHigh: choices.zeroHigh ?? scenario.signal.zeroHigh ?? null,
    oneHigh: choices.oneHigh ?? scenario.signal.oneHigh ?? null,
    supplyVoltage: scenario.receiver.supplyVoltage,
  };
}

/** The learner's own choices for a run in words ("150 Ω", "Twisted pair, 9.5 m"), for the attempt history. */
export function describeChoices(run: WorkbenchRun, choices: RunChoices | undefined): string {
  if (!choices) return "no choice recorded";
  const facts = runFacts(run, choices);
  const parts: string[] = [];
  if (choices.driver !== undefined) parts.push(facts.driver.label);
  if (choices.cable !== undefined) parts.push(facts.cable.label);
  if (choices.length !== undefined) parts.push(formatMetres(facts.length));
  if (choices.seriesResistance !== undefined) parts.push(formatOhms(facts.seriesResistance));
  if (choices.zeroHigh !== undefined && choices.oneHigh !== undefined) {
    parts.push(`0 high ${formatNanoseconds(choices.zeroHigh)}, 1 high ${formatNanoseconds(choices.oneHigh)}`);
  }
  return parts.join(", ");
}
