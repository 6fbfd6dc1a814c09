import { describe, expect, it } from "vitest";
import { findBenchExercise } from "@/lib/bench/exercises";
import { describeReviewScores } from "@/lib/bench/review-scores";

const rubric = findBenchExercise("build-a-run")!.exercise.rubric;

describe("describeReviewScores", () => {
  it("gives each criterion of the rubric its stored points and maximum, in rubric order", () => {
    const scores = Object.fromEntries(rubric.map((c, index) => [c.id, index]));
    const rows = describeReviewScores(rubric, scores);
    expect(rows.map((r) => [r.id, r.label, r.points, r.maximum])).toEqual(rubric.map((c, index) => [c.id, c.criterion, index, c.points]));
  });

  it("lists points stored under criteria no longer in the rubric, and shows none for the rubric's own", () => {
    const rows = describeReviewScores(rubric, { design: 4, measurement: 3, comparison: 2 });
    expect(rows.filter((r) => r.maximum !== null).map((r) => r.points)).toEqual(rubric.map(() => null));
    expect(rows.filter((r) => r.maximum === null)).toEqual([
      { id: "design", label: "Earlier rubric: design", points: 4, maximum: null },
      { id: "measurement", label: "Earlier rubric: measurement", points: 3, maximum: null },
      { id: "comparison", label: "Earlier rubric: comparison", points: 2, maximum: null },
    ]);
  });

  it("ignores stored values that are not numbers, and keys the object inherits", () => {
    const scores = JSON.parse('{"measurement-correct": "3", "photo-readable": null, "constructor": 1, "__proto__": {"trace-readable": 2}}') as Record<string, unknown>;
    const rows = describeReviewScores(rubric, scores);
    expect(rows.find((r) => r.id === "measurement-correct")!.points).toBeNull();
    expect(rows.find((r) => r.id === "trace-readable")!.points).toBeNull();
    expect(rows.map((r) => r.id)).toEqual([...rubric.map((c) => c.id), "constructor"]);
  });
});
