import { describe, expect, it } from "vitest";
import { getCourse, type Course } from "@/lessons";
import {
  checkKey,
  computeCourseProgress,
  type CheckFact,
  type LabFact,
  type LearnerRecord,
  type LessonFact,
} from "@/lib/progress/course-progress";

type Lesson = Course["lessons"][number];

const course = getCourse();
const [first, second] = course.lessons;
const checkIdsOf = (lesson: Lesson) => lesson.blocks.flatMap((b) => (b.kind === "check" ? [b.id] : []));

const at = (minute: number) => new Date(Date.UTC(2026, 0, 12, 18, minute));

function record(parts: { labs?: [string, LabFact][]; checks?: [string, CheckFact][]; lessons?: [string, LessonFact][] } = {}): LearnerRecord {
  return { labs: new Map(parts.labs ?? []), checks: new Map(parts.checks ?? []), lessons: new Map(parts.lessons ?? []) };
}

function allChecksRight(lesson: Lesson, minute = 10): [string, CheckFact][] {
  return checkIdsOf(lesson).map((id, i) => [checkKey(lesson.slug, id), { answers: 1, firstCorrectAt: at(minute + i) }]);
}

function lessonOneDone(): LearnerRecord {
  return record({
    labs: [[first!.lab!.slug, { attempts: 2, bestScore: 84, firstPassedAt: at(40) }]],
    checks: allChecksRight(first!),
  });
}

describe("course progress rules", () => {
  it("a new learner has lesson 1 open, every later lesson locked behind the one before, and lesson 1 next", () => {
    const progress = computeCourseProgress(course, record());
    expect(progress.lessons.map((l) => l.state)).toEqual(["open", ...Array(course.lessons.length - 1).fill("locked")]);
    expect(progress.lessons[1]!.waitsFor).toMatchObject({ slug: first!.slug, number: 1 });
    expect(progress.lessons[2]!.waitsFor).toMatchObject({ slug: second!.slug, number: 2 });
    expect(progress.next?.slug).toBe(first!.slug);
    expect(progress).toMatchObject({ lessonsDone: 0, labsPassed: 0 });
  });

  it("a passed lab and every check answered right make a lesson done and open the next, dated by the later event", () => {
    const progress = computeCourseProgress(course, lessonOneDone());
    expect(progress.lessons.slice(0, 3).map((l) => l.state)).toEqual(["done", "open", "locked"]);
    expect(progress.lessons[0]).toMatchObject({
      completedAt: at(40),
      completionToRecord: true,
      lab: { passed: true, bestScore: 84, attempts: 2 },
      checks: { total: checkIdsOf(first!).length, answered: checkIdsOf(first!).length, correct: checkIdsOf(first!).length },
    });
    expect(progress.next?.slug).toBe(second!.slug);
    expect(progress).toMatchObject({ lessonsDone: 1, labsPassed: 1 });
  });

  it("the completion moment is the last check when the lab was passed first", () => {
    const passedEarly = lessonOneDone();
    const labs = new Map([[first!.lab!.slug, { attempts: 1, bestScore: 90, firstPassedAt: at(1) }]]);
    const progress = computeCourseProgress(course, { ...passedEarly, labs });
    expect(progress.lessons[0]!.completedAt).toEqual(at(10 + checkIdsOf(first!).length - 1));
  });

  it("a passed lab without every check right is not done, nor are right checks without a passed lab", () => {
    const [, ...allButOne] = allChecksRight(first!);
    const labOnly = record({ labs: [[first!.lab!.slug, { attempts: 1, bestScore: 80, firstPassedAt: at(5) }]], checks: allButOne });
    expect(computeCourseProgress(course, labOnly).lessons[0]).toMatchObject({ state: "open", completedAt: null, checks: { correct: allButOne.length } });

    const failedLab = record({ labs: [[first!.lab!.slug, { attempts: 3, bestScore: 41, firstPassedAt: null }]], checks: allChecksRight(first!) });
    const progress = computeCourseProgress(course, failedLab);
    expect(progress.lessons[0]).toMatchObject({ state: "open", lab: { passed: false, bestScore: 41 } });
    expect(progress.lessons[1]!.state).toBe("locked");
  });

  it("a wrong answer counts as answered but not as right", () => {
    const id = checkIdsOf(first!)[0]!;
    const progress = computeCourseProgress(course, record({ checks: [[checkKey(first!.slug, id), { answers: 3, firstCorrectAt: null }]] }));
    expect(progress.lessons[0]!.checks).toMatchObject({ answered: 1, correct: 0 });
  });

  it("answers to a check id the lesson no longer has do not count", () => {
    const progress = computeCourseProgress(course, record({ checks: [[checkKey(first!.slug, "retired-check"), { answers: 1, firstCorrectAt: at(1) }]] }));
    expect(progress.lessons[0]!.checks).toMatchObject({ answered: 0, correct: 0 });
  });

  it("a recorded completion stays done even when the rule is no longer met, and is not recorded again", () => {
    const progress = computeCourseProgress(course, record({ lessons: [[first!.slug, { startedAt: at(0), completedAt: at(50) }]] }));
    expect(progress.lessons[0]).toMatchObject({ state: "done", completedAt: at(50), completionToRecord: false, startedAt: at(0) });
    expect(progress.lessons[1]!.state).toBe("open");
  });

  it("work done in a later lesson does not open it while the one before is unfinished", () => {
    const progress = computeCourseProgress(course, record({ checks: allChecksRight(second!) }));
    expect(progress.lessons[1]).toMatchObject({ state: "locked", checks: { correct: checkIdsOf(second!).length } });
  });

  it("opens every lesson when the course does not unlock in order", () => {
    const progress = computeCourseProgress({ ...course, unlockInOrder: false }, record());
    expect(new Set(progress.lessons.map((l) => l.state))).toEqual(new Set(["open"]));
    expect(progress.lessons.every((l) => l.waitsFor === null)).toBe(true);
    expect(progress.next?.slug).toBe(first!.slug);
  });

  it("has no next lesson once every lesson is done", () => {
    const lessons = course.lessons.map((l, i): [string, LessonFact] => [l.slug, { startedAt: at(i), completedAt: at(i + 1) }]);
    const progress = computeCourseProgress(course, record({ lessons }));
    expect(progress.next).toBeNull();
    expect(progress.lessonsDone).toBe(course.lessons.length);
  });
});
