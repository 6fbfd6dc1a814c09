import { describe, expect, it } from "vitest";
import { getCourse, type Course } from "@/lessons";
import { quickCheckIds } from "@/lessons/schema";
import {
  checkKey,
  computeCourseProgress,
  type CheckFact,
  type LabFact,
  type LearnerRecord,
  type LessonFact,
  type BenchState,
} from "@/lib/progress/course-progress";

type Lesson = Course["lessons"][number];

const course = getCourse();
const [first, second] = course.lessons;
const checkIdsOf = (lesson: Lesson) => quickCheckIds(lesson.blocks);

const at = (minute: number) => new Date(Date.UTC(2026, 0, 12, 18, minute));

type RecordParts = {
  labs?: [string, LabFact][];
  checks?: [string, CheckFact][];
  lessons?: [string, LessonFact][];
  bench?: [string, Exclude<BenchState, "not-started">][];
};

function record(parts: RecordParts = {}): LearnerRecord {
  return { labs: new Map(parts.labs ?? []), checks: new Map(parts.checks ?? []), lessons: new Map(parts.lessons ?? []), bench: new Map(parts.bench ?? []) };
}

function allChecksRight(lesson: Lesson, minute = 10): [string, CheckFact][] {
  return checkIdsOf(lesson).map((id, i) => [checkKey(lesson.slug, id), { answers: 1, firstCorrectAt: at(minute + i) }]);
}

function lessonOneDone(): LearnerRecord {
  return record({
    labs: [[first!.lab!.slug, { attempts: 2, bestScore: 84, bestPassingScore: 84, firstPassedAt: at(40) }]],
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
    const labs = new Map([[first!.lab!.slug, { attempts: 1, bestScore: 90, bestPassingScore: 90, firstPassedAt: at(1) }]]);
    const progress = computeCourseProgress(course, { ...passedEarly, labs });
    expect(progress.lessons[0]!.completedAt).toEqual(at(10 + checkIdsOf(first!).length - 1));
  });

  it("a passed lab without every check right is not done, nor are right checks without a passed lab", () => {
    const [, ...allButOne] = allChecksRight(first!);
    const labOnly = record({ labs: [[first!.lab!.slug, { attempts: 1, bestScore: 80, bestPassingScore: 80, firstPassedAt: at(5) }]], checks: allButOne });
    expect(computeCourseProgress(course, labOnly).lessons[0]).toMatchObject({ state: "open", completedAt: null, checks: { correct: allButOne.length } });

    const failedLab = record({ labs: [[first!.lab!.slug, { attempts: 3, bestScore: 41, bestPassingScore: null, firstPassedAt: null }]], checks: allChecksRight(first!) });
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

  it("lists each lesson's bench exercise with the state of the learner's work, under the lesson's lock", () => {
    const withBench = course.lessons.filter((l) => l.bench);
    expect(withBench.length).toBeGreaterThan(0);
    const [firstBench, secondBench] = withBench;
    const progress = computeCourseProgress(course, record({ bench: [[firstBench!.bench!.slug, "returned"]] }));
    const view = progress.lessons.find((l) => l.slug === firstBench!.slug)!;
    expect(view).toMatchObject({ state: "locked", bench: { slug: firstBench!.bench!.slug, state: "returned" } });
    expect(view.bench!.requiredForCertificate).toBe(course.completion.benchExercises.includes(firstBench!.bench!.slug));
    if (secondBench) expect(progress.lessons.find((l) => l.slug === secondBench.slug)!.bench!.state).toBe("not-started");
    expect(progress.lessons.filter((l) => !course.lessons.find((c) => c.slug === l.slug)!.bench).every((l) => l.bench === null)).toBe(true);
  });

  it("tells a pass that meets the certificate's minimum from one that does not", () => {
    const lab = first!.lab!.slug;
    const minimum = course.completion.labs.find((entry) => entry.lab === lab)!.minScore;
    const below = computeCourseProgress(course, record({ labs: [[lab, { attempts: 2, bestScore: minimum + 5, bestPassingScore: minimum - 1, firstPassedAt: at(3) }]] }));
    expect(below.lessons[0]!.lab).toMatchObject({ passed: true, certificateMinScore: minimum, meetsCertificate: false });
    const at_ = computeCourseProgress(course, record({ labs: [[lab, { attempts: 1, bestScore: minimum, bestPassingScore: minimum, firstPassedAt: at(3) }]] }));
    expect(at_.lessons[0]!.lab).toMatchObject({ meetsCertificate: true });
  });
});
