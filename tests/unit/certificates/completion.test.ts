import { describe, expect, it } from "vitest";
import { getCourse } from "@/lessons";
import { evaluateCompletion, type CompletionFacts } from "@/lib/certificates/completion";

const course = getCourse();

function passingFacts(): { bestPassingScores: Map<string, number>; acceptedBenchWork: Map<string, { points: number; maxPoints: number }> } {
  return {
    bestPassingScores: new Map(course.completion.labs.map(({ lab, minScore }) => [lab, minScore])),
    acceptedBenchWork: new Map(course.completion.benchExercises.map((slug) => [slug, { points: 7, maxPoints: 9 }])),
  };
}

describe("the completion rule", () => {
  it("is read from the course: labs with their minimum scores and bench exercises to be accepted", () => {
    expect(course.completion.labs.length).toBeGreaterThan(0);
    expect(course.completion.benchExercises.length).toBeGreaterThan(0);
  });

  it("is met with every lab exactly at its minimum and all bench work accepted, and sums the results up", () => {
    const facts: CompletionFacts = passingFacts();
    const status = evaluateCompletion(course, facts);
    expect(status.complete).toBe(true);
    const minima = course.completion.labs.map((lab) => lab.minScore);
    const mean = minima.reduce((a, b) => a + b, 0) / minima.length;
    expect(status.summary!.averageScore).toBeCloseTo(mean, 1);
    expect(status.summary!.labs.map((lab) => lab.bestScore)).toEqual(minima);
    expect(status.summary!.labs.every((lab) => lab.title.length > 0 && lab.title !== lab.slug)).toBe(true);
    expect(status.summary!.benchExercises).toHaveLength(course.completion.benchExercises.length);
  });

  it("rounds the average to one decimal", () => {
    const facts = passingFacts();
    const [first, second] = course.completion.labs;
    facts.bestPassingScores.set(first!.lab, 100);
    facts.bestPassingScores.set(second!.lab, 99);
    const scores = course.completion.labs.map(({ lab }) => facts.bestPassingScores.get(lab)!);
    const expected = Math.round((scores.reduce((a, b) => a + b, 0) / scores.length) * 10) / 10;
    expect(evaluateCompletion(course, facts).summary!.averageScore).toBe(expected);
  });

  it("is not met when one lab's best passing score is a point under its minimum", () => {
    const facts = passingFacts();
    const last = course.completion.labs.at(-1)!;
    facts.bestPassingScores.set(last.lab, last.minScore - 1);
    const status = evaluateCompletion(course, facts);
    expect(status.complete).toBe(false);
    expect(status.summary).toBeNull();
    expect(status.labs.filter((lab) => !lab.met).map((lab) => lab.slug)).toEqual([last.lab]);
  });

  it("is not met when a lab has no passing attempt", () => {
    const facts = passingFacts();
    facts.bestPassingScores.delete(course.completion.labs[0]!.lab);
    const status = evaluateCompletion(course, facts);
    expect(status.complete).toBe(false);
    expect(status.labs[0]).toMatchObject({ bestScore: null, met: false });
  });

  it("is not met while one bench exercise is not accepted", () => {
    const facts = passingFacts();
    const slug = course.completion.benchExercises.at(-1)!;
    facts.acceptedBenchWork.delete(slug);
    const status = evaluateCompletion(course, facts);
    expect(status.complete).toBe(false);
    expect(status.benchExercises.find((exercise) => exercise.slug === slug)).toMatchObject({ accepted: false, points: null });
  });

  it("ignores results for labs the rule does not list", () => {
    const facts = passingFacts();
    facts.bestPassingScores.set("not-a-listed-lab", 3);
    expect(evaluateCompletion(course, facts).summary!.labs.map((lab) => lab.slug)).toEqual(course.completion.labs.map((lab) => lab.lab));
  });
});
