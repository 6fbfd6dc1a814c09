import type { PassRule, RunChoices, Scenario } from "@/lessons/schema";

// What the lab page hands the workbench: plain data, built on the server from the learner's
// variant, so the browser never loads the course or the cable catalogue to show the controls.

export type CableOption = {
  kind: string;
  label: string;
  description: string;
  z0: number;
  capacitancePerMetre: number;
  delayPerMetre: number;
};

export type DriverOption = { id: string; label: string; highVoltage: number; outputResistance: number; edgeTime: number };

export type RunControls = {
  seriesResistance?: { series: string; values: number[] };
  cable?: CableOption[];
  driver?: DriverOption[];
  length?: number[];
  timing?: { zeroHigh: { min: number; max: number; step: number }; oneHigh: { min: number; max: number; step: number } };
};

export type WorkbenchRun = {
  id: string;
  label: string;
  /** The learner's own variant of the run: what buildSimInput starts from. */
  scenario: Scenario;
  controls: RunControls;
  start: RunChoices;
  /** Every cable and driver the drawing may need to name, chosen or fixed. */
  cables: CableOption[];
  drivers: DriverOption[];
};

export type WorkbenchQuestion = { id: string; unit: string; example: string };

export type WorkbenchSetup = {
  labSlug: string;
  runs: WorkbenchRun[];
  questions: WorkbenchQuestion[];
  passRule: PassRule;
  /** Graded attempts up to this number cost nothing; each later one loses `penalty` points. */
  attempts: { free: number; penalty: number };
};
