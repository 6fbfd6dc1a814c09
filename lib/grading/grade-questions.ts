import type { Lab } from "@/lessons";
import { gradeNumericAnswer } from "@/lib/answers";
import type { InputIssue } from "./input-error";

export type GradedQuestion = { id: string; entry: string; value: number; correct: boolean; message: string };

/**
 * The lab's numeric questions, read with units through the quantity parser. An entry that cannot
 * be read (no unit, the wrong kind of quantity, not a number) is an issue named `answers.<id>`,
 * refused before anything is graded, so a typing slip never costs an attempt; so is an answer to
 * no question.
 */
export function gradeQuestions(lab: Lab, answers: Record<string, string>): { questions: GradedQuestion[]; issues: InputIssue[] } {
  const asked = new Set(lab.questions.map((q) => q.id));
  const issues: InputIssue[] = Object.keys(answers)
    .filter((id) => !asked.has(id))
    .map((id) => ({ path: `answers.${id}`, message: "this lab asks no such question" }));
  const graded: GradedQuestion[] = [];
  for (const question of lab.questions) {
    const entry = answers[question.id] ?? "";
    const grade = gradeNumericAnswer(entry, question.answer);
    if (grade.status === "unreadable") issues.push({ path: `answers.${question.id}`, message: grade.message });
    else graded.push({ id: question.id, entry, value: grade.value, correct: grade.correct, message: grade.message });
  }
  return { questions: graded, issues };
}
