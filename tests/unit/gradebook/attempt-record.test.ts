import { describe, expect, it } from "vitest";
import type { LabAttempt } from "@/db/schema";
import { getCourse, getLab, type Lab } from "@/lessons";
import { formatInUnit } from "@/lib/answers";
import { attemptRecord } from "@/lib/gradebook";
import { gradeAttempt, outcomeOf, variantSeedFor } from "@/lib/grading";
import { simulateRun } from "@/lib/sim";

const labs = getCourse().lessons.flatMap((lesson) => (lesson.lab ? [lesson.lab] : []));

function rightAnswers(lab: Lab): Record<string, string> {
  return Object.fromEntries(lab.questions.map((q) => [q.id, formatInUnit(q.answer.value, q.answer.unit)]));
}

function storedAttempt(labSlug: string, choices: unknown, seed: string): LabAttempt {
  const lab = getLab(labSlug)!;
  const grade = gradeAttempt({ lab, seed, choices, answers: rightAnswers(lab), attemptNumber: 2 });
  return {
    id: "00000000-0000-4000-8000-000000000001",
    userId: "00000000-0000-4000-8000-000000000002",
    labSlug,
    cohortId: null,
    idempotencyKey: "k",
    attemptNumber: 2,
    variantSeed: seed,
    choices: grade.choices,
    outcome: outcomeOf(grade),
    score: grade.score,
    passed: grade.passed,
    createdAt: new Date("2026-02-03T18:45:00Z"),
  };
}

describe("a stored attempt, rebuilt for the learner's page", () => {
  for (const lab of labs) {
    it(`${lab.slug}: redraws every run exactly as it was graded`, () => {
      const mistake = lab.reference.mistakes[0];
      const attempt = storedAttempt(lab.slug, mistake.choices, variantSeedFor("learner-under-test", lab.slug));
      const record = attemptRecord(lab, attempt);
      const graded = (attempt.outcome as { runs: { runId: string; decoded: string; pass: boolean }[] }).runs;

      expect(record).toMatchObject({ attemptNumber: 2, score: attempt.score, passed: attempt.passed });
      expect(record.runs.map((run) => run.runId)).toEqual(lab.runs.map((run) => run.id));
      for (const run of record.runs) {
        const stored = graded.find((g) => g.runId === run.runId)!;
        expect(run.input).not.toBeNull();
        expect(simulateRun(run.input!).decoded).toBe(stored.decoded);
        expect(run.pass).toBe(stored.pass);
        expect(run.chosen).not.toBe("nothing chosen");
      }
    });
  }

  it("says what was chosen in the trade's units, and why a failing run failed", () => {
    const lab = getLab("lone-lead-termination")!;
    const runId = lab.runs[0].id;
    const attempt = storedAttempt(lab.slug, { [runId]: { seriesResistance: 33 } }, "seed-words");
    const [run] = attemptRecord(lab, attempt).runs;
    expect(run.chosen).toBe("33 Ω");
    expect(run.setting).toMatch(/^Data lead on its own, \d+(\.\d+)? m, /);
    expect(run.pass).toBe(false);
    expect(run.failures.length).toBeGreaterThan(0);
  });

  it("keeps the attempt listed but not redrawable when its stored choices no longer fit the lab", () => {
    const lab = getLab("thresholds")!;
    const attempt = { ...storedAttempt(lab.slug, lab.reference.solution, "seed-old"), choices: { [lab.runs[0].id]: { flux: 3 } } };
    const [run] = attemptRecord(lab, attempt).runs;
    expect(run.input).toBeNull();
    expect(run.chosen).toBe("choices not readable");
  });
});
