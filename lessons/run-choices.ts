import { z } from "zod";
import { eSeriesValues } from "@/lib/sim";
import { cableKindSchema } from "./cable-kinds";
import type { Lab, RunChoices, RunSpec, Scenario } from "./schema";
import type { LabVariant } from "./variant";

/** The protocol's bit period when a scenario does not set one (docs/simulator.md, "Signal"). */
const DEFAULT_BIT_PERIOD = 1.25e-6;

/** Values a resistor control offers for a run, in ohms (IEC 60063 series within the run's range). */
export function resistorValuesOnOffer(run: RunSpec): number[] {
  const spec = run.choices.seriesResistance;
  return spec ? eSeriesValues(spec.series, spec.min, spec.max) : [];
}

/** Values a length control offers, metres: the scenario's range on the run's grid. */
export function lengthsOnOffer(run: RunSpec, scenario: Scenario): number[] {
  const spec = run.choices.length;
  if (!spec || !scenario.lengthRange) return [];
  const [min, max] = scenario.lengthRange;
  const count = Math.floor((max - min) / spec.step + 1e-9) + 1;
  return Array.from({ length: count }, (_, i) => Number((min + i * spec.step).toFixed(6)));
}

const onGrid = (value: number, min: number, step: number) => Math.abs((value - min) / step - Math.round((value - min) / step)) < 1e-6;
const sameValue = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b));

/**
 * Each of one run's choices on its own: exactly the fields the learner sets, each restricted to
 * what its control offers. A workbench left mid-change (a 0's high time above a 1's) passes.
 */
export function runControlValuesSchemaFor(run: RunSpec, scenario: Scenario) {
  const { choices } = run;
  const resistors = resistorValuesOnOffer(run);
  const lengths = lengthsOnOffer(run, scenario);
  const drivers = scenario.driverOptions?.map((d) => d.id) ?? [];
  const absent = z.never({ error: "is not a choice in this lab" }).optional();
  const timeOnGrid = (range: { min: number; max: number; step: number }) =>
    z
      .number()
      .min(range.min)
      .max(range.max)
      .refine((v) => onGrid(v, range.min, range.step), { message: "must be on the control's steps" });

  return z.strictObject({
    cable: choices.cable
      ? cableKindSchema.refine((kind) => scenario.cableOptions?.includes(kind), {
          message: `choose one of: ${scenario.cableOptions?.join(", ")}`,
        })
      : absent,
    driver: choices.driver ? z.string().refine((id) => drivers.includes(id), { message: `choose one of: ${drivers.join(", ")}` }) : absent,
    seriesResistance: choices.seriesResistance
      ? z.number().refine((v) => resistors.some((r) => sameValue(v, r)), {
          message: `must be one of the ${choices.seriesResistance.series} values from ${choices.seriesResistance.min} to ${choices.seriesResistance.max} ohm`,
        })
      : absent,
    length: choices.length
      ? z.number().refine((v) => lengths.some((l) => sameValue(v, l)), {
          message: `must be a length on offer from ${scenario.lengthRange?.[0]} to ${scenario.lengthRange?.[1]} m`,
        })
      : absent,
    zeroHigh: choices.timing ? timeOnGrid(choices.timing.zeroHigh) : absent,
    oneHigh: choices.timing ? timeOnGrid(choices.timing.oneHigh) : absent,
  });
}

/**
 * The schema of one run's choices: each value on offer and the timing coherent, so the grader can
 * reject a tampered submission with the field named.
 */
export function runChoicesSchemaFor(run: RunSpec, scenario: Scenario): z.ZodType<RunChoices> {
  const bitPeriod = scenario.signal.bitPeriod ?? DEFAULT_BIT_PERIOD;
  return runControlValuesSchemaFor(run, scenario).superRefine((value, ctx) => {
    const { zeroHigh, oneHigh } = value;
    if (zeroHigh !== undefined && oneHigh !== undefined && zeroHigh >= oneHigh) {
      ctx.addIssue({ code: "custom", path: ["zeroHigh"], message: "the high time of a 0 must be shorter than that of a 1" });
    }
    if (oneHigh !== undefined && oneHigh >= bitPeriod) {
      ctx.addIssue({ code: "custom", path: ["oneHigh"], message: "the high time of a 1 must be shorter than the bit period" });
    }
  });
}

/** The schema of a whole submission: `{ [runId]: choices }` for the given variant of the lab. */
export function labChoicesSchemaFor(lab: Lab, variant: LabVariant) {
  const shape: Record<string, z.ZodType<RunChoices>> = {};
  lab.runs.forEach((run, i) => {
    shape[run.id] = runChoicesSchemaFor(run, variant.runs[i].scenario);
  });
  return z.strictObject(shape);
}

export type LabChoices = Record<string, RunChoices>;

/** The choices a control starts from: the scenario's own values, snapped to what is on offer. */
export function startingChoices(run: RunSpec, scenario: Scenario): RunChoices {
  const { choices } = run;
  const resistors = resistorValuesOnOffer(run);
  const nearest = (values: number[], target: number) =>
    values.reduce((best, v) => (Math.abs(v - target) < Math.abs(best - target) ? v : best), values[0]);
  return {
    ...(choices.cable && { cable: scenario.cable }),
    ...(choices.driver && { driver: scenario.driver.id }),
    ...(choices.seriesResistance && { seriesResistance: nearest(resistors, scenario.seriesResistance) }),
    ...(choices.length && { length: nearest(lengthsOnOffer(run, scenario), scenario.length) }),
    ...(choices.timing && { zeroHigh: scenario.signal.zeroHigh!, oneHigh: scenario.signal.oneHigh! }),
  };
}
