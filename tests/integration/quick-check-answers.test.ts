/** Quick-check answers as the lesson page stores and reads them back, against the real database. */
import { and, asc, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { listQuickCheckStatesByLesson, recordQuickCheckAnswer } from "@/db/queries/quick-checks";
import { quickCheckAnswers } from "@/db/schema";
import { getCourse, type CheckBlock } from "@/lessons";
import { formatInUnit, gradeNumericAnswer } from "@/lib/answers";
import { numericCheckFor, quickCheckSeed } from "@/lib/quick-checks";
import { createPerson } from "./support/people";

const lesson = getCourse().lessons[0]!;
const [bitRate, wordHighTime] = lesson.blocks.filter((b): b is CheckBlock => b.kind === "check");

/** The learner's own given of a check: its numbers in SI, and its answer as the lesson prints it. */
function givenOf(userId: string, check: CheckBlock) {
  const given = numericCheckFor(check, quickCheckSeed(userId, lesson.slug, check.id));
  return { ...given, right: formatInUnit(given.answer.value, given.answer.unit) };
}

async function answer(userId: string, check: CheckBlock, entry: string) {
  const grade = gradeNumericAnswer(entry, givenOf(userId, check).answer);
  await recordQuickCheckAnswer({ userId, lessonSlug: lesson.slug, checkId: check.id, entry, value: grade.value, correct: grade.correct });
  return grade;
}

describe("quick-check answers", () => {
  it("stores every try with its SI value, or no value when the entry could not be read", async () => {
    const learner = await createPerson({ role: "learner", password: "answers with units" });
    expect((await answer(learner.id, bitRate!, "3 V")).status).toBe("unreadable");
    expect((await answer(learner.id, bitRate!, "500 kHz")).status).toBe("incorrect");
    const period = givenOf(learner.id, bitRate!).given.period!.value;
    const calculation = `1/(${formatInUnit(period, "us")})`;
    expect((await answer(learner.id, bitRate!, calculation)).status).toBe("correct");

    const rows = await db
      .select({ entry: quickCheckAnswers.entry, value: quickCheckAnswers.value, correct: quickCheckAnswers.correct })
      .from(quickCheckAnswers)
      .where(and(eq(quickCheckAnswers.userId, learner.id), eq(quickCheckAnswers.checkId, bitRate!.id)))
      .orderBy(asc(quickCheckAnswers.createdAt));
    expect(rows).toEqual([
      { entry: "3 V", value: null, correct: false },
      { entry: "500 kHz", value: expect.closeTo(500e3, 6), correct: false },
      { entry: calculation, value: expect.closeTo(1 / period, 6), correct: true },
    ]);
  });

  it("reads back, per check, how often it was tried, the last entry and the latest right one", async () => {
    const learner = await createPerson({ role: "learner", password: "answers with units" });
    const right = givenOf(learner.id, bitRate!).right;
    await answer(learner.id, bitRate!, right);
    await answer(learner.id, bitRate!, "8 kHz");
    await answer(learner.id, wordHighTime!, "11 us");

    const states = await listQuickCheckStatesByLesson({ userId: learner.id, lessonSlug: lesson.slug });
    expect(states.sort((a, b) => a.checkId.localeCompare(b.checkId))).toEqual(
      [
        { checkId: bitRate!.id, answers: 2, lastEntry: "8 kHz", correctEntry: right },
        { checkId: wordHighTime!.id, answers: 1, lastEntry: "11 us", correctEntry: null },
      ].sort((a, b) => a.checkId.localeCompare(b.checkId)),
    );
  });

  it("shows a learner only their own answers", async () => {
    const one = await createPerson({ role: "learner", password: "answers with units" });
    const other = await createPerson({ role: "learner", password: "answers with units" });
    await answer(one.id, bitRate!, givenOf(one.id, bitRate!).right);
    await expect(listQuickCheckStatesByLesson({ userId: other.id, lessonSlug: lesson.slug })).resolves.toEqual([]);
  });

  it("grades each learner against their own given: one learner's right answer is another's wrong one", async () => {
    const learners = await Promise.all(Array.from({ length: 8 }, () => createPerson({ role: "learner", password: "answers with units" })));
    const givens = learners.map((learner) => givenOf(learner.id, bitRate!));
    const b = givens.findIndex((given) => given.answer.value !== givens[0]!.answer.value);
    const a = 0;
    expect((await answer(learners[a]!.id, bitRate!, givens[a]!.right)).status).toBe("correct");
    expect((await answer(learners[b]!.id, bitRate!, givens[a]!.right)).status).toBe("incorrect");
  });
});
