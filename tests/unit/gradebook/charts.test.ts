import { describe, expect, it } from "vitest";
import { getCourse } from "@/lessons";
import { assembleGradebook, attemptsPerDay, gradebookItems, scoreDistributions, type CellRow, type LearnerRow } from "@/lib/gradebook";

const items = gradebookItems(getCourse());
const now = new Date("2026-01-20T15:00:00Z");

const learner = (id: string, active = true): LearnerRow => ({
  learnerId: id,
  name: id,
  email: `${id}@school.example`,
  active,
  enrolledAt: new Date("2026-01-05T00:00:00Z"),
  lastLessonActivityAt: null,
});

const best = (learnerId: string, bestScore: number): CellRow => ({
  learnerId,
  kind: "lab",
  slug: items[0].slug,
  bestScore,
  passed: bestScore >= 60,
  attempts: 1,
  failedAttempts: 0,
  lastActivityAt: now,
  benchStatus: null,
});

describe("score distribution", () => {
  it("bins each learner's best score by tenths, 100 in the top bin, and counts those without a score", () => {
    const book = assembleGradebook({
      items,
      learners: ["a", "b", "c", "d", "e"].map((id) => learner(id)).concat(learner("off", false)),
      cells: [best("a", 0), best("b", 9), best("c", 10), best("d", 100), best("off", 55)],
      cohortStartsOn: "2026-01-12",
      now,
    });
    const [first] = scoreDistributions(book);
    expect(first.label).toBe("Lab 1");
    expect(first.bins).toHaveLength(10);
    expect(first.bins[0]).toEqual({ label: "0–9", from: 0, to: 9, learners: 2 });
    expect(first.bins[1].learners).toBe(1);
    expect(first.bins[9]).toEqual({ label: "90–100", from: 90, to: 100, learners: 1 });
    expect(first.bins[5].learners).toBe(0);
    expect(first.unscored).toBe(1);
  });
});

describe("attempts per day", () => {
  it("fills every day from the cohort's start to today with passed and failed counts", () => {
    const days = attemptsPerDay({
      rows: [
        { day: "2026-01-13", attempts: 5, passed: 2 },
        { day: "2026-01-16", attempts: 1, passed: 1 },
      ],
      startsOn: "2026-01-12",
      endsOn: "2026-04-03",
      now,
    });
    expect(days.map((d) => d.day)).toEqual([
      "2026-01-12", "2026-01-13", "2026-01-14", "2026-01-15", "2026-01-16", "2026-01-17", "2026-01-18", "2026-01-19", "2026-01-20",
    ]);
    expect(days[1]).toEqual({ day: "2026-01-13", passed: 2, failed: 3 });
    expect(days[4]).toEqual({ day: "2026-01-16", passed: 1, failed: 0 });
    expect(days[8]).toEqual({ day: "2026-01-20", passed: 0, failed: 0 });
  });

  it("reaches back to attempts made before the start and stops at the cohort's end", () => {
    const days = attemptsPerDay({
      rows: [{ day: "2026-01-10", attempts: 1, passed: 0 }],
      startsOn: "2026-01-12",
      endsOn: "2026-01-14",
      now: new Date("2026-02-01T00:00:00Z"),
    });
    expect(days.map((d) => d.day)).toEqual(["2026-01-10", "2026-01-11", "2026-01-12", "2026-01-13", "2026-01-14"]);
  });

  it("is empty for a cohort that has not started and has no attempts", () => {
    expect(attemptsPerDay({ rows: [], startsOn: "2026-05-01", endsOn: "2026-07-01", now })).toEqual([]);
  });

  it("shows at most the latest year", () => {
    const days = attemptsPerDay({ rows: [], startsOn: "2024-01-01", endsOn: "2027-01-01", now });
    expect(days).toHaveLength(366);
    expect(days.at(-1)!.day).toBe("2026-01-20");
  });
});
