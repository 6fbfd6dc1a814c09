/**
 * The course's non-numeric quick checks: each asks something the simulator answers unambiguously,
 * and what the page shows before an answer does not tell the right option.
 */
import { describe, expect, it } from "vitest";
import { getCourse } from "@/lessons";
import type { ChoiceCheckBlock } from "@/lessons/schema";
import { bufferRun } from "@/lessons/choice-check-runs";
import { describeCheckRun, simulateCheckRun } from "@/lib/quick-checks/check-runs";
import { FIXES, applyFix, correctChoice, gradeChoiceCheck, presentChoiceCheck } from "@/lib/quick-checks/choice-check";
import { readFarEndShape } from "@/lib/quick-checks/far-end-shape";

const SEEDS = Array.from({ length: 12 }, (_, i) => `learner-${i + 1}`);
const lessons = getCourse().lessons;
const choiceChecks = lessons.flatMap((lesson) =>
  lesson.blocks.flatMap((block) => (block.kind === "choice" ? [[`${lesson.slug}/${block.id}`, block] as const] : [])),
);

describe("every lesson", () => {
  it.each(lessons.map((l) => [l.slug, l] as const))("%s has at least two checks that are not numeric, of two kinds", (_, lesson) => {
    const asks = lesson.blocks.flatMap((b) => (b.kind === "choice" ? [b.ask] : []));
    expect(asks.length).toBeGreaterThanOrEqual(2);
    expect(new Set(asks).size).toBeGreaterThanOrEqual(lesson.number === 1 ? 2 : 1);
  });

  it("the course asks all three kinds", () => {
    expect(new Set(choiceChecks.map(([, b]) => b.ask))).toEqual(new Set(["pick-trace", "predict", "diagnose"]));
  });
});

describe.each(choiceChecks)("%s", (_, block: ChoiceCheckBlock) => {
  if (block.ask === "predict") {
    it("classifies every run it may give clearly, and gives more than one shape", () => {
      const readings = block.runs.map((run) => readFarEndShape(simulateCheckRun(run), 5));
      for (const reading of readings) {
        // Far from the classifier's boundaries, so a small simulator change cannot flip the answer.
        if (reading.shape === "ringing") expect(reading.overshootShare).toBeGreaterThan(0.12);
        if (reading.shape === "clean") expect(reading.overshootShare).toBeLessThan(0.05);
        if (reading.shape === "staircase") expect(reading.riseRoundTrips!).toBeGreaterThan(2.5);
        if (reading.shape === "clean" && reading.riseRoundTrips !== null) expect(reading.riseRoundTrips).toBeLessThan(1.6);
        if (reading.shape === "short") expect(reading.peak).toBeLessThan(0.7 * 5 - 0.1);
        else expect(reading.peak).toBeGreaterThan(0.7 * 5 + 0.1);
      }
      expect(new Set(readings.map((r) => r.shape)).size).toBeGreaterThanOrEqual(3);
    });
  }

  if (block.ask === "diagnose") {
    it("gives runs that fail, each fixed by exactly one of the changes on offer, and not always the same one", () => {
      const answers = block.runs.map((run) => {
        expect(simulateCheckRun(run).verdict.outcome).not.toBe("guaranteed");
        const fixing = FIXES.filter((fix) => simulateCheckRun(applyFix(run, block.fixes!, fix)).verdict.outcome === "guaranteed");
        expect(fixing, JSON.stringify(run)).toHaveLength(1);
        return fixing[0];
      });
      expect(new Set(answers).size).toBeGreaterThanOrEqual(2);
    });
  }

  if (block.ask === "pick-trace") {
    it("draws traces that differ visibly from one another", () => {
      const traces = block.runs.map((run) => simulateCheckRun(run).farEnd);
      for (let a = 0; a < traces.length; a += 1) {
        for (let b = a + 1; b < traces.length; b += 1) {
          const n = Math.min(traces[a].length, traces[b].length);
          let widest = 0;
          for (let i = 0; i < n; i += 1) widest = Math.max(widest, Math.abs(traces[a][i] - traces[b][i]));
          expect(widest, `runs ${a} and ${b}`).toBeGreaterThan(0.5);
        }
      }
    });

    it("letters the described run differently for different learners", () => {
      expect(new Set(SEEDS.map((seed) => correctChoice(block, seed))).size).toBeGreaterThanOrEqual(3);
    });
  }

  it("accepts the computed answer and refuses every other option, for every seed", () => {
    for (const seed of SEEDS) {
      const shown = presentChoiceCheck(block, seed);
      const right = correctChoice(block, seed);
      expect(shown.options.map((o) => o.key)).toContain(right);
      for (const option of shown.options) expect(gradeChoiceCheck(block, seed, option.key).status).toBe(option.key === right ? "correct" : "incorrect");
      expect(gradeChoiceCheck(block, seed, "not-an-option").status).toBe("unreadable");
    }
  });

  it("shows nothing before an answer that names the right option", () => {
    for (const seed of SEEDS) {
      const shown = presentChoiceCheck(block, seed);
      const right = shown.options.find((o) => o.key === correctChoice(block, seed))!;
      // Every trace's letter is on the page; what must not be is text tying one of them to the run.
      const page = [block.prompt, block.hint, shown.run, shown.symptom ?? ""].join("\n");
      expect(page).not.toContain(right.label);
      if (block.ask === "predict") expect(shown.traces).toEqual([]);
    }
  });
});

describe("a run in words", () => {
  it("keeps units' capitals inside the sentence", () => {
    expect(describeCheckRun(bufferRun("coax-75", 10, 47))).toBe("5 V buffered output, 10 m of 75 Ω coax, a 47 Ω series resistor");
    expect(describeCheckRun(bufferRun("twisted-pair", 8, 0))).toBe("5 V buffered output, 8 m of twisted pair, no series resistor");
  });
});
