import type { z } from "zod";
import type { LessonPart, LessonSource } from "./course";
import { courseSchema, lessonSchema, type Course, type Lesson } from "./schema";

// Validates the course's content files at load. An error names, for every problem, the file that
// holds the field (a lesson's index.ts, or the lab.ts or bench.ts beside it, or the course file)
// and the field's path inside what that file exports.

export type ContentIssue = { file: string; path: string; message: string };

/** Content that does not match its schema; the message names each problem's file and field path. */
export class ContentError extends Error {
  /** The file of the first problem. */
  readonly file: string;
  readonly issues: ContentIssue[];

  constructor(issues: ContentIssue[]) {
    super(issues.map((i) => `${i.file}: ${i.path || "(root)"}: ${i.message}`).join("; "));
    this.name = "ContentError";
    this.file = issues[0]?.file ?? "";
    this.issues = issues;
  }
}

type FieldPath = readonly PropertyKey[];
type Located = { file: string; path: FieldPath };

function locateInLesson(source: LessonSource, path: FieldPath): Located {
  const [part, ...rest] = path;
  const partFile = typeof part === "string" ? source.partFiles[part as LessonPart] : undefined;
  return partFile ? { file: partFile, path: rest } : { file: source.file, path };
}

function locateInCourse(courseFile: string, sources: readonly LessonSource[], path: FieldPath): Located {
  const [field, index, ...rest] = path;
  const source = field === "lessons" && typeof index === "number" ? sources[index] : undefined;
  return source ? locateInLesson(source, rest) : { file: courseFile, path };
}

function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown, locate: (path: FieldPath) => Located): z.output<S> {
  const parsed = schema.safeParse(value);
  if (!parsed.success) {
    throw new ContentError(
      parsed.error.issues.map((issue) => {
        const { file, path } = locate(issue.path);
        return { file, path: path.map(String).join("."), message: issue.message };
      }),
    );
  }
  return parsed.data;
}

export function validateLesson(source: LessonSource): Lesson {
  return parseOrThrow(lessonSchema, source.lesson, (path) => locateInLesson(source, path));
}

/** Each lesson first, so an error names the lesson's own files; then the course as a whole. */
export function loadCourse(courseFile: string, value: unknown, sources: readonly LessonSource[]): Course {
  for (const source of sources) validateLesson(source);
  return parseOrThrow(courseSchema, value, (path) => locateInCourse(courseFile, sources, path));
}
