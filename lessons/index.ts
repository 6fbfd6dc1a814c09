import type { z } from "zod";
import { course as courseInput, COURSE_FILE, lessonSources } from "./course";
import { courseSchema, lessonSchema, type Course, type Lab, type Lesson } from "./schema";

/** A content file that does not match its schema; the message names the file and each field path. */
export class ContentError extends Error {
  readonly file: string;
  readonly issues: { path: string; message: string }[];

  constructor(file: string, issues: { path: string; message: string }[]) {
    super(`${file}: ${issues.map((i) => `${i.path || "(root)"}: ${i.message}`).join("; ")}`);
    this.name = "ContentError";
    this.file = file;
    this.issues = issues;
  }
}

function parseOrThrow<S extends z.ZodType>(schema: S, file: string, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value);
  if (!parsed.success) {
    throw new ContentError(
      file,
      parsed.error.issues.map((issue) => ({ path: issue.path.map(String).join("."), message: issue.message })),
    );
  }
  return parsed.data;
}

export function validateLesson(file: string, value: unknown): Lesson {
  return parseOrThrow(lessonSchema, file, value);
}

/** Each lesson first, so an error names the lesson's own file; then the course as a whole. */
export function loadCourse(courseFile: string, value: unknown, sources: readonly { file: string; lesson: unknown }[]): Course {
  for (const source of sources) validateLesson(source.file, source.lesson);
  return parseOrThrow(courseSchema, courseFile, value);
}

const course = loadCourse(COURSE_FILE, courseInput, lessonSources);
const lessonsBySlug = new Map(course.lessons.map((l) => [l.slug, l]));
const labsBySlug = new Map(course.lessons.flatMap((l) => (l.lab ? [[l.lab.slug, l.lab] as const] : [])));

export function getCourse(): Course {
  return course;
}

export function getLesson(slug: string): Lesson | undefined {
  return lessonsBySlug.get(slug);
}

export function getLab(slug: string): Lab | undefined {
  return labsBySlug.get(slug);
}

/** The lesson a lab closes, for the workbench's way back to the text. */
export function getLessonOfLab(labSlug: string): Lesson | undefined {
  return course.lessons.find((l) => l.lab?.slug === labSlug);
}

export type { Block, BenchExercise, CheckBlock, Course, Lab, Lesson, NumericAnswer, PassRule, RunChoices, RunSpec, Scenario, Scoring } from "./schema";
export type { FigureBlock, FigureId, FigureParams } from "./figures";
export { FIGURE_IDS } from "./figures";
export { figureSimInputs } from "./figure-sim-inputs";
export { labVariant, defaultVariant, type LabVariant, type RunVariant } from "./variant";
export { buildSimInput } from "./build-run";
export { labChoicesSchemaFor, runChoicesSchemaFor, resistorValuesOnOffer, lengthsOnOffer, startingChoices, type LabChoices } from "./run-choices";
export { judgeRun, type RunJudgement, type RuleFailure } from "./pass-rule";
export { scoreRun, scoreAttempt } from "./scoring";
