import { describe, expect, it } from "vitest";
import { ContentError, validateLesson } from "@/lessons";
import { lessonSources, type LessonSource } from "@/lessons/course";
import { formatQuantity } from "@/lessons/numbers/format-quantity";
import { quantity } from "@/lessons/numbers/lesson-number";
import { placeholderNames, resolvePlaceholders } from "@/lessons/numbers/placeholders";
import { coursePlainNumbers, type PlainNumber } from "@/lessons/numbers/plain-numbers";
import { sharedNumbers } from "@/lessons/numbers/shared-numbers";
import { computeSimulatedValues } from "@/lessons/numbers/simulated-numbers";
import { simulatedValues } from "@/lessons/numbers/simulated-values";
import { plainNumbers as pixelDataStream } from "@/lessons/01-pixel-data-stream/numbers";
import { plainNumbers as edges } from "@/lessons/03-edges/numbers";
import { plainNumbers as transmissionLine } from "@/lessons/04-transmission-line/numbers";
import { plainNumbers as reflections } from "@/lessons/05-reflections/numbers";
import { plainNumbers as seriesTermination } from "@/lessons/06-series-termination/numbers";
import { plainNumbers as designingARun } from "@/lessons/07-designing-a-run/numbers";
import { plainNumbers as onTheBench } from "@/lessons/08-on-the-bench/numbers";
import { typedNumbers } from "./support/typed-numbers";

/**
 * The lessons whose text quotes computed numbers only through placeholders, with their own plain
 * numbers. Lesson 2 (logic-levels) still computes its own figures in place, apart from the shared
 * receiver-model block (lessons/receiver-model.ts).
 */
const NOT_YET_CONVERTED = ["logic-levels"];
const converted: Record<string, readonly PlainNumber[]> = {
  "pixel-data-stream": pixelDataStream,
  edges,
  "transmission-line": transmissionLine,
  reflections,
  "series-termination": seriesTermination,
  "designing-a-run": designingARun,
  "on-the-bench": onTheBench,
};

type RawBlock = Record<string, unknown>;
const TEXT_FIELDS = ["markdown", "title", "caption", "prompt", "hint", "explanation"];

/** Every text a lesson shows as it is written, before its placeholders are printed. */
function writtenText(lesson: { title: string; summary: string; blocks: readonly RawBlock[] }): string {
  const blocks = lesson.blocks.flatMap((block) => TEXT_FIELDS.flatMap((field) => (typeof block[field] === "string" ? [block[field] as string] : [])));
  return [lesson.title, lesson.summary, ...blocks].join("\n\n");
}

describe("printing a number", () => {
  it("uses the typographic minus, groups thousands and puts a space before the unit", () => {
    expect(formatQuantity(-0.8922, { unit: "", decimals: 3 })).toBe("−0.892");
    expect(formatQuantity(15e-3, { unit: "µs", decimals: 0 })).toBe("15,000 µs");
    expect(formatQuantity(0.632, { unit: "%", decimals: 0 })).toBe("63 %");
  });

  it("prints no sign on a number that rounds to zero, and a plus only when asked", () => {
    expect(formatQuantity(-0.0004, { unit: "V", decimals: 2 })).toBe("0.00 V");
    expect(formatQuantity(0.577, { unit: "", decimals: 3, sign: true })).toBe("+0.577");
    expect(formatQuantity(-0.577, { unit: "", decimals: 3, sign: true, abs: true })).toBe("+0.577");
  });

  it("writes powers of ten, fixed or normalised, and whole numbers as exponents", () => {
    expect(formatQuantity(523.4e-9, { unit: "H/m", decimals: 0, exponent: -9 })).toBe("523 × 10⁻⁹ H/m");
    expect(formatQuantity(3.1154e-17, { unit: "s²/m²", decimals: 2, scientific: true, bare: true })).toBe("3.12 × 10⁻¹⁷");
    expect(formatQuantity(9.9996e-6, { unit: "", decimals: 2, scientific: true })).toBe("1.00 × 10⁻⁵");
    expect(formatQuantity(3, { unit: "", decimals: 0, superscript: true })).toBe("³");
  });
});

describe("placeholders", () => {
  const numbers = { "case1.launched": quantity(4.7301, "V", 2, "test"), "run.delay": quantity(36.5e-9, "ns", 1, "test") };

  it("print the named number, with the options given", () => {
    const { text, problems } = resolvePlaceholders("{{case1.launched}}; {{ run.delay | unit=µs | dp=3 }}; {{case1.launched|bare|dp=1}}", numbers);
    expect(problems).toEqual([]);
    expect(text).toBe("4.73 V; 0.037 µs; 4.7");
  });

  it("report an unknown name, an unknown option, a unit of another kind and an unpaired brace", () => {
    const problems = (text: string) => resolvePlaceholders(text, numbers).problems;
    expect(problems("{{case1.lanched}}")).toEqual([expect.stringContaining("unknown number {{case1.lanched}}")]);
    expect(problems("{{case1.launched|round}}")).toEqual([expect.stringContaining('unknown option "round"')]);
    expect(problems("{{case1.launched|unit=ns}}")).toEqual([expect.stringContaining("cannot be shown in ns")]);
    expect(problems("{{case1.launched|dp=9}}")).toEqual([expect.stringContaining('unknown option "dp=9"')]);
    expect(problems("{{case1.launched} V")).toEqual([expect.stringContaining("without its pair")]);
  });

  it("are listed by name", () => {
    expect(placeholderNames("a {{case1.launched|bare}} b {{ run.delay }}")).toEqual(["case1.launched", "run.delay"]);
  });
});

/** A copy of lesson `index`'s source with `change` applied to its first text block's markdown. */
function withFirstText(index: number, change: (markdown: string) => string): LessonSource {
  const source = lessonSources[index];
  const lesson = structuredClone(source.lesson) as unknown as { blocks: RawBlock[] };
  const block = lesson.blocks.find((b) => b.kind === "text")!;
  block.markdown = change(block.markdown as string);
  return { ...source, lesson };
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

describe("loading a lesson", () => {
  it("prints its placeholders from its numbers", () => {
    const lesson = validateLesson(withFirstText(0, (markdown) => `${markdown}\n\nBit period: {{sim.bitPeriod|unit=ns|dp=0}}.`));
    const text = lesson.blocks.find((b) => b.kind === "text")!;
    expect(text.kind === "text" && text.markdown).toMatch(/Bit period: 1,250 ns\.$/);
  });

  it("fails on a placeholder naming no number, at the field that holds it", () => {
    const error = contentErrorOf(() => validateLesson(withFirstText(2, (markdown) => `${markdown} {{shortLead.riseTime}}`)));
    expect(error.file).toBe("lessons/03-edges/index.ts");
    expect(error.issues).toEqual([
      { file: "lessons/03-edges/index.ts", path: "blocks.0.markdown", message: expect.stringContaining("unknown number {{shortLead.riseTime}}") },
    ]);
  });

  it("fails on a number without a source, in the lesson's numbers file", () => {
    const source = lessonSources[0];
    const lesson = structuredClone(source.lesson) as unknown as { numbers: Record<string, { source: string }> };
    lesson.numbers["sim.bitPeriod"].source = " ";
    const error = contentErrorOf(() => validateLesson({ ...source, lesson }));
    expect(error.issues.map((i) => `${i.file} ${i.path}`)).toEqual(["lessons/01-pixel-data-stream/numbers.ts sim.bitPeriod.source"]);
  });

  it("names each of its own numbers in its text, so none is computed for nothing", () => {
    for (const source of lessonSources) {
      const own = Object.keys("numbers" in source.lesson ? source.lesson.numbers : {}).filter((name) => !Object.hasOwn(sharedNumbers, name.split(".")[0]));
      const quoted = new Set(placeholderNames(JSON.stringify(source.lesson)));
      expect(own.filter((name) => !quoted.has(name)), source.file).toEqual([]);
    }
  });
});

describe("simulated numbers", () => {
  it("are committed as the simulator computes them today (npm run lessons:numbers)", () => {
    expect(simulatedValues).toEqual(computeSimulatedValues());
  });
});

describe("typed numbers in converted lessons", () => {
  const sources = lessonSources.filter((source) => Object.hasOwn(converted, source.lesson.slug));

  it("covers every lesson but the ones named as not yet converted", () => {
    const slugs = lessonSources.map((source) => source.lesson.slug);
    expect([...Object.keys(converted), ...NOT_YET_CONVERTED].sort()).toEqual([...slugs].sort());
  });

  it("lists no course-wide plain number that no lesson uses", () => {
    const text = sources.map((source) => writtenText(source.lesson)).join("\n");
    const { used } = typedNumbers(text, coursePlainNumbers);
    expect(coursePlainNumbers.filter((phrase) => !used.has(phrase.text)).map((p) => p.text)).toEqual([]);
  });

  it.each(sources.map((source) => [source.file, source] as const))("%s types no number that is not a placeholder or a listed plain number", (_, source) => {
    const own = converted[source.lesson.slug];
    const { unlisted, used } = typedNumbers(writtenText(source.lesson), [...own, ...coursePlainNumbers]);
    expect(unlisted).toEqual([]);
    expect(own.filter((phrase) => !used.has(phrase.text)).map((p) => p.text), "listed but no longer in the text").toEqual([]);
  });
});
