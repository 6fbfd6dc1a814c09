import { eSeriesValues, simulateRun, type CableKind } from "@/lib/sim";
import { controllerPin3v3 } from "../drivers";
import type { DisplayUnit } from "./display-units";

/**
 * Numbers the lessons quote from simulator runs. Running them takes too long for every load of the
 * course, so `npm run lessons:numbers` (scripts/lesson-numbers.ts) computes them into
 * lessons/numbers/simulated-values.ts, which is committed; tests/unit/lessons/lesson-numbers.test.ts
 * runs every recipe again and fails when the committed value differs.
 */
export type Simulation = { unit: DisplayUnit; decimals: number; source: string; compute: () => number };

/** Significant digits a simulated value is kept to: more than any lesson prints. */
export const SIMULATED_DIGITS = 4;

export const keepSimulated = (value: number) => Number(value.toPrecision(SIMULATED_DIGITS));

/** The bit pattern of the lessons' simulated claims and of the 3.3 V labs. */
const BITS = "0100110101100010";
const LENGTH = 10;
const MARGIN = 0.3;
const E24 = eSeriesValues("E24", 10, 1000);

/** Lesson 6's criterion on the workbench: the controller pin into a 5 V pixel works on typical pixels with 0.3 V to spare. */
function worksWithMargin(cable: CableKind, seriesResistance: number): boolean {
  const { highVoltage, outputResistance, edgeTime } = controllerPin3v3;
  const { typical } = simulateRun({
    driver: { highVoltage, outputResistance, edgeTime },
    seriesResistance,
    cable: { kind: cable, length: LENGTH },
    receiver: { supplyVoltage: 5 },
    signal: { bits: BITS },
  }).verdict;
  return typical.pass && typical.voltageMargin >= MARGIN;
}

const windows = new Map<CableKind, number[]>();

/** The E24 values that meet the criterion on `cable`, which must be one unbroken run of the series. */
function e24Window(cable: CableKind): number[] {
  const known = windows.get(cable);
  if (known) return known;
  const passing = E24.filter((r) => worksWithMargin(cable, r));
  const first = E24.indexOf(passing[0]);
  if (passing.length === 0 || passing.some((r, i) => E24[first + i] !== r)) {
    throw new Error(`the ${cable} window is not one unbroken run of E24 values: ${passing.join(", ")} Ω`);
  }
  windows.set(cable, passing);
  return passing;
}

const SOURCE = "simulator runs of the controller pin into a 5 V pixel over 10 m, 16 bits, every E24 value from 10 Ω to 1 kΩ (lessons/numbers/simulations.ts)";
const edge = (cable: CableKind, which: "lowest" | "highest"): Simulation => ({
  unit: "Ω",
  decimals: 0,
  source: `${SOURCE}: the ${which} that works on typical pixels with 0.3 V of voltage margin`,
  compute: () => {
    const window = e24Window(cable);
    return which === "lowest" ? window[0] : window[window.length - 1];
  },
});

export const simulations = {
  seriesTermination: {
    loneLowest: edge("lone-lead", "lowest"),
    loneHighest: edge("lone-lead", "highest"),
    besideLowest: edge("beside-ground", "lowest"),
    besideHighest: edge("beside-ground", "highest"),
  },
} satisfies Record<string, Record<string, Simulation>>;
