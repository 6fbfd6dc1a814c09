import type { LearnerQuickCheckAnswer } from "@/db/queries/gradebook";
import type { Course } from "@/lessons";
import { formatInUnit } from "@/lib/answers";
import { correctChoice, numericCheckFor, presentChoiceCheck, quickCheckSeed } from "@/lib/quick-checks";

const KIND_WORDS = { check: "Number", "pick-trace": "Pick the trace", predict: "Predict, then run", diagnose: "Diagnose" } as const;

export type QuickCheckRecord = {
  id: string;
  number: number;
  kind: (typeof KIND_WORDS)[keyof typeof KIND_WORDS];
  /** What this learner was asked: their given's prompt, or the run their copy of a choice check is about. */
  asked: string;
  /** The answer their copy accepts, as the page would print it. */
  expected: string;
  answers: { entry: string; correct: boolean; createdAt: Date }[];
};

export type LessonChecksRecord = { slug: string; number: number; title: string; checks: QuickCheckRecord[] };

type QuickCheck = Extract<Course["lessons"][number]["blocks"][number], { kind: "check" | "choice" }>;

/** The learner's own copy of a check, as the instructor needs it to read their answers. */
function learnersCopy(check: QuickCheck, seed: string): { asked: string; expected: string } {
  if (check.kind === "check") {
    const given = numericCheckFor(check, seed);
    return { asked: given.prompt, expected: formatInUnit(given.answer.value, given.answer.unit) };
  }
  const shown = presentChoiceCheck(check, seed);
  const right = correctChoice(check, seed);
  return { asked: `The run: ${shown.run}`, expected: shown.options.find((option) => option.key === right)!.label };
}

/**
 * A learner's quick-check answers under each lesson's checks, in lesson order, with what their own
 * copy asked and accepts; lessons without an answer are left out.
 */
export function quickCheckRecords(course: Course, learnerId: string, answers: readonly LearnerQuickCheckAnswer[]): LessonChecksRecord[] {
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
          ...learnersCopy(check, quickCheckSeed(learnerId, lesson.slug, check.id)),
          answers: mine.filter((answer) => answer.checkId === check.id).map(({ entry, correct, createdAt }) => ({ entry, correct, createdAt })),
        })),
      },
    ];
  });
}
