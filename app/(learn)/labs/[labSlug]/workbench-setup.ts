import "server-only";
import type { WorkbenchRun, WorkbenchSetup, CableOption, DriverOption } from "@/components/workbench/workbench-types";
import { lengthsOnOffer, resistorValuesOnOffer, startingChoices, type Lab, type LabVariant } from "@/lessons";
import type { Driver } from "@/lessons/schema";
import { exampleEntry } from "@/lib/answers/quantity-kinds";
import { cableCatalogue, type CableKind } from "@/lib/sim";

function cableOption(kind: CableKind): CableOption {
  const entry = cableCatalogue[kind];
  return {
    kind,
    label: entry.label,
    description: entry.description,
    z0: entry.z0,
    capacitancePerMetre: entry.perMetre.capacitance,
    delayPerMetre: entry.delayPerMetre,
  };
}

function driverOption(driver: Driver): DriverOption {
  const { id, label, highVoltage, outputResistance, edgeTime } = driver;
  return { id, label, highVoltage, outputResistance, edgeTime };
}

/** The workbench's view of the learner's variant: each run's controls with what is on offer, and where they start. */
export function workbenchSetup(lab: Lab, variant: LabVariant): WorkbenchSetup {
  const runs = lab.runs.map((spec, i): WorkbenchRun => {
    const { scenario } = variant.runs[i];
    const { choices } = spec;
    const cableKinds = [...new Set([scenario.cable, ...(scenario.cableOptions ?? [])])];
    const drivers = [scenario.driver, ...(scenario.driverOptions ?? []).filter((d) => d.id !== scenario.driver.id)];
    return {
      id: spec.id,
      label: spec.label,
      scenario,
      controls: {
        ...(choices.seriesResistance && { seriesResistance: { series: choices.seriesResistance.series, values: resistorValuesOnOffer(spec) } }),
        ...(choices.cable && { cable: (scenario.cableOptions ?? []).map(cableOption) }),
        ...(choices.driver && { driver: (scenario.driverOptions ?? []).map(driverOption) }),
        ...(choices.length && { length: lengthsOnOffer(spec, scenario) }),
        ...(choices.timing && { timing: choices.timing }),
      },
      start: startingChoices(spec, scenario),
      cables: cableKinds.map(cableOption),
      drivers: drivers.map(driverOption),
    };
  });
  return {
    labSlug: lab.slug,
    runs,
    questions: lab.questions.map((q) => ({ id: q.id, unit: q.answer.unit, example: exampleEntry(q.answer.unit) })),
    passRule: lab.passRule,
    attempts: { free: lab.scoring.penaltyPerAttemptBeyond, penalty: lab.scoring.penalty },
  };
}
