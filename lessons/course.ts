import { lesson as pixelDataStream } from "./01-pixel-data-stream";
import { lesson as logicLevels } from "./02-logic-levels";
import { lesson as edges } from "./03-edges";
import { lesson as transmissionLine } from "./04-transmission-line";
import { lesson as reflections } from "./05-reflections";
import { lesson as seriesTermination } from "./06-series-termination";
import { lesson as designingARun } from "./07-designing-a-run";
import { lesson as onTheBench } from "./08-on-the-bench";
import type { CourseInput } from "./schema";

export const COURSE_FILE = "lessons/course.ts";

/** Each lesson with the file it lives in, so a validation error can point at that file. */
export const lessonSources = [
  { file: "lessons/01-pixel-data-stream/index.ts", lesson: pixelDataStream },
  { file: "lessons/02-logic-levels/index.ts", lesson: logicLevels },
  { file: "lessons/03-edges/index.ts", lesson: edges },
  { file: "lessons/04-transmission-line/index.ts", lesson: transmissionLine },
  { file: "lessons/05-reflections/index.ts", lesson: reflections },
  { file: "lessons/06-series-termination/index.ts", lesson: seriesTermination },
  { file: "lessons/07-designing-a-run/index.ts", lesson: designingARun },
  { file: "lessons/08-on-the-bench/index.ts", lesson: onTheBench },
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
} satisfies CourseInput;
