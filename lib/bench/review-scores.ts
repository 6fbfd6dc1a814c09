import type { BenchExercise } from "@/lessons";

export type ReviewScoreRow = { id: string; label: string; points: number | null; maximum: number | null };

/**
 * A stored review's points set against the exercise's rubric as it stands now. A review keeps the
 * criterion ids of the rubric it was given under, and rubrics get reworded and regrouped: a
 * criterion added since has no points (null) rather than a misleading 0, and points given under a
 * criterion since removed are still listed, by their stored id, with no maximum.
 */
export function describeReviewScores(rubric: BenchExercise["rubric"], scores: Record<string, unknown>): ReviewScoreRow[] {
  const pointsOf = (id: string) => {
    const value = Object.hasOwn(scores, id) ? scores[id] : undefined;
    return typeof value === "number" && Number.isFinite(value) ? value : null;
  };
  const current = new Set(rubric.map((c) => c.id));
  const earlier = Object.keys(scores).filter((id) => !current.has(id) && pointsOf(id) !== null);
  return [
    ...rubric.map((c) => ({ id: c.id, label: c.criterion, points: pointsOf(c.id), maximum: c.points })),
    ...earlier.map((id) => ({ id, label: `Earlier rubric: ${id.replaceAll("-", " ")}`, points: pointsOf(id), maximum: null })),
  ];
}
