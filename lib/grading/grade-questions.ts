import type { Lab } from "@/lessons";
import { gradeNumericAnswer } from "@/lib/answers";
import { invalidInput } from "./input-error";

export type GradedQuestion = { id: string; entry: string; value: number; correct: boolean; message: string };

/**
 * The lab's numeric questions, read with units through the quantity parser. An entry that cannot
 * be read (no unit, the wrong kind of quantity, not a number) is refused with a 422 naming
 * `answers.<id>`, so a typing slip never costs a graded attempt; so is an answer to no question.
 */
export function gradeQuestions(lab: Lab, answers: Record<string, string>): GradedQuestion[] {
  const asked = new Set(lab.questions.map((q) => q.id));
  const problems = Object.keys(answers)
    .filter((id) => !asked.has(id))
    .map((id) => ({ path: `answers.${id}`, message: "this lab asks no such question" }));
  const graded: GradedQuestion[] = [];
  for (const question of lab.questions) {
    const entry = answers[question.id] ?? "";
    const grade = gradeNumericAnswer(entry, question.answer);
    if (grade.status === "unreadable") problems.push({ path: `answers.${question.id}`, message: grade.message });
    else graded.push({ id: question.id, entry, value: grade.value, correct: grade.correct, message: grade.message });
  }
  if (problems.length > 0) throw invalidInput(problems);
  return graded;
}
