import { describe, expect, it } from "vitest";
import { CABLE_KINDS } from "@/lib/sim";
import { FIGURE_IDS, getCourse, getLab, getLesson, type Lesson } from "@/lessons";
import { LESSON_CABLE_KINDS } from "@/lessons/cable-kinds";
import { accepts, entryFor } from "./support/typed-answer";

const course = getCourse();

/** Words of the teaching text: text and caution blocks, counting tokens that hold a letter or digit. */
function wordCount(lesson: Lesson): number {
  return lesson.blocks
    .flatMap((b) => (b.kind === "text" || b.kind === "caution" ? [b.markdown] : []))
    .join(" ")
    .split(/\s+/)
    .filter((token) => /[\p{L}\p{N}]/u.test(token)).length;
}

const proseOf = (lesson: Lesson) =>
  lesson.blocks.flatMap((b) => (b.kind === "text" || b.kind === "caution" ? [b.markdown] : [])).join("\n");

describe("the course", () => {
  it("holds the eight lessons of the product design, in order", () => {
    expect(course.slug).toBe("data-runs");
    expect(course.unlockInOrder).toBe(true);
    expect(course.lessons.map((l) => l.slug)).toEqual([
      "pixel-data-stream",
      "logic-levels",
      "edges",
      "transmission-line",
      "reflections",
      "series-termination",
      "designing-a-run",
      "on-the-bench",
    ]);
    expect(course.lessons.map((l) => l.number)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
  });

  it("ends every lesson in a lab, eight labs with the capstone last, and every lab counts towards completion", () => {
    const labs = course.lessons.map((l) => l.lab);
    expect(labs.every((lab) => lab !== null)).toBe(true);
    expect(new Set(labs.map((lab) => lab!.slug)).size).toBe(8);
    expect(labs[7]!.runs.length).toBeGreaterThanOrEqual(3);
    expect(new Set(labs[7]!.runs.map((r) => r.variant.cable?.join() ?? r.scenario.cable)).size).toBe(3);
    expect(course.completion.labs.map((c) => c.lab)).toEqual(labs.map((lab) => lab!.slug));
  });

  it("has bench exercises in lessons 7 and 8, both required for completion", () => {
    const benches = course.lessons.filter((l) => l.bench).map((l) => [l.number, l.bench!.slug]);
    expect(benches).toEqual([
      [7, "build-a-run"],
      [8, "document-a-run"],
    ]);
    expect(course.completion.benchExercises).toEqual(["build-a-run", "document-a-run"]);
  });

  it("marks each bench exercise on the review's three criteria, at most one of its own, out of 10 points", () => {
    for (const bench of course.lessons.flatMap((l) => (l.bench ? [l.bench] : []))) {
      const ids = bench.rubric.map((c) => c.id);
      expect(ids.slice(0, 3), bench.slug).toEqual(["measurement-correct", "trace-readable", "conclusion-sound"]);
      expect(ids.length, bench.slug).toBeLessThanOrEqual(4);
      expect(bench.rubric.reduce((sum, c) => sum + c.points, 0), bench.slug).toBe(10);
    }
  });

  it("finds lessons and labs by slug and nothing for unknown slugs", () => {
    expect(getLesson("reflections")?.number).toBe(5);
    expect(getLab("lone-lead-termination")?.title).toMatch(/lone lead/);
    expect(getLesson("no-such-lesson")).toBeUndefined();
    expect(getLab("no-such-lab")).toBeUndefined();
  });

  it("knows the same cable kinds as the simulator", () => {
    expect([...LESSON_CABLE_KINDS].sort()).toEqual([...CABLE_KINDS].sort());
  });

  it("uses every figure id it defines, so the UI implements no dead figure", () => {
    const used = new Set(course.lessons.flatMap((l) => l.blocks.flatMap((b) => (b.kind === "figure" ? [b.figure] : []))));
    expect([...used].sort()).toEqual([...FIGURE_IDS].sort());
    expect(FIGURE_IDS.length).toBeGreaterThanOrEqual(4);
    expect(FIGURE_IDS.length).toBeLessThanOrEqual(8);
  });
});

describe.each(course.lessons.map((lesson) => [lesson.number, lesson.slug, lesson] as const))("lesson %i (%s)", (_, __, lesson) => {
  it("teaches in 1,500 to 3,000 words", () => {
    const words = wordCount(lesson);
    expect(words).toBeGreaterThanOrEqual(1500);
    expect(words).toBeLessThanOrEqual(3000);
  });

  it("asks 3 to 6 quick checks", () => {
    const checks = lesson.blocks.filter((b) => b.kind === "check");
    expect(checks.length).toBeGreaterThanOrEqual(3);
    expect(checks.length).toBeLessThanOrEqual(6);
  });

  it("has at least one figure", () => {
    expect(lesson.blocks.some((b) => b.kind === "figure")).toBe(true);
  });

  it("accepts each answer typed in its own unit and rejects one 50 % off", () => {
    const answers = [
      ...lesson.blocks.flatMap((b) => (b.kind === "check" ? [b.answer] : [])),
      ...(lesson.lab?.questions ?? []).map((q) => q.answer),
    ];
    for (const answer of answers) {
      expect(accepts(answer, entryFor(answer)), entryFor(answer)).toBe(true);
      expect(accepts(answer, entryFor(answer, answer.value * 1.5)), entryFor(answer, answer.value * 1.5)).toBe(false);
    }
  });

  it("carries the power cautions wherever it speaks of supplies, fuses or mains", () => {
    const prose = proseOf(lesson);
    if (!/\b(mains|fuse|fused|power supply|supplies)\b/i.test(prose)) return;
    const cautions = lesson.blocks.flatMap((b) => (b.kind === "caution" ? [b.markdown] : [])).join("\n");
    expect(cautions).toMatch(/fire/i);
    expect(cautions).toMatch(/licensed/i);
    expect(cautions).toMatch(/codes/i);
    expect(cautions).toMatch(/manufacturer/i);
  });

  it("leaves no template residue in its markdown", () => {
    const all = lesson.blocks.flatMap((b) => ("markdown" in b ? [b.markdown] : "prompt" in b ? [b.prompt, b.hint, b.explanation] : [b.caption])).join("\n");
    const residue = all.match(/\$\{|\{\{|\}\}|\bNaN\b|\bInfinity\b|\[object/g) ?? [];
    expect(residue).toEqual([]);
  });
});

describe("safety coverage", () => {
  it("puts the power cautions in the lessons that touch power (1, 2, 7, 8)", () => {
    const withCaution = course.lessons.filter((l) => l.blocks.some((b) => b.kind === "caution")).map((l) => l.number);
    expect(withCaution).toEqual(expect.arrayContaining([1, 2, 7, 8]));
  });

  it("says the simulator is a teaching model to be confirmed on the bench", () => {
    const prose = course.lessons.map(proseOf).join("\n");
    expect(prose).toMatch(/teaching model/);
    expect(prose).toMatch(/confirm(ed)? on the bench/);
  });
});
