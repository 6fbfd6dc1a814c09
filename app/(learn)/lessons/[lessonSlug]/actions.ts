"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { recordQuickCheckAnswer } from "@/db/queries/quick-checks";
import { gradeNumericAnswer } from "@/lib/answers";
import { requireRouteAccess } from "@/lib/auth/current-user";
import { describeError } from "@/lib/http/errors";
import { isLessonOpen } from "@/lib/progress";
import type { QuickCheckState } from "@/components/lesson/quick-check-state";
import { getLesson } from "@/lessons";
import { formDataOrEmpty } from "@/lib/http/form-state";

const answerSchema = z.object({
  lessonSlug: z.string().min(1).max(100),
  checkId: z.string().min(1).max(100),
  entry: z.string().max(1000),
});

/**
 * Grades one quick-check entry and stores it, right, wrong or unreadable alike, so the learner's
 * record shows every try. Empty and over-long entries are answered without being stored.
 */
export async function answerQuickCheck(_previous: QuickCheckState, formData: FormData): Promise<QuickCheckState> {
  formData = formDataOrEmpty(formData);
  const user = await requireRouteAccess("/lessons/[lessonSlug]", { lessonSlug: String(formData.get("lessonSlug") ?? "") });
  const parsed = answerSchema.safeParse(Object.fromEntries(formData));
  if (!parsed.success) return { status: "error", message: "That answer could not be sent. Reload the page and try again.", entry: "" };
  const { lessonSlug, checkId, entry } = parsed.data;

  const check = getLesson(lessonSlug)?.blocks.find((block) => block.kind === "check" && block.id === checkId);
  if (!check || check.kind !== "check") {
    return { status: "error", message: "This quick check is no longer part of the lesson. Reload the page.", entry };
  }
  const grade = gradeNumericAnswer(entry, check.answer);
  const worthStoring = grade.status !== "unreadable" || (grade.problem !== "empty" && grade.problem !== "too-long");

  try {
    if (!(await isLessonOpen({ userId: user.id, lessonSlug }))) {
      return { status: "error", message: "This lesson is locked until you finish the one before it.", entry };
    }
    if (worthStoring) {
      await recordQuickCheckAnswer({ userId: user.id, lessonSlug, checkId, entry: entry.trim(), value: grade.value, correct: grade.correct });
    }
  } catch (error) {
    return { status: "error", message: describeError(error).body.error.message, entry };
  }
  revalidatePath(`/lessons/${lessonSlug}`);
  return { status: grade.status, message: grade.message, entry };
}
