import { lesson as pixelDataStream } from "./01-pixel-data-stream";
import { lesson as logicLevels } from "./02-logic-levels";
import { lesson as edges } from "./03-edges";
import { lesson as transmissionLine } from "./04-transmission-line";
import { lesson as reflections } from "./05-reflections";
import { lesson as seriesTermination } from "./06-series-termination";
import { lesson as designingARun } from "./07-designing-a-run";
import { lesson as onTheBench } from "./08-on-the-bench";
import type { CourseInput, LessonInput } from "./schema";

export const COURSE_FILE = "lessons/course.ts";

/** The parts of a lesson that live in their own file beside its index.ts. */
export type LessonPart = "lab" | "bench" | "numbers";

/** A lesson with the files it is written in, so a validation error can point at the file that holds the field. */
export type LessonSource<L = unknown> = { file: string; lesson: L; partFiles: Partial<Record<LessonPart, string>> };

function lessonFolder<L extends LessonInput>(folder: string, lesson: L, parts: readonly LessonPart[]): LessonSource<L> {
  return {
    file: `lessons/${folder}/index.ts`,
    lesson,
    partFiles: Object.fromEntries(parts.map((part) => [part, `lessons/${folder}/${part}.ts`])),
  };
}

export const lessonSources = [
  lessonFolder("01-pixel-data-stream", pixelDataStream, ["lab", "numbers"]),
  lessonFolder("02-logic-levels", logicLevels, ["lab", "numbers"]),
  lessonFolder("03-edges", edges, ["lab", "numbers"]),
  lessonFolder("04-transmission-line", transmissionLine, ["lab", "numbers"]),
  lessonFolder("05-reflections", reflections, ["lab", "numbers"]),
  lessonFolder("06-series-termination", seriesTermination, ["lab", "numbers"]),
  lessonFolder("07-designing-a-run", designingARun, ["lab", "bench", "numbers"]),
  lessonFolder("08-on-the-bench", onTheBench, ["lab", "bench", "numbers"]),
] as const;

export const course = {
  slug: "data-runs",
  title: "Data runs that work",
  summary:
    "Why a long data run to addressable pixels flickers, and how to design one that does not: pulse timing, logic levels, edges, transmission lines, reflections and series termination, practised on simulated runs and confirmed on the bench.",
  unlockInOrder: true,
  lessons: lessonSources.map((source) => source.lesson),
  completion: {
    labs: [
      { lab: "timing-budget", minScore: 60 },
      { lab: "thresholds", minScore: 60 },
      { lab: "rc-window", minScore: 60 },
      { lab: "cable-spec", minScore: 60 },
      { lab: "overshoot-limit", minScore: 60 },
      { lab: "lone-lead-termination", minScore: 60 },
      { lab: "beside-ground-termination", minScore: 60 },
      { lab: "capstone-installation", minScore: 70 },
    ],
    benchExercises: ["build-a-run", "document-a-run"],
  },
  competences: [
    {
      statement: "Works out the timing budget of an addressable-pixel data stream and the refresh rate a chain of pixels allows.",
      shownBy: ["timing-budget"],
    },
    {
      statement: "Checks that the first pixel reads a driver's levels and edges with margin, and when a level shifter is needed.",
      shownBy: ["thresholds", "rc-window"],
    },
    {
      statement: "Predicts from a cable's impedance and delay when a data run acts as a transmission line, and what its reflections do.",
      shownBy: ["cable-spec", "overshoot-limit"],
    },
    {
      statement: "Chooses the series resistor for a driver and cable, and specifies a complete data run that works.",
      shownBy: ["lone-lead-termination", "beside-ground-termination", "capstone-installation"],
    },
    {
      statement: "Builds and measures a data run on the bench, probing the first pixel correctly, and documents the result.",
      shownBy: ["build-a-run", "document-a-run"],
    },
  ],
} satisfies CourseInput;
