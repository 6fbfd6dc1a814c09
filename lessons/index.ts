import { course as courseInput, COURSE_FILE, lessonSources } from "./course";
import { loadCourse } from "./loader";
import type { Course, Lab, Lesson } from "./schema";

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

export { ContentError, loadCourse, validateLesson, type ContentIssue } from "./loader";
export type { Block, BenchExercise, CheckBlock, Course, Lab, Lesson, NumericAnswer, PassRule, RunChoices, RunSpec, Scenario, Scoring } from "./schema";
export type { FigureBlock, FigureId, FigureParams } from "./figures";
export { FIGURE_IDS } from "./figures";
export { figureSimInputs } from "./figure-sim-inputs";
export { labVariant, defaultVariant, type LabVariant, type RunVariant } from "./variant";
export { buildSimInput } from "./build-run";
export { labChoicesSchemaFor, runChoicesSchemaFor, runControlValuesSchemaFor, resistorValuesOnOffer, lengthsOnOffer, startingChoices, type LabChoices } from "./run-choices";
export { COURSE_CLAMP_CURRENT_LIMIT, JUDGEMENT_PROMISE, judgeRun, ruleMargins, type RunJudgement, type RuleFailure } from "./pass-rule";
export { scoreRun, scoreAttempt } from "./scoring";
