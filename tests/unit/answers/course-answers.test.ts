import { describe, expect, it } from "vitest";
import { describeExpectedEntry, formatInUnit, gradeNumericAnswer } from "@/lib/answers";
import { getCourse, type NumericAnswer } from "@/lessons";

// Every numeric answer in the course, graded by the real grader: the answer typed in its own unit
// (as the explanation shows it, to four figures) passes; the same number 10 % off does not.

const answers: { where: string; answer: NumericAnswer }[] = getCourse().lessons.flatMap((lesson) => [
  ...lesson.blocks.flatMap((block) => (block.kind === "check" ? [{ where: `${lesson.slug}/${block.id}`, answer: block.answer }] : [])),
  ...(lesson.lab?.questions ?? []).map((question) => ({ where: `${lesson.lab!.slug}/${question.id}`, answer: question.answer })),
]);

describe("every numeric answer in the course can be typed and graded", () => {
  it("finds the course's answers", () => {
    expect(answers.length).toBeGreaterThanOrEqual(24);
  });

  it.each(answers)("$where", ({ answer }) => {
    const typed = formatInUnit(answer.value, answer.unit);
    expect(gradeNumericAnswer(typed, answer)).toMatchObject({ status: "correct" });
    expect(gradeNumericAnswer(formatInUnit(answer.value * 1.1, answer.unit), answer)).toMatchObject({ status: "incorrect" });
    if (answer.unit !== "") expect(gradeNumericAnswer("3 kg", answer)).toMatchObject({ status: "unreadable", problem: "wrong-dimension" });
  });
});

describe("the answer field's example", () => {
  it.each(answers)("never gives away the answer to $where", ({ answer }) => {
    const example = describeExpectedEntry(answer.unit).replace(/^.*e\.g\. /, "");
    expect(gradeNumericAnswer(example, answer).correct).toBe(false);
    expect(gradeNumericAnswer(example, answer).status).not.toBe("unreadable");
  });
});
