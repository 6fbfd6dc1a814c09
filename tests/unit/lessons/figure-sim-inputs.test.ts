import { describe, expect, it } from "vitest";
import { parseSimInput } from "@/lib/sim";
import { figureSimInputs, getCourse, type FigureBlock } from "@/lessons";

const figures = getCourse().lessons.flatMap((l) => l.blocks.filter((b): b is FigureBlock => b.kind === "figure"));
const terminations = figures.flatMap((f) => (f.figure === "series-termination" ? [f] : []));
const comparisons = figures.flatMap((f) => (f.figure === "cable-compare" ? [f] : []));
const simulated = [...terminations, ...comparisons];

describe("figureSimInputs", () => {
  it("gives the simulator valid input for every simulated figure of the course, at its start and at both slider ends", () => {
    expect(simulated.length).toBeGreaterThanOrEqual(3);
    for (const figure of simulated) {
      const slider = figure.params.slider;
      const ends = slider ? [slider.min, slider.max] : [];
      for (const value of [undefined, ...ends]) {
        const inputs = figureSimInputs(figure, value);
        expect(inputs.length).toBe(figure.figure === "cable-compare" ? figure.params.cables.length : 1);
        for (const input of inputs) expect(() => parseSimInput(input)).not.toThrow();
      }
    }
  });

  it("moves the slider's own field and nothing else", () => {
    const termination = terminations.find((f) => f.params.slider.field === "seriesResistance")!;
    const [moved] = figureSimInputs(termination, 150);
    expect(moved.seriesResistance).toBe(150);
    expect(moved.cable).toEqual({ kind: termination.params.cable, length: termination.params.length });
    const compare = comparisons[0];
    const inputs = figureSimInputs(compare, 7);
    expect(inputs.map((i) => i.cable)).toEqual(compare.params.cables.map((kind) => ({ kind, length: 7 })));
    expect(inputs.every((i) => i.seriesResistance === compare.params.seriesResistance)).toBe(true);
  });
});
