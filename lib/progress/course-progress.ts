import { quickCheckIds } from "@/lessons/schema";
import type { Course } from "@/lessons/schema";

export type LessonState = "locked" | "open" | "done";

export type LabFact = { attempts: number; bestScore: number; bestPassingScore: number | null; firstPassedAt: Date | null };
export type CheckFact = { answers: number; firstCorrectAt: Date | null };
export type LessonFact = { startedAt: Date; completedAt: Date | null };
/** Where the learner's work on a bench exercise stands; "not-started" when there is no submission. */
export type BenchState = "not-started" | "draft" | "submitted" | "returned" | "accepted";

/** What the database knows of one learner, reduced to what the rules need. */
export type LearnerRecord = {
  labs: ReadonlyMap<string, LabFact>;
  /** Keyed by checkKey(lessonSlug, checkId). */
  checks: ReadonlyMap<string, CheckFact>;
  lessons: ReadonlyMap<string, LessonFact>;
  /** Status of the learner's submission, by bench exercise slug. */
  bench: ReadonlyMap<string, Exclude<BenchState, "not-started">>;
};

export type LessonProgressView = {
  slug: string;
  number: number;
  title: string;
  summary: string;
  minutes: number;
  state: LessonState;
  /** The lesson to finish before this one opens, when it is locked. */
  waitsFor: { slug: string; number: number; title: string } | null;
  lab: {
    slug: string;
    title: string;
    attempts: number;
    bestScore: number | null;
    passed: boolean;
    /** The score a passing attempt needs for the certificate; null when the certificate does not list the lab. */
    certificateMinScore: number | null;
    /** The best passing attempt meets the certificate's minimum. */
    meetsCertificate: boolean;
  } | null;
  /** The lesson's bench exercise, real hardware reviewed by an instructor, under the same lock as the lesson. */
  bench: { slug: string; title: string; state: BenchState; requiredForCertificate: boolean } | null;
  checks: { total: number; answered: number; correct: number };
  startedAt: Date | null;
  /** When the rule was first met: the later of the first passing lab attempt and each check's first right answer. */
  completedAt: Date | null;
  /** Met the rule but the stored row does not say so yet. */
  completionToRecord: boolean;
};

export type CourseProgress = {
  course: { slug: string; title: string; unlockInOrder: boolean };
  lessons: LessonProgressView[];
  /** The first lesson neither done nor locked; null when the course is finished. */
  next: LessonProgressView | null;
  lessonsDone: number;
  labsPassed: number;
};

export function checkKey(lessonSlug: string, checkId: string): string {
  return `${lessonSlug}/${checkId}`;
}

function latest(dates: (Date | null)[]): Date | null {
  if (dates.some((date) => date === null)) return null;
  return (dates as Date[]).reduce<Date | null>((a, b) => (a === null || b > a ? b : a), null);
}

/**
 * The course map's rules. A lesson is done when its lab has a passing attempt and each of its quick
 * checks has been answered correctly at least once; a lesson once recorded as done stays done, so
 * adding a check to the course later does not take back a finished lesson. When the course unlocks
 * in order, a lesson opens once the lesson before it is done; otherwise every lesson is open.
 */
export function computeCourseProgress(course: Course, record: LearnerRecord): CourseProgress {
  const lessons: LessonProgressView[] = [];
  for (const lesson of course.lessons) {
    const checkIds = quickCheckIds(lesson.blocks);
    const checkRows = checkIds.map((id) => record.checks.get(checkKey(lesson.slug, id)));
    const labRow = lesson.lab ? record.labs.get(lesson.lab.slug) : undefined;
    const stored = record.lessons.get(lesson.slug);
    const certificateMinScore = lesson.lab ? (course.completion.labs.find((entry) => entry.lab === lesson.lab!.slug)?.minScore ?? null) : null;

    const metAt = latest([
      ...(lesson.lab ? [labRow?.firstPassedAt ?? null] : []),
      ...checkRows.map((row) => row?.firstCorrectAt ?? null),
    ]);
    const recordedAt = stored?.completedAt ?? null;
    const done = recordedAt !== null || metAt !== null;

    const previous = lessons.at(-1);
    const locked = !done && course.unlockInOrder && previous !== undefined && previous.state !== "done";

    lessons.push({
      slug: lesson.slug,
      number: lesson.number,
      title: lesson.title,
      summary: lesson.summary,
      minutes: lesson.minutes,
      state: done ? "done" : locked ? "locked" : "open",
      waitsFor: locked && previous ? { slug: previous.slug, number: previous.number, title: previous.title } : null,
      lab: lesson.lab
        ? {
            slug: lesson.lab.slug,
            title: lesson.lab.title,
            attempts: labRow?.attempts ?? 0,
            bestScore: labRow && labRow.attempts > 0 ? labRow.bestScore : null,
            passed: Boolean(labRow?.firstPassedAt),
            certificateMinScore,
            meetsCertificate: certificateMinScore !== null && (labRow?.bestPassingScore ?? -1) >= certificateMinScore,
          }
        : null,
      bench: lesson.bench
        ? {
            slug: lesson.bench.slug,
            title: lesson.bench.title,
            state: record.bench.get(lesson.bench.slug) ?? "not-started",
            requiredForCertificate: course.completion.benchExercises.includes(lesson.bench.slug),
          }
        : null,
      checks: {
        total: checkIds.length,
        answered: checkRows.filter((row) => row && row.answers > 0).length,
        correct: checkRows.filter((row) => row?.firstCorrectAt).length,
      },
      startedAt: stored?.startedAt ?? null,
      completedAt: recordedAt ?? metAt,
      completionToRecord: recordedAt === null && metAt !== null,
    });
  }
  return {
    course: { slug: course.slug, title: course.title, unlockInOrder: course.unlockInOrder },
    lessons,
    next: lessons.find((lesson) => lesson.state === "open") ?? null,
    lessonsDone: lessons.filter((lesson) => lesson.state === "done").length,
    labsPassed: lessons.filter((lesson) => lesson.lab?.passed).length,
  };
}
