import type { LearnerQuickCheckAnswer } from "@/db/queries/gradebook";
import type { Course } from "@/lessons";

const KIND_WORDS = { check: "Number", "pick-trace": "Pick the trace", predict: "Predict, then run", diagnose: "Diagnose" } as const;

export type QuickCheckRecord = {
  id: string;
  number: number;
  kind: (typeof KIND_WORDS)[keyof typeof KIND_WORDS];
  answers: { entry: string; correct: boolean; createdAt: Date }[];
};

export type LessonChecksRecord = { slug: string; number: number; title: string; checks: QuickCheckRecord[] };

/** A learner's quick-check answers under each lesson's checks, in lesson order; lessons without an answer are left out. */
export function quickCheckRecords(course: Course, answers: readonly LearnerQuickCheckAnswer[]): LessonChecksRecord[] {
  return course.lessons.flatMap((lesson) => {
    const mine = answers.filter((answer) => answer.lessonSlug === lesson.slug);
    if (mine.length === 0) return [];
    const checks = lesson.blocks.flatMap((block) => (block.kind === "check" || block.kind === "choice" ? [block] : []));
    return [
      {
        slug: lesson.slug,
        number: lesson.number,
        title: lesson.title,
        checks: checks.map((check, i) => ({
          id: check.id,
          number: i + 1,
          kind: KIND_WORDS[check.kind === "check" ? "check" : check.ask],
          answers: mine.filter((answer) => answer.checkId === check.id).map(({ entry, correct, createdAt }) => ({ entry, correct, createdAt })),
        })),
      },
    ];
  });
}
