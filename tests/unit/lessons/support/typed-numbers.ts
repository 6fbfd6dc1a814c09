import { PLACEHOLDER } from "@/lessons/numbers/placeholders";
import type { PlainNumber } from "@/lessons/numbers/plain-numbers";

/**
 * Digits that name something rather than quote a quantity: lesson, step and case numbers, list
 * markers, standards, 4-bit groups of a bit pattern, the index n of an arrival (also as a table's
 * first column), and 0 and 1 on their own (bit values, and the ±1 and 0 of reflection coefficients).
 */
const NAMING = [
  /\b(?:[Ll]essons?|[Ss]teps?|[Cc]ases?)\s+\d+(?:\s*(?:,|and|to|or)\s*\d+)*/g,
  /^\s*\d+\.\s/gm,
  /\b(?:IEC|ASTM|TIA|RS|JESD)[-\s]?[A-Z]?\d+(?:-[A-Z0-9]+)*/g,
  /\b[01]{4}\b/g,
  /\bn = \d+/g,
  /^\| \d{1,2} \|/gm,
];

/** A number as typed: not glued to a letter ("E24", "2π", "μ0"), with its decimals and thousands. */
const NUMBER = /(?<![\p{L}\p{N}_.,])[−-]?\d+(?:[.,]\d+)*(?![\p{L}\p{N}_])/gu;

const escape = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/** Numbers typed in `text` that are neither placeholders nor listed phrases, and listed phrases it never uses. */
export function typedNumbers(text: string, plain: readonly PlainNumber[]): { unlisted: string[]; used: Set<string> } {
  let rest = text;
  const used = new Set<string>();
  for (const phrase of plain) {
    const pattern = new RegExp(escape(phrase.text), "g");
    if (pattern.test(rest)) used.add(phrase.text);
    rest = rest.replace(pattern, " ");
  }
  rest = rest.replace(PLACEHOLDER, " ");
  for (const pattern of NAMING) rest = rest.replace(pattern, " ");
  const unlisted = [...rest.matchAll(NUMBER)]
    .filter((match) => !/^[−-]?[01]$/.test(match[0]))
    .map((match) => `"${match[0]}" in …${rest.slice(Math.max(0, match.index - 40), match.index + match[0].length + 20).replace(/\s+/g, " ")}…`);
  return { unlisted, used };
}
