import { describe, expect, it } from "vitest";
import { parseSimInput } from "@/lib/sim";
import {
  buildSimInput,
  defaultVariant,
  getCourse,
  getLab,
  labChoicesSchemaFor,
  labVariant,
  startingChoices,
  type Lab,
  type RunChoices,
} from "@/lessons";

const labs = getCourse().lessons.map((l) => l.lab!) as Lab[];
const variantsOf = (lab: Lab) => [defaultVariant(lab), ...Array.from({ length: 8 }, (_, i) => labVariant(lab, `learner-${i}`))];

describe.each(labs.map((lab) => [lab.slug, lab] as const))("buildSimInput for %s", (_, lab) => {
  it("gives input the simulator accepts, for the reference, the mistakes and the starting choices of every variant", () => {
    for (const variant of variantsOf(lab)) {
      const examples: Record<string, RunChoices>[] = [lab.reference.solution, ...lab.reference.mistakes.map((m) => m.choices)];
      const starting = Object.fromEntries(lab.runs.map((run, i) => [run.id, startingChoices(run, variant.runs[i].scenario)]));
      for (const choices of [...examples, starting]) {
        variant.runs.forEach((run) => expect(() => parseSimInput(buildSimInput(run.scenario, choices[run.id]))).not.toThrow());
      }
    }
  });

  it("offers choices that its own choice schema accepts", () => {
    for (const variant of variantsOf(lab)) {
      const schema = labChoicesSchemaFor(lab, variant);
      const starting = Object.fromEntries(lab.runs.map((run, i) => [run.id, startingChoices(run, variant.runs[i].scenario)]));
      expect(schema.safeParse(starting).success).toBe(true);
      expect(schema.safeParse(lab.reference.solution).success).toBe(true);
      for (const mistake of lab.reference.mistakes) expect(schema.safeParse(mistake.choices).success).toBe(true);
    }
  });
});

describe("buildSimInput", () => {
  const scenario = getLab("cable-spec")!.runs[0].scenario;

  it("puts the learner's choices in place of the scenario's values", () => {
    const input = buildSimInput(scenario, { cable: "twisted-pair", seriesResistance: 47, length: 7.5, zeroHigh: 0.35e-6, oneHigh: 0.85e-6 });
    expect(input.cable).toEqual({ kind: "twisted-pair", length: 7.5 });
    expect(input.seriesResistance).toBe(47);
    expect(input.signal).toMatchObject({ zeroHigh: 0.35e-6, oneHigh: 0.85e-6, bits: "0100110101100010" });
  });

  it("keeps the scenario's values where the learner chose nothing", () => {
    const input = buildSimInput(scenario, {});
    expect(input.cable).toEqual({ kind: scenario.cable, length: scenario.length });
    expect(input.seriesResistance).toBe(scenario.seriesResistance);
    expect(input.driver).toEqual({ highVoltage: 3.3, outputResistance: 30, edgeTime: 4e-9 });
    expect(input.receiver).toEqual({ supplyVoltage: 5 });
  });

  it("takes the chosen driver from the options on offer and turns colours into a colour signal", () => {
    const thresholds = getLab("thresholds")!.runs[0].scenario;
    expect(buildSimInput(thresholds, { driver: "shifter-5v" }).driver).toMatchObject({ highVoltage: 5, outputResistance: 20 });
    expect(() => buildSimInput(thresholds, { driver: "no-such-driver" })).toThrow(/not on offer/);
    const capstone = getLab("capstone-installation")!.runs[0].scenario;
    expect(buildSimInput(capstone, { seriesResistance: 150 }).signal).toMatchObject({ colours: [[255, 140, 0]], byteOrder: "GRB" });
  });
});

describe("labChoicesSchemaFor", () => {
  const lab = getLab("lone-lead-termination")!;
  const schema = labChoicesSchemaFor(lab, labVariant(lab, "learner-1"));
  const pathsOf = (value: unknown) => schema.safeParse(value).error?.issues.map((i) => i.path.join(".")) ?? [];

  it("accepts a resistor of the series on offer and refuses one outside it, naming the field", () => {
    expect(schema.safeParse({ main: { seriesResistance: 150 } }).success).toBe(true);
    expect(pathsOf({ main: { seriesResistance: 151 } })).toEqual(["main.seriesResistance"]);
    expect(pathsOf({ main: { seriesResistance: 1200 } })).toEqual(["main.seriesResistance"]);
  });

  it("refuses a choice the lab does not offer and a missing one", () => {
    expect(pathsOf({ main: { seriesResistance: 150, cable: "coax-75" } })).toEqual(["main.cable"]);
    expect(pathsOf({ main: {} })).toEqual(["main.seriesResistance"]);
    expect(pathsOf({})).toEqual(["main"]);
  });

  it("refuses pulse timings the decoder's protocol cannot carry", () => {
    const timing = getLab("timing-budget")!;
    const timingSchema = labChoicesSchemaFor(timing, defaultVariant(timing));
    expect(timingSchema.safeParse({ main: { zeroHigh: 0.4e-6, oneHigh: 0.8e-6 } }).success).toBe(true);
    const swapped = timingSchema.safeParse({ main: { zeroHigh: 0.8e-6, oneHigh: 0.4e-6 } });
    expect(swapped.error?.issues.map((i) => i.path.join("."))).toEqual(["main.zeroHigh"]);
    const offGrid = timingSchema.safeParse({ main: { zeroHigh: 0.42e-6, oneHigh: 0.8e-6 } });
    expect(offGrid.error?.issues.map((i) => i.path.join("."))).toEqual(["main.zeroHigh"]);
  });

  it("requires a choice for every run of the capstone", () => {
    const capstone = getLab("capstone-installation")!;
    const capstoneSchema = labChoicesSchemaFor(capstone, labVariant(capstone, "learner-1"));
    const result = capstoneSchema.safeParse({ arch: { seriesResistance: 150 }, facade: { seriesResistance: 22 } });
    expect(result.error?.issues.map((i) => i.path.join("."))).toEqual(["canopy"]);
  });
});
