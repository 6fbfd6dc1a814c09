import { parseQuantity } from "@/lib/answers";
import type { Lesson, NumericAnswer } from "@/lessons/schema";
import { presentChoiceCheck } from "./choice-check";
import { numericCheckFor } from "./index";

/** A number as the lessons print it, with its unit when one follows: "7.20 ms", "1,041", "−0.577". */
const PRINTED_NUMBER = /[−-]?\d[\d,]*(?:\.\d+)?(?:\s*(?:[kMGmunpµ]?(?:s|Hz|Ω|ohm|V|A|F|H|m)(?:\/m)?\b|%))?/g;

/**
 * What a learner has read in a lesson before reaching one of its checks, for the learner with
 * `seed`: the text, captions and earlier checks (with their explanations, shown once answered),
 * then the check's own prompt. Hints and explanations of the check itself come after an answer.
 */
export function textBeforeCheck(lesson: Lesson, checkId: string, seedOf: (checkId: string) => string): string {
  const parts: string[] = [lesson.title, lesson.summary];
  for (const block of lesson.blocks) {
    if (block.kind === "text" || block.kind === "caution") parts.push(block.markdown);
    if (block.kind === "figure") parts.push(block.caption);
    if (block.kind === "check") {
      const given = numericCheckFor(block, seedOf(block.id));
      parts.push(given.prompt);
      if (block.id === checkId) break;
      parts.push(given.hint, given.explanation);
    }
    if (block.kind === "choice") {
      const shown = presentChoiceCheck(block, seedOf(block.id));
      parts.push(block.prompt, shown.run, shown.symptom ?? "");
      if (block.id === checkId) break;
      parts.push(block.hint, block.explanation);
    }
  }
  return parts.join("\n\n");
}

/**
 * Numbers in `text` that a learner could type as the answer and have it accepted: read as a
 * quantity of the answer's kind and within its tolerance (equal, for an exact answer).
 */
export function answerPrintedIn(text: string, answer: NumericAnswer): string[] {
  const found: string[] = [];
  for (const match of text.matchAll(PRINTED_NUMBER)) {
    const token = match[0].replace(/−/g, "-").replace(/(\d),(\d{3})/g, "$1$2").trim();
    const read = parseQuantity(token, answer.unit);
    if (!read.ok) continue;
    const slack = Math.max(answer.tolerance, 1e-9) * Math.abs(answer.value);
    if (Math.abs(read.value - answer.value) <= slack) found.push(match[0].trim());
  }
  return found;
}
