import { existsSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { ContentError, loadCourse, validateLesson } from "@/lessons";
import { course as courseInput, lessonSources, type LessonSource } from "@/lessons/course";

// Broken copies of the real content files, fed to the loader: every error must name the file that
// holds the field (a lesson's index.ts, its lab.ts or bench.ts, or the course file) and the field.

const clone = <T>(value: T): T => structuredClone(value);

// Loose views of the content, to break it in ways its types forbid.
type LooseLesson = Record<string, unknown> & {
  slug: string;
  blocks: Record<string, unknown>[];
  lab: Record<string, unknown> & { slug: string; runs: { id: string }[]; questions: { id: string }[]; passRule: Record<string, unknown> };
  bench?: Record<string, unknown> & { slug: string; rubric: { id: string; points?: unknown }[] };
};

/** A copy of lesson `index`'s source whose lesson `breakIt` may change. */
function brokenSource(index: number, breakIt: (lesson: LooseLesson) => void): LessonSource {
  const source = lessonSources[index];
  const lesson = clone(source.lesson) as unknown as LooseLesson;
  breakIt(lesson);
  return { ...source, lesson };
}

/** The whole course with lesson `index` broken, as loadCourse sees it. */
function loadWithBrokenLesson(index: number, breakIt: (lesson: LooseLesson) => void): ContentError {
  const sources: LessonSource[] = lessonSources.map((source, i) => (i === index ? brokenSource(i, breakIt) : source));
  return contentErrorOf(() => loadCourse("lessons/course.ts", { ...courseInput, lessons: sources.map((s) => s.lesson) }, sources));
}

function contentErrorOf(action: () => unknown): ContentError {
  try {
    action();
  } catch (error) {
    if (error instanceof ContentError) return error;
    throw error;
  }
  throw new Error("expected a ContentError");
}

const issuesOf = (error: ContentError) => error.issues.map(({ file, path }) => `${file} ${path}`);
const checkIndexes = (lesson: LooseLesson) => lesson.blocks.flatMap((b, i) => (b.kind === "check" ? [i] : []));

describe("validateLesson", () => {
  it("accepts every lesson file as written", () => {
    for (const source of lessonSources) expect(validateLesson(source).slug).toBeTruthy();
  });

  it("names every file a lesson source points at, and only files that exist", () => {
    for (const source of lessonSources) {
      expect(existsSync(source.file), source.file).toBe(true);
      for (const file of Object.values(source.partFiles)) expect(existsSync(file), file).toBe(true);
      const parts = ["lab", ...(["bench", "numbers"] as const).filter((part) => part in source.lesson)];
      expect(Object.keys(source.partFiles).sort(), source.file).toEqual(parts.sort());
    }
  });

  it("rejects a wrong field with the lesson file and the field path in the message", () => {
    let index = -1;
    const source = brokenSource(2, (lesson) => {
      index = checkIndexes(lesson).find((i) => lesson.blocks[i]!.answer !== undefined)!;
      (lesson.blocks[index]!.answer as { unit: unknown }).unit = 42;
    });
    const error = contentErrorOf(() => validateLesson(source));
    expect(error.file).toBe("lessons/03-edges/index.ts");
    expect(error.issues.map((i) => i.path)).toContain(`blocks.${index}.answer.unit`);
    expect(error.message).toMatch(new RegExp(`^lessons/03-edges/index\\.ts: .*blocks\\.${index}\\.answer\\.unit`));
  });

  it("rejects a missing field and an unknown one, naming each", () => {
    const error = contentErrorOf(() =>
      validateLesson(
        brokenSource(1, (lesson) => {
          delete lesson.title;
          lesson.sumary = lesson.summary;
        }),
      ),
    );
    expect(issuesOf(error)).toContain("lessons/02-logic-levels/index.ts title");
    expect(error.message).toMatch(/^lessons\/02-logic-levels\/index\.ts: title: .*; lessons\/02-logic-levels\/index\.ts: \(root\): Unrecognized key: "sumary"/);
  });

  it("rejects a lesson file whose export is front matter and markdown instead of a lesson", () => {
    const source = { ...lessonSources[0], lesson: "---\nslug: pixel-data-stream\ntitle: The pixel data stream\n---\n\n## One wire, no clock\n" };
    const error = contentErrorOf(() => validateLesson(source));
    expect(error.message).toMatch(/^lessons\/01-pixel-data-stream\/index\.ts: \(root\): Invalid input: expected object, received string$/);
  });

  it("rejects markdown that is blank or not text, at the block that holds it", () => {
    const error = contentErrorOf(() =>
      validateLesson(
        brokenSource(4, (lesson) => {
          lesson.blocks[0]!.markdown = " \n\t ";
          const check = lesson.blocks[checkIndexes(lesson)[0]!]!;
          check.explanation = ["Line one.", "Line two."];
        }),
      ),
    );
    const check = checkIndexes(lessonSources[4].lesson as unknown as LooseLesson)[0];
    expect(issuesOf(error)).toEqual(["lessons/05-reflections/index.ts blocks.0.markdown", `lessons/05-reflections/index.ts blocks.${check}.explanation`]);
  });

  it("names a broken lab field in the lab's own file, by its path inside the lab", () => {
    const error = contentErrorOf(() =>
      validateLesson(
        brokenSource(3, (lesson) => {
          delete (lesson.lab.runs[0] as unknown as { scenario: { cableOptions?: unknown } }).scenario.cableOptions;
          lesson.lab.passRule.minTimingMargin = "120 ns";
        }),
      ),
    );
    expect(error.file).toBe("lessons/04-transmission-line/lab.ts");
    expect(issuesOf(error)).toEqual(
      expect.arrayContaining(["lessons/04-transmission-line/lab.ts runs.0.scenario.cableOptions", "lessons/04-transmission-line/lab.ts passRule.minTimingMargin"]),
    );
    expect(error.message).toMatch(/; lessons\/04-transmission-line\/lab\.ts: passRule\.minTimingMargin: Invalid input: expected number, received string$/);
  });

  it("names a broken bench exercise field in the bench file", () => {
    const error = contentErrorOf(() => validateLesson(brokenSource(6, (lesson) => delete lesson.bench!.rubric[1]!.points)));
    expect(issuesOf(error)).toEqual(["lessons/07-designing-a-run/bench.ts rubric.1.points"]);
  });

  it("refuses a lesson with fewer than three quick checks", () => {
    const error = contentErrorOf(() => validateLesson(brokenSource(0, (lesson) => (lesson.blocks = lesson.blocks.filter((b) => b.kind !== "check" && b.kind !== "choice")))));
    expect(error.message).toMatch(/blocks: a lesson needs 3 to 8 quick checks, found 0/);
  });

  it("refuses a lesson with fewer than two checks that are not numeric", () => {
    const error = contentErrorOf(() => validateLesson(brokenSource(0, (lesson) => (lesson.blocks = lesson.blocks.filter((b) => b.kind !== "choice")))));
    expect(error.message).toMatch(/blocks: a lesson needs at least 2 checks that are not numeric, found 0/);
  });

  it("refuses an unknown figure id", () => {
    let index = -1;
    const source = brokenSource(4, (lesson) => {
      index = lesson.blocks.findIndex((b) => b.kind === "figure");
      lesson.blocks[index]!.figure = "smith-chart";
    });
    const error = contentErrorOf(() => validateLesson(source));
    expect(error.issues.some((i) => i.path.startsWith(`blocks.${index}`))).toBe(true);
  });

  it("refuses a mistake that leaves a capstone run without choices", () => {
    const error = contentErrorOf(() =>
      validateLesson(
        brokenSource(7, (lesson) => {
          delete (lesson.lab as unknown as { reference: { mistakes: { choices: Record<string, unknown> }[] } }).reference.mistakes[0]!.choices.canopy;
        }),
      ),
    );
    expect(issuesOf(error)).toContain("lessons/08-on-the-bench/lab.ts reference.mistakes.0.choices");
  });

  // Stored answers, attempts and review scores are keyed by these ids.
  it("refuses a repeated quick-check id at the repeat, naming the first", () => {
    let checks: number[] = [];
    const source = brokenSource(0, (lesson) => {
      checks = checkIndexes(lesson);
      lesson.blocks[checks[2]!]!.id = lesson.blocks[checks[0]!]!.id;
    });
    const error = contentErrorOf(() => validateLesson(source));
    expect(issuesOf(error)).toEqual([`lessons/01-pixel-data-stream/index.ts blocks.${checks[2]}.id`]);
    expect(error.issues[0]!.message).toMatch(new RegExp(`is already used by blocks\\.${checks[0]}\\.id$`));
  });

  it("refuses repeated run, question and rubric ids in the files that hold them", () => {
    const capstone = contentErrorOf(() => validateLesson(brokenSource(7, (lesson) => (lesson.lab.runs[2]!.id = lesson.lab.runs[0]!.id))));
    expect(issuesOf(capstone)).toContain("lessons/08-on-the-bench/lab.ts runs.2.id");
    const questions = contentErrorOf(() => validateLesson(brokenSource(0, (lesson) => (lesson.lab.questions[1]!.id = lesson.lab.questions[0]!.id))));
    expect(questions.issues).toEqual([
      { file: "lessons/01-pixel-data-stream/lab.ts", path: "questions.1.id", message: `"${lessonSources[0].lesson.lab.questions[0].id}" is already used by questions.0.id` },
    ]);
    const rubric = contentErrorOf(() => validateLesson(brokenSource(7, (lesson) => (lesson.bench!.rubric[3]!.id = lesson.bench!.rubric[1]!.id))));
    expect(issuesOf(rubric)).toEqual(["lessons/08-on-the-bench/bench.ts rubric.3.id"]);
  });
});

describe("loadCourse", () => {
  it("names the broken lesson's own file when the course is loaded", () => {
    const error = loadWithBrokenLesson(5, (lesson) => (lesson.minutes = "fifty"));
    expect(error.file).toBe("lessons/06-series-termination/index.ts");
    expect(error.issues.map((i) => i.path)).toContain("minutes");
  });

  it("names the course file for a completion rule that points at no lab or no bench exercise", () => {
    const broken = clone(courseInput) as { completion: { labs: { lab: string }[]; benchExercises: string[] } };
    broken.completion.labs[0]!.lab = "no-such-lab";
    broken.completion.benchExercises[1] = "no-such-bench";
    const error = contentErrorOf(() => loadCourse("lessons/course.ts", broken, lessonSources));
    expect(error.file).toBe("lessons/course.ts");
    expect(error.message).toMatch(/completion\.labs\.0\.lab: no lab "no-such-lab" in the course/);
    expect(error.message).toMatch(/completion\.benchExercises\.1: no bench exercise "no-such-bench"/);
  });

  it("ties each competence the certificate states to required work, and every requirement to a competence", () => {
    const broken = clone(courseInput) as { competences: { statement: string; shownBy: string[] }[] };
    broken.competences[0]!.shownBy = ["no-such-lab"];
    const error = contentErrorOf(() => loadCourse("lessons/course.ts", broken, lessonSources));
    expect(error.file).toBe("lessons/course.ts");
    expect(error.message).toMatch(/competences\.0\.shownBy\.0: "no-such-lab" is not a lab or bench exercise the certificate requires/);
    expect(error.message).toMatch(/competences: no competence is shown by "timing-budget"/);
  });

  it("numbers lessons by their position, naming the lesson file", () => {
    const broken = clone(courseInput) as { lessons: { number: number }[] };
    broken.lessons[1]!.number = 7;
    const error = contentErrorOf(() => loadCourse("lessons/course.ts", broken, lessonSources));
    expect(issuesOf(error)).toEqual(["lessons/02-logic-levels/index.ts number"]);
  });

  it("refuses a lesson slug another lesson already has, at the second lesson's file", () => {
    const error = loadWithBrokenLesson(2, (lesson) => (lesson.slug = "logic-levels"));
    expect(error.issues).toEqual([{ file: "lessons/03-edges/index.ts", path: "slug", message: '"logic-levels" is already used by lesson 2' }]);
  });

  it("refuses a lab slug another lesson's lab already has, at the second lab's file", () => {
    const error = loadWithBrokenLesson(3, (lesson) => (lesson.lab.slug = "rc-window"));
    expect(error.issues).toContainEqual({ file: "lessons/04-transmission-line/lab.ts", path: "slug", message: "\"rc-window\" is already used by lesson 3's lab" });
  });

  it("refuses a bench exercise slug another lesson's exercise already has, at the second bench file", () => {
    const error = loadWithBrokenLesson(7, (lesson) => (lesson.bench!.slug = "build-a-run"));
    expect(error.issues).toContainEqual({ file: "lessons/08-on-the-bench/bench.ts", path: "slug", message: "\"build-a-run\" is already used by lesson 7's bench" });
  });
});
