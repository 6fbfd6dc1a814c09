import { count, eq, inArray } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { seedDemoActivity } from "@/db/demo-activity";
import { demoCohorts, demoLearnerEmail } from "@/db/demo-data";
import { listBenchReviewQueue } from "@/db/queries/bench";
import { benchSubmissions, cohorts, labAttempts, lessonProgress, quickCheckAnswers, users, type User } from "@/db/schema";
import { getLab, getLesson } from "@/lessons";
import { correctChoice, numericCheckFor, presentChoiceCheck, quickCheckSeed } from "@/lib/quick-checks";
import { gradeNumericAnswer } from "@/lib/answers";
import { stuckRule } from "@/lib/gradebook";
import { loadCohortGradebook } from "@/lib/gradebook/load";
import { gradeAttempt, storedOutcomeSchema, variantSeedFor } from "@/lib/grading";
import { getCourseProgress } from "@/lib/progress";

// The demo school's seeded activity (scripts/seed.ts → db/demo-activity.ts) on the real test
// database: true to the grader and the course rules, what the instructor's pages need to show
// something, and added only once however often the seed runs.

const allLearnerNames = demoCohorts.flatMap((cohort) => cohort.learners);
const firstLearnerNames = demoCohorts.map((cohort) => cohort.learners[0]);

async function learnersNamed(names: readonly string[]): Promise<User[]> {
  return db.select().from(users).where(inArray(users.email, names.map(demoLearnerEmail)));
}

async function rowCounts(userIds: string[]) {
  const [attempts] = await db.select({ n: count() }).from(labAttempts).where(inArray(labAttempts.userId, userIds));
  const [answers] = await db.select({ n: count() }).from(quickCheckAnswers).where(inArray(quickCheckAnswers.userId, userIds));
  const [lessons] = await db.select({ n: count() }).from(lessonProgress).where(inArray(lessonProgress.userId, userIds));
  const [bench] = await db.select({ n: count() }).from(benchSubmissions).where(inArray(benchSubmissions.learnerId, userIds));
  return { attempts: attempts!.n, answers: answers!.n, lessons: lessons!.n, bench: bench!.n };
}

let learners: User[];
let learnerIds: string[];

beforeAll(async () => {
  // The test run seeds before the suites; seeding here as well covers a database seeded by an older script.
  await seedDemoActivity(db);
  learners = await learnersNamed(allLearnerNames);
  learnerIds = learners.map((learner) => learner.id);
  expect(learners).toHaveLength(allLearnerNames.length);
}, 120_000);

describe("the demo school's seeded activity", () => {
  it("adds nothing when the seed runs again", async () => {
    const before = await rowCounts(learnerIds);
    expect(before.attempts).toBeGreaterThanOrEqual(100);
    const summary = await seedDemoActivity(db);
    expect(summary).toEqual({ learners: 0, attempts: 0, answers: 0, benchHandIns: 0 });
    expect(await rowCounts(learnerIds)).toEqual(before);
  });

  it("leaves the first learner of each cohort with no work at all", async () => {
    const first = await learnersNamed(firstLearnerNames);
    expect(first).toHaveLength(2);
    const counts = await rowCounts(first.map((learner) => learner.id));
    expect({ attempts: counts.attempts, answers: counts.answers }).toEqual({ attempts: 0, answers: 0 });
  });

  it("gives the instructors a learner stuck on a lab and one gone quiet, by the grade book's rule", async () => {
    const attention: { name: string; kind: string; failedAttempts?: number; idleDays?: number }[] = [];
    for (const cohort of demoCohorts) {
      const [instructor] = await db.select().from(users).where(eq(users.email, cohort.instructor.email));
      const [row] = await db.select({ id: cohorts.id }).from(cohorts).where(eq(cohorts.name, cohort.name));
      const loaded = await loadCohortGradebook({
        cohortId: row!.id,
        viewer: { id: instructor!.id, role: instructor!.role, schoolId: instructor!.schoolId },
      });
      for (const gradebookRow of loaded!.gradebook.rows) {
        for (const item of gradebookRow.attention) {
          if (item.kind === "failing") attention.push({ name: gradebookRow.learner.name, kind: "failing", failedAttempts: item.failedAttempts });
          // Idle after having worked, not merely never started.
          if (item.kind === "idle" && item.lastActivityAt) attention.push({ name: gradebookRow.learner.name, kind: "idle", idleDays: item.idleDays });
        }
      }
    }
    const stuck = attention.filter((a) => a.kind === "failing");
    const idle = attention.filter((a) => a.kind === "idle");
    expect(stuck.length).toBeGreaterThanOrEqual(1);
    expect(idle.length).toBeGreaterThanOrEqual(1);
    for (const a of stuck) expect(a.failedAttempts).toBeGreaterThanOrEqual(stuckRule.failedAttempts);
    for (const a of idle) expect(a.idleDays).toBeGreaterThanOrEqual(stuckRule.idleDays);
  });

  it("stores every attempt with the score and verdict a re-grade of its choices gives", async () => {
    const attempts = await db.select().from(labAttempts).where(inArray(labAttempts.userId, learnerIds));
    expect(attempts.length).toBeGreaterThanOrEqual(100);
    expect(attempts.some((a) => a.passed)).toBe(true);
    expect(attempts.some((a) => !a.passed)).toBe(true);
    for (const attempt of attempts) {
      const lab = getLab(attempt.labSlug)!;
      const answers = Object.fromEntries(storedOutcomeSchema.parse(attempt.outcome).questions.map((q) => [q.id, q.entry]));
      const regraded = gradeAttempt({ lab, seed: attempt.variantSeed, choices: attempt.choices, answers, attemptNumber: attempt.attemptNumber });
      expect(attempt.variantSeed).toBe(variantSeedFor(attempt.userId, attempt.labSlug));
      expect({ id: attempt.id, score: attempt.score, passed: attempt.passed }).toEqual({ id: attempt.id, score: regraded.score, passed: regraded.passed });
    }
  }, 180_000);

  it("stores quick-check answers marked as the quantity parser marks them, and lesson rows the course map agrees with", async () => {
    const answers = await db.select().from(quickCheckAnswers).where(inArray(quickCheckAnswers.userId, learnerIds));
    expect(answers.some((a) => !a.correct)).toBe(true);
    for (const answer of answers) {
      const lesson = getLesson(answer.lessonSlug)!;
      const check = lesson.blocks.find((block) => (block.kind === "check" || block.kind === "choice") && block.id === answer.checkId);
      const seed = quickCheckSeed(answer.userId, lesson.slug, answer.checkId);
      if (check?.kind === "check") {
        expect({ entry: answer.entry, correct: answer.correct }).toEqual({ entry: answer.entry, correct: gradeNumericAnswer(answer.entry, numericCheckFor(check, seed).answer).correct });
      } else {
        expect(check?.kind).toBe("choice");
        if (check?.kind !== "choice") continue;
        const option = presentChoiceCheck(check, seed).options.find((o) => o.label === answer.entry);
        expect({ entry: answer.entry, correct: answer.correct }).toEqual({ entry: answer.entry, correct: option?.key === correctChoice(check, seed) });
      }
    }
    const seeded = learners.filter((learner) => !firstLearnerNames.some((name) => demoLearnerEmail(name) === learner.email));
    for (const learner of seeded) {
      const progress = await getCourseProgress({ userId: learner.id });
      expect(progress.lessons.filter((lesson) => lesson.completionToRecord).map((lesson) => lesson.slug)).toEqual([]);
      expect(progress.lessonsDone).toBe(progress.labsPassed);
    }
  });

  it("puts bench work in each demo instructor's review queue, with stated values in SI", async () => {
    for (const cohort of demoCohorts) {
      const [instructor] = await db.select({ id: users.id }).from(users).where(eq(users.email, cohort.instructor.email));
      const queue = await listBenchReviewQueue({ instructorId: instructor!.id });
      expect(queue.length).toBeGreaterThanOrEqual(1);
    }
    const waiting = await db.select().from(benchSubmissions).where(inArray(benchSubmissions.learnerId, learnerIds));
    const seededWaiting = waiting.filter((s) => s.status === "submitted" && s.note !== "Route walk fixture.");
    expect(seededWaiting.length).toBeGreaterThanOrEqual(2);
    for (const submission of seededWaiting) {
      expect(submission.lengthM).toBeGreaterThan(1);
      expect(submission.lengthM).toBeLessThan(100);
      expect(submission.riseTimeS).toBeGreaterThan(1e-9);
      expect(submission.riseTimeS).toBeLessThan(1e-6);
      expect(submission.submittedAt).not.toBeNull();
    }
  });
});
