import { recordQuickCheckAnswer } from "@/db/queries/quick-checks";
import type { Lesson } from "@/lessons";
import { formatInUnit, gradeNumericAnswer } from "@/lib/answers";
import { correctChoice, gradeChoiceCheck, numericCheckFor, quickCheckSeed } from "@/lib/quick-checks";

type QuickCheck = Extract<Lesson["blocks"][number], { kind: "check" | "choice" }>;

/** The entry the learner's own copy of a check accepts: the given's answer, or the right option's key. */
export function rightEntryFor(userId: string, lesson: Lesson, check: QuickCheck): string {
  const seed = quickCheckSeed(userId, lesson.slug, check.id);
  if (check.kind === "check") {
    const { answer } = numericCheckFor(check, seed);
    return formatInUnit(answer.value, answer.unit);
  }
  return correctChoice(check, seed);
}

/** Grades an entry (a typed value, or an option's key) as the lesson page's actions do, and stores it. */
export async function answerCheck(userId: string, lesson: Lesson, check: QuickCheck, input: string) {
  const seed = quickCheckSeed(userId, lesson.slug, check.id);
  if (check.kind === "check") {
    const grade = gradeNumericAnswer(input, numericCheckFor(check, seed).answer);
    await recordQuickCheckAnswer({ userId, lessonSlug: lesson.slug, checkId: check.id, entry: input, value: grade.value, correct: grade.correct });
    return { entry: input, correct: grade.correct };
  }
  const grade = gradeChoiceCheck(check, seed, input);
  if (grade.status === "unreadable") throw new Error(`${input} is not an option of ${check.id}`);
  await recordQuickCheckAnswer({ userId, lessonSlug: lesson.slug, checkId: check.id, entry: grade.entry, value: null, correct: grade.correct });
  return { entry: grade.entry, correct: grade.correct };
}

export const quickChecksOf = (lesson: Lesson): QuickCheck[] => lesson.blocks.filter((b): b is QuickCheck => b.kind === "check" || b.kind === "choice");
