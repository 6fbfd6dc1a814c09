"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { recordQuickCheckAnswer } from "@/db/queries/quick-checks";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { describeError } from "@/lib/http/errors";
import { isLessonOpen } from "@/lib/progress";
import { gradeChoiceCheck, gradeNumericCheck, quickCheckSeed } from "@/lib/quick-checks";
import type { QuickCheckState } from "@/components/lesson/quick-check-state";
import { getLesson } from "@/lessons";
import { formDataOrEmpty } from "@/lib/http/form-state";

const answerSchema = z.object({
  lessonSlug: z.string().min(1).max(100),
  checkId: z.string().min(1).max(100),
  entry: z.string().max(1000),
});

const choiceSchema = z.object({
  lessonSlug: z.string().min(1).max(100),
  checkId: z.string().min(1).max(100),
  choice: z.string().max(100).default(""),
});

const unsent: QuickCheckState = { status: "error", message: "That answer could not be sent. Reload the page and try again.", entry: "" };
const gone = (entry: string): QuickCheckState => ({ status: "error", message: "This quick check is no longer part of the lesson. Reload the page.", entry });

type Answered = { userId: string; lessonSlug: string; checkId: string };
type Graded = { entry: string; value: number | null; correct: boolean };

/** Stores a graded answer (none for entries not worth keeping) once the lesson is known to be open to the learner; the error to return otherwise. */
async function storeAnswer(answered: Answered, graded: Graded | null, entry: string): Promise<QuickCheckState | null> {
  try {
    if (!(await isLessonOpen({ userId: answered.userId, lessonSlug: answered.lessonSlug }))) {
      return { status: "error", message: "This lesson is locked until you finish the one before it.", entry };
    }
    if (graded) await recordQuickCheckAnswer({ ...answered, ...graded });
  } catch (error) {
    return { status: "error", message: describeError(error).body.error.message, entry };
  }
  revalidatePath(`/lessons/${answered.lessonSlug}`);
  return null;
}

/**
 * Grades one quick-check entry against the learner's own given and stores it, right, wrong or
 * unreadable alike, so the learner's record shows every try. Empty and over-long entries are
 * answered without being stored.
 */
export async function answerQuickCheck(_previous: QuickCheckState, formData: FormData): Promise<QuickCheckState> {
  formData = formDataOrEmpty(formData);
  const user = await requireRouteAccess("/lessons/[lessonSlug]", { lessonSlug: String(formData.get("lessonSlug") ?? "") });
  const parsed = answerSchema.safeParse(Object.fromEntries(formData));
  if (!parsed.success) return unsent;
  const { lessonSlug, checkId, entry } = parsed.data;

  const check = getLesson(lessonSlug)?.blocks.find((block) => block.kind === "check" && block.id === checkId);
  if (!check || check.kind !== "check") return gone(entry);
  const grade = gradeNumericCheck(check, quickCheckSeed(user.id, lessonSlug, checkId), entry);
  const worthStoring = grade.status !== "unreadable" || (grade.problem !== "empty" && grade.problem !== "too-long");
  const graded = worthStoring ? { entry: entry.trim(), value: grade.value, correct: grade.correct } : null;
  const failed = await storeAnswer({ userId: user.id, lessonSlug, checkId }, graded, entry);
  return failed ?? { status: grade.status, message: grade.message, entry };
}

/** Grades a chosen option on the server, where the right one is computed for the learner's seed, and stores it in words. */
export async function answerChoiceCheck(_previous: QuickCheckState, formData: FormData): Promise<QuickCheckState> {
  formData = formDataOrEmpty(formData);
  const user = await requireRouteAccess("/lessons/[lessonSlug]", { lessonSlug: String(formData.get("lessonSlug") ?? "") });
  const parsed = choiceSchema.safeParse(Object.fromEntries(formData));
  if (!parsed.success) return unsent;
  const { lessonSlug, checkId, choice } = parsed.data;

  const check = getLesson(lessonSlug)?.blocks.find((block) => block.kind === "choice" && block.id === checkId);
  if (!check || check.kind !== "choice") return gone("");
  const grade = gradeChoiceCheck(check, quickCheckSeed(user.id, lessonSlug, checkId), choice);
  if (grade.status === "unreadable") return { status: "unreadable", message: grade.message, entry: "" };
  const failed = await storeAnswer({ userId: user.id, lessonSlug, checkId }, { entry: grade.entry, value: null, correct: grade.correct }, grade.entry);
  return failed ?? { status: grade.status, message: grade.message, entry: grade.entry };
}
