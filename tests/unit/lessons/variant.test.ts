import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { defaultVariant, getCourse, labVariant, type Lab } from "@/lessons";

const labs = getCourse().lessons.map((l) => l.lab!) as Lab[];
const seeds = Array.from({ length: 200 }, (_, i) => `learner-${i}:cohort-a`);
const onGrid = (value: number, min: number, step: number) => Math.abs((value - min) / step - Math.round((value - min) / step)) < 1e-9;

describe.each(labs.map((lab) => [lab.slug, lab] as const))("labVariant for %s", (_, lab) => {
  it("is deterministic: the same seed gives the same scenario", () => {
    for (const seed of seeds.slice(0, 20)) expect(labVariant(lab, seed)).toEqual(labVariant(lab, seed));
  });

  it("differs between learners: many seeds give many distinct scenarios", () => {
    const distinct = new Set(seeds.map((seed) => JSON.stringify(labVariant(lab, seed).runs.map((r) => r.scenario))));
    const choices = lab.runs.reduce((product, run) => {
      const lengths = run.variant.length ? Math.floor((run.variant.length.max - run.variant.length.min) / run.variant.length.step + 1e-9) + 1 : 1;
      return product * lengths * (run.variant.cable?.length ?? 1) * (run.variant.driver?.length ?? 1);
    }, 1);
    expect(choices).toBeGreaterThan(1);
    expect(distinct.size).toBeGreaterThanOrEqual(Math.min(choices, 200) * 0.6);
  });

  it("keeps every varied field in its range and on its grid, and every other field as authored", () => {
    fc.assert(
      fc.property(fc.string(), (seed) => {
        const variant = labVariant(lab, seed);
        expect(variant.seed).toBe(seed);
        lab.runs.forEach((run, i) => {
          const scenario = variant.runs[i].scenario;
          const { length, cable, driver } = run.variant;
          if (length) {
            expect(scenario.length).toBeGreaterThanOrEqual(length.min);
            expect(scenario.length).toBeLessThanOrEqual(length.max);
            expect(onGrid(scenario.length, length.min, length.step)).toBe(true);
          } else expect(scenario.length).toBe(run.scenario.length);
          if (cable) expect(cable).toContain(scenario.cable);
          else expect(scenario.cable).toBe(run.scenario.cable);
          if (driver) expect(driver).toContainEqual(scenario.driver);
          else expect(scenario.driver).toEqual(run.scenario.driver);
          expect(scenario.receiver).toEqual(run.scenario.receiver);
          expect(scenario.signal).toEqual(run.scenario.signal);
          expect(scenario.seriesResistance).toBe(run.scenario.seriesResistance);
        });
      }),
      { numRuns: 200 },
    );
  });
});

describe("variant spread", () => {
  it("reaches every length on the grid of the lone-lead lab within 200 learners", () => {
    const lab = labs.find((l) => l.slug === "lone-lead-termination")!;
    const spec = lab.runs[0].variant.length!;
    const grid = Math.floor((spec.max - spec.min) / spec.step + 1e-9) + 1;
    const seen = new Set(seeds.map((seed) => labVariant(lab, seed).runs[0].scenario.length));
    expect(seen.size).toBe(grid);
  });

  it("gives one learner unrelated variants in different labs", () => {
    const a = labs.find((l) => l.slug === "lone-lead-termination")!;
    const b = labs.find((l) => l.slug === "beside-ground-termination")!;
    const fraction = (lab: Lab, seed: string) => {
      const spec = lab.runs[0].variant.length!;
      return (labVariant(lab, seed).runs[0].scenario.length - spec.min) / (spec.max - spec.min);
    };
    const same = seeds.filter((seed) => Math.abs(fraction(a, seed) - fraction(b, seed)) < 1e-9).length;
    expect(same).toBeLessThan(seeds.length / 4);
  });

  it("leaves the authored scenario in the default variant", () => {
    for (const lab of labs) {
      const variant = defaultVariant(lab);
      expect(variant.seed).toBeNull();
      expect(variant.runs.map((r) => r.scenario)).toEqual(lab.runs.map((r) => r.scenario));
    }
  });
});
