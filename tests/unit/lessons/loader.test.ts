import { describe, expect, it } from "vitest";
import { ContentError, loadCourse, validateLesson } from "@/lessons";
import { course as courseInput, lessonSources } from "@/lessons/course";

const clone = <T>(value: T): T => structuredClone(value);

function contentErrorOf(action: () => unknown): ContentError {
  try {
    action();
  } catch (error) {
    if (error instanceof ContentError) return error;
    throw error;
  }
  throw new Error("expected a ContentError");
}

describe("validateLesson", () => {
  it("accepts every lesson file as written", () => {
    for (const source of lessonSources) expect(validateLesson(source.file, source.lesson).slug).toBeTruthy();
  });

  it("rejects a wrong field with the lesson file and the field path in the message", () => {
    const broken = clone(lessonSources[2].lesson) as { blocks: { kind: string; answer?: { unit: unknown } }[] };
    const index = broken.blocks.findIndex((b) => b.kind === "check");
    broken.blocks[index].answer!.unit = 42;
    const error = contentErrorOf(() => validateLesson("lessons/03-edges/index.ts", broken));
    expect(error.file).toBe("lessons/03-edges/index.ts");
    expect(error.issues.map((i) => i.path)).toContain(`blocks.${index}.answer.unit`);
    expect(error.message).toMatch(new RegExp(`^lessons/03-edges/index\\.ts: .*blocks\\.${index}\\.answer\\.unit`));
  });

  it("names a broken lab field inside the lesson", () => {
    const broken = clone(lessonSources[3].lesson) as { lab: { runs: { scenario: { cableOptions?: string[] } }[] } };
    delete broken.lab.runs[0].scenario.cableOptions;
    const error = contentErrorOf(() => validateLesson("lessons/04-transmission-line/index.ts", broken));
    expect(error.issues.map((i) => i.path)).toContain("lab.runs.0.scenario.cableOptions");
  });

  it("refuses a lesson with fewer than three quick checks", () => {
    const broken = clone(lessonSources[0].lesson) as { blocks: { kind: string }[] };
    broken.blocks = broken.blocks.filter((b) => b.kind !== "check");
    const error = contentErrorOf(() => validateLesson("lessons/01-pixel-data-stream/index.ts", broken));
    expect(error.message).toMatch(/blocks: a lesson needs 3 to 6 quick checks, found 0/);
  });

  it("refuses an unknown figure id", () => {
    const broken = clone(lessonSources[4].lesson) as { blocks: { kind: string; figure?: string }[] };
    const index = broken.blocks.findIndex((b) => b.kind === "figure");
    broken.blocks[index].figure = "smith-chart";
    const error = contentErrorOf(() => validateLesson("lessons/05-reflections/index.ts", broken));
    expect(error.issues.some((i) => i.path.startsWith(`blocks.${index}`))).toBe(true);
  });

  it("refuses a mistake that leaves a capstone run without choices", () => {
    const broken = clone(lessonSources[7].lesson) as { lab: { reference: { mistakes: { choices: Record<string, unknown> }[] } } };
    delete broken.lab.reference.mistakes[0].choices.canopy;
    const error = contentErrorOf(() => validateLesson("lessons/08-on-the-bench/index.ts", broken));
    expect(error.issues.map((i) => i.path)).toContain("lab.reference.mistakes.0.choices");
  });
});

describe("loadCourse", () => {
  it("names the broken lesson's own file when the course is loaded", () => {
    const sources = lessonSources.map((s) => ({ ...s, lesson: clone(s.lesson) as unknown }));
    (sources[5].lesson as { minutes: unknown }).minutes = "fifty";
    const error = contentErrorOf(() => loadCourse("lessons/course.ts", courseInput, sources));
    expect(error.file).toBe("lessons/06-series-termination/index.ts");
    expect(error.issues.map((i) => i.path)).toContain("minutes");
  });

  it("names the course file for a completion rule that points at no lab", () => {
    const broken = clone(courseInput) as { completion: { labs: { lab: string }[] } };
    broken.completion.labs[0].lab = "no-such-lab";
    const error = contentErrorOf(() => loadCourse("lessons/course.ts", broken, lessonSources));
    expect(error.file).toBe("lessons/course.ts");
    expect(error.message).toMatch(/completion\.labs\.0\.lab: no lab "no-such-lab" in the course/);
  });

  it("numbers lessons by their position", () => {
    const broken = clone(courseInput) as { lessons: { number: number }[] };
    broken.lessons[1].number = 7;
    const error = contentErrorOf(() => loadCourse("lessons/course.ts", broken, lessonSources));
    expect(error.issues.map((i) => i.path)).toContain("lessons.1.number");
  });
});
