import { describe, expect, it } from "vitest";
import { lessonSources } from "@/lessons/course";
import { formatQuantity } from "@/lessons/numbers/format-quantity";
import { placeholderNames, resolvePlaceholders } from "@/lessons/numbers/placeholders";
import { coursePlainNumbers, type PlainNumber } from "@/lessons/numbers/plain-numbers";
import { quantity } from "@/lessons/numbers/lesson-number";
import { plainNumbers as pixelDataStream } from "@/lessons/01-pixel-data-stream/numbers";
import { plainNumbers as edges } from "@/lessons/03-edges/numbers";
import { plainNumbers as transmissionLine } from "@/lessons/04-transmission-line/numbers";
import { typedNumbers } from "./support/typed-numbers";

/** The lessons whose text quotes computed numbers only through placeholders, with their own plain numbers. */
const converted: Record<string, readonly PlainNumber[]> = {
  "pixel-data-stream": pixelDataStream,
  edges,
  "transmission-line": transmissionLine,
};

type RawBlock = Record<string, unknown>;
const TEXT_FIELDS = ["markdown", "title", "caption", "prompt", "hint", "explanation"];

/** Every text a lesson shows as it is written, before its placeholders are printed. */
function writtenText(lesson: { title: string; summary: string; blocks: readonly RawBlock[] }): string {
  const blocks = lesson.blocks.flatMap((block) => TEXT_FIELDS.flatMap((field) => (typeof block[field] === "string" ? [block[field] as string] : [])));
  return [lesson.title, lesson.summary, ...blocks].join("\n\n");
}

describe("typed numbers in converted lessons", () => {
  const sources = lessonSources.filter((source) => Object.hasOwn(converted, source.lesson.slug));

  it.each(sources.map((source) => [source.file, source] as const))("%s types no number that is not a placeholder or a listed plain number", (_, source) => {
    const own = converted[source.lesson.slug];
    const { unlisted, used } = typedNumbers(writtenText(source.lesson), [...own, ...coursePlainNumbers]);
    expect(unlisted).toEqual([]);
    expect(own.filter((phrase) => !used.has(phrase.text)).map((p) => p.text), "listed but no longer in the text").toEqual([]);
  });
});
