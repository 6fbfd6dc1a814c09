import type { SimInput } from "@/lib/sim";
import type { RunChoices, Scenario } from "./schema";

/**
 * The simulator input for one run: the scenario with the learner's choices put in. Choices are
 * assumed valid for the run (see `parseRunChoices`); an unknown driver id is a programming error.
 */
export function buildSimInput(scenario: Scenario, choices: RunChoices): SimInput {
  const driver = choices.driver === undefined ? scenario.driver : findDriver(scenario, choices.driver);
  const { pattern, ...timing } = scenario.signal;
  const signal = {
    ...("bits" in pattern ? { bits: pattern.bits } : { colours: pattern.colours, byteOrder: pattern.byteOrder }),
    ...timing,
    ...(choices.zeroHigh === undefined ? {} : { zeroHigh: choices.zeroHigh }),
    ...(choices.oneHigh === undefined ? {} : { oneHigh: choices.oneHigh }),
  };
  return {
    driver: {
      highVoltage: driver.highVoltage,
      outputResistance: driver.outputResistance,
      ...(driver.outputResistanceLow === undefined ? {} : { outputResistanceLow: driver.outputResistanceLow }),
      edgeTime: driver.edgeTime,
    },
    seriesResistance: choices.seriesResistance ?? scenario.seriesResistance,
    cable: { kind: choices.cable ?? scenario.cable, length: choices.length ?? scenario.length },
    receiver: { ...scenario.receiver },
    signal,
  };
}

function findDriver(scenario: Scenario, id: string) {
  const driver = scenario.driverOptions?.find((d) => d.id === id);
  if (!driver) throw new Error(`driver "${id}" is not on offer in this scenario`);
  return driver;
}
