/** Quick-check answers as the lesson page stores and reads them back, against the real database. */
import { and, asc, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { listQuickCheckStatesByLesson, recordQuickCheckAnswer } from "@/db/queries/quick-checks";
import { quickCheckAnswers } from "@/db/schema";
import { getCourse, type CheckBlock } from "@/lessons";
import { gradeNumericAnswer } from "@/lib/answers";
import { createPerson } from "./support/people";

const lesson = getCourse().lessons[0]!;
const [bitRate, wordHighTime] = lesson.blocks.filter((b): b is CheckBlock => b.kind === "check");

async function answer(userId: string, check: CheckBlock, entry: string) {
  const grade = gradeNumericAnswer(entry, check.answer);
  await recordQuickCheckAnswer({ userId, lessonSlug: lesson.slug, checkId: check.id, entry, value: grade.value, correct: grade.correct });
  return grade;
}

describe("quick-check answers", () => {
  it("stores every try with its SI value, or no value when the entry could not be read", async () => {
    const learner = await createPerson({ role: "learner", password: "answers with units" });
    expect((await answer(learner.id, bitRate!, "3 V")).status).toBe("unreadable");
    expect((await answer(learner.id, bitRate!, "500 kHz")).status).toBe("incorrect");
    expect((await answer(learner.id, bitRate!, "1/(1.25 us)")).status).toBe("correct");

    const rows = await db
      .select({ entry: quickCheckAnswers.entry, value: quickCheckAnswers.value, correct: quickCheckAnswers.correct })
      .from(quickCheckAnswers)
      .where(and(eq(quickCheckAnswers.userId, learner.id), eq(quickCheckAnswers.checkId, bitRate!.id)))
      .orderBy(asc(quickCheckAnswers.createdAt));
    expect(rows).toEqual([
      { entry: "3 V", value: null, correct: false },
      { entry: "500 kHz", value: expect.closeTo(500e3, 6), correct: false },
      { entry: "1/(1.25 us)", value: expect.closeTo(800e3, 6), correct: true },
    ]);
  });

  it("reads back, per check, how often it was tried, the last entry and the latest right one", async () => {
    const learner = await createPerson({ role: "learner", password: "answers with units" });
    await answer(learner.id, bitRate!, "800 kHz");
    await answer(learner.id, bitRate!, "8 kHz");
    await answer(learner.id, wordHighTime!, "11 us");

    const states = await listQuickCheckStatesByLesson({ userId: learner.id, lessonSlug: lesson.slug });
    expect(states.sort((a, b) => a.checkId.localeCompare(b.checkId))).toEqual(
      [
        { checkId: bitRate!.id, answers: 2, lastEntry: "8 kHz", correctEntry: "800 kHz" },
        { checkId: wordHighTime!.id, answers: 1, lastEntry: "11 us", correctEntry: null },
      ].sort((a, b) => a.checkId.localeCompare(b.checkId)),
    );
  });

  it("shows a learner only their own answers", async () => {
    const one = await createPerson({ role: "learner", password: "answers with units" });
    const other = await createPerson({ role: "learner", password: "answers with units" });
    await answer(one.id, bitRate!, "800 kHz");
    await expect(listQuickCheckStatesByLesson({ userId: other.id, lessonSlug: lesson.slug })).resolves.toEqual([]);
  });
});
