/**
 * Course progress computed from real rows: lab attempts inserted as the grader stores them,
 * quick-check answers stored through the same query the lesson page's action uses.
 */
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { labAttempts, lessonProgress } from "@/db/schema";
import { getCourse } from "@/lessons";
import { getCourseProgress, isLessonOpen, recordLessonOpened } from "@/lib/progress";
import { answerCheck, quickChecksOf, rightEntryFor } from "./support/quick-checks";
import { createPerson } from "./support/people";

const course = getCourse();
const [first, second, third] = course.lessons;

const newLearner = () => createPerson({ role: "learner", password: "progress of a learner" });

async function insertAttempt(userId: string, labSlug: string, attempt: { number: number; score: number; passed: boolean; at: Date }) {
  await db.insert(labAttempts).values({
    userId,
    labSlug,
    idempotencyKey: randomUUID(),
    attemptNumber: attempt.number,
    variantSeed: `${userId}:${labSlug}`,
    choices: {},
    outcome: {},
    score: attempt.score,
    passed: attempt.passed,
    createdAt: attempt.at,
  });
}

/** Answers every check of a lesson the way the actions do: graded for the learner's own copy, then stored. */
async function answerAllChecks(userId: string, lesson: (typeof course.lessons)[number], except: string[] = []) {
  for (const check of quickChecksOf(lesson)) {
    if (except.includes(check.id)) continue;
    expect((await answerCheck(userId, lesson, check, rightEntryFor(userId, lesson, check))).correct).toBe(true);
  }
}

async function storedProgress(userId: string, lessonSlug: string) {
  const [row] = await db
    .select()
    .from(lessonProgress)
    .where(and(eq(lessonProgress.userId, userId), eq(lessonProgress.lessonSlug, lessonSlug)));
  return row;
}

describe("course progress against the database", () => {
  it("a new learner has lesson 1 open and every later lesson locked", async () => {
    const learner = await newLearner();
    const progress = await getCourseProgress({ userId: learner.id });
    expect(progress.lessons.map((l) => l.state)).toEqual(["open", ...Array(course.lessons.length - 1).fill("locked")]);
    expect(progress.next?.slug).toBe(first!.slug);
    await expect(isLessonOpen({ userId: learner.id, lessonSlug: first!.slug })).resolves.toBe(true);
    await expect(isLessonOpen({ userId: learner.id, lessonSlug: second!.slug })).resolves.toBe(false);
    await expect(isLessonOpen({ userId: learner.id, lessonSlug: "no-such-lesson" })).resolves.toBe(false);
  });

  it("records when a learner first opens a lesson and keeps that moment on later visits", async () => {
    const learner = await newLearner();
    await recordLessonOpened({ userId: learner.id, lessonSlug: first!.slug });
    const opened = await storedProgress(learner.id, first!.slug);
    expect(opened).toMatchObject({ completedAt: null });
    await new Promise((resolve) => setTimeout(resolve, 20));
    await recordLessonOpened({ userId: learner.id, lessonSlug: first!.slug });
    expect((await storedProgress(learner.id, first!.slug))!.startedAt).toEqual(opened!.startedAt);
    expect((await getCourseProgress({ userId: learner.id })).lessons[0]!.startedAt).toEqual(opened!.startedAt);
  });

  it("a passed lab and every check right finish lesson 1, stamp its completion once and open lesson 2", async () => {
    const learner = await newLearner();
    await recordLessonOpened({ userId: learner.id, lessonSlug: first!.slug });
    await answerAllChecks(learner.id, first!);
    const passedAt = new Date(Date.now() + 60_000);
    await insertAttempt(learner.id, first!.lab!.slug, { number: 1, score: 41, passed: false, at: new Date(Date.now() + 30_000) });
    await insertAttempt(learner.id, first!.lab!.slug, { number: 2, score: 78, passed: true, at: passedAt });
    await insertAttempt(learner.id, first!.lab!.slug, { number: 3, score: 92, passed: true, at: new Date(Date.now() + 90_000) });

    const progress = await getCourseProgress({ userId: learner.id });
    expect(progress.lessons.slice(0, 3).map((l) => l.state)).toEqual(["done", "open", "locked"]);
    expect(progress.lessons[0]).toMatchObject({ lab: { passed: true, bestScore: 92, attempts: 3 }, completedAt: passedAt });
    expect(progress).toMatchObject({ lessonsDone: 1, labsPassed: 1, next: { slug: second!.slug } });
    expect((await storedProgress(learner.id, first!.slug))!.completedAt).toEqual(passedAt);
    await expect(isLessonOpen({ userId: learner.id, lessonSlug: second!.slug })).resolves.toBe(true);
    await expect(isLessonOpen({ userId: learner.id, lessonSlug: third!.slug })).resolves.toBe(false);

    // A later right answer changes nothing about when the lesson was finished.
    await answerAllChecks(learner.id, first!);
    await getCourseProgress({ userId: learner.id });
    expect((await storedProgress(learner.id, first!.slug))!.completedAt).toEqual(passedAt);
  });

  it("a lesson stays open while one check is unanswered, however well the lab went", async () => {
    const learner = await newLearner();
    const missing = first!.blocks.find((b) => b.kind === "check")!;
    await answerAllChecks(learner.id, first!, [missing.kind === "check" ? missing.id : ""]);
    await insertAttempt(learner.id, first!.lab!.slug, { number: 1, score: 100, passed: true, at: new Date() });
    const progress = await getCourseProgress({ userId: learner.id });
    expect(progress.lessons[0]).toMatchObject({ state: "open", completedAt: null, lab: { passed: true } });
    expect(progress.lessons[1]!.state).toBe("locked");
    expect(await storedProgress(learner.id, first!.slug)).toBeUndefined();
  });

  it("wrong and unreadable answers are stored but do not count as right", async () => {
    const learner = await newLearner();
    const check = first!.blocks.find((b) => b.kind === "check")!;
    if (check.kind !== "check") throw new Error("lesson 1 has no check");
    for (const entry of ["3 V", "500 kHz"]) expect((await answerCheck(learner.id, first!, check, entry)).correct).toBe(false);
    const progress = await getCourseProgress({ userId: learner.id });
    expect(progress.lessons[0]!.checks).toMatchObject({ answered: 1, correct: 0 });
  });

  it("one learner's work never counts for another", async () => {
    const busy = await newLearner();
    const other = await newLearner();
    await answerAllChecks(busy.id, first!);
    await insertAttempt(busy.id, first!.lab!.slug, { number: 1, score: 88, passed: true, at: new Date() });
    expect((await getCourseProgress({ userId: busy.id })).lessons[0]!.state).toBe("done");
    const progress = await getCourseProgress({ userId: other.id });
    expect(progress.lessons[0]).toMatchObject({ state: "open", checks: { answered: 0 }, lab: { attempts: 0, bestScore: null } });
  });
});
