import type { NumericAnswer } from "@/lessons/schema";
import { evaluateEntry, type EntryValue } from "./evaluate-entry";
import { normalizeEntry } from "./normalize-entry";
import { quantityMath, type QuantityUnit } from "./quantity-math";
import { describeQuantity, displayUnit, exampleEntry } from "./quantity-kinds";
import { readResistorCode } from "./resistor-code";

/** Longer entries are refused before parsing: no worked answer needs more, and parsing stays cheap. */
export const MAX_ENTRY_LENGTH = 160;

export type QuantityProblem = "empty" | "too-long" | "unparsable" | "missing-unit" | "wrong-dimension";

export type ParsedQuantity =
  | { ok: true; value: number; shown: string }
  | { ok: false; problem: QuantityProblem; message: string };

export type NumericGrade =
  | { status: "correct" | "incorrect"; correct: boolean; value: number; message: string }
  | { status: "unreadable"; correct: false; value: null; problem: QuantityProblem; message: string };

function quoted(entry: string): string {
  const text = entry.trim().replace(/\s+/g, " ");
  return `'${text.length > 40 ? `${text.slice(0, 39)}…` : text}'`;
}

function siFactor(unit: string): number {
  return unit === "" ? 1 : quantityMath.unit(1, unit).toSI().toNumber();
}

/** An SI value in the expected unit, to four significant figures: 3.564e-7 with "ns" → "356.4 ns". */
export function formatInUnit(value: number, unit: string): string {
  const number = Number((value / siFactor(unit)).toPrecision(4)).toString();
  return unit === "" ? number : `${number} ${displayUnit(unit)}`;
}

const ohm = quantityMath.unit("ohm");

function evaluate(entry: string, unit: string): EntryValue | null {
  // A resistance may be written as a resistor's code ("4k7", "1K"), which mathjs would misread
  // ("1K" as a kelvin) or not read at all.
  const coded = unit !== "" && quantityMath.unit(unit).equalBase(ohm) ? readResistorCode(entry) : null;
  if (coded !== null) return quantityMath.unit(coded, "ohm");
  try {
    return evaluateEntry(quantityMath.parse(normalizeEntry(entry)));
  } catch {
    return null;
  }
}

function isValueless(value: EntryValue): boolean {
  return typeof value !== "number" && (value.value === null || value.value === undefined);
}

function numericValue(value: EntryValue): number {
  return typeof value === "number" ? value : value.toSI().toNumber();
}

// mathjs reads "1/1.25 us" as (1/1.25) us, a time. When the entry divides by a number written
// with a unit and dividing by that quantity would have given the kind asked for, the learner
// almost certainly meant the latter.
const divisionByNumberWithUnit = /\/\s*[\d.]+(e[-+]?\d+)?\s*[a-zA-Z\u00b5\u03bc\u03a9]/;

function bracketAdvice(entry: string, value: EntryValue, expected: number | QuantityUnit): string {
  if (!divisionByNumberWithUnit.test(entry) || typeof value === "number" || typeof expected === "number") return "";
  const inverse = quantityMath.divide(1, value) as unknown as EntryValue;
  if (typeof inverse === "number" || !inverse.equalBase(expected)) return "";
  return " To divide by a quantity, put it in brackets with its unit, e.g. 1/(2 ms).";
}

/**
 * Reads a learner's entry ("330 ns", "0.33 µs", "2.2*270 ohm*600 pF", for a resistance also the
 * resistor code "4k7") as a quantity of the same kind as `unit` and returns its value in SI. `unit`
 * is a mathjs unit ("ns", "ohm", "pF/m"), or "" when a plain number is asked for. A bare number is refused when a unit is expected: "330" could be
 * seconds or nanoseconds, and writing the unit is part of what the course teaches. Never throws.
 */
export function parseQuantity(entry: string, unit: string): ParsedQuantity {
  const example = exampleEntry(unit);
  const fail = (problem: QuantityProblem, message: string): ParsedQuantity => ({ ok: false, problem, message });
  const wanted = unit === "" ? "a number" : "a number with a unit";

  if (typeof entry !== "string" || entry.trim() === "") return fail("empty", `Type ${wanted} first, e.g. ${example}.`);
  if (entry.length > MAX_ENTRY_LENGTH) {
    return fail("too-long", `That entry is longer than ${MAX_ENTRY_LENGTH} characters. Shorten it, e.g. ${example}.`);
  }

  const value = evaluate(entry, unit);
  if (value === null || isValueless(value) || !Number.isFinite(numericValue(value))) {
    const decimalComma = /\d,\d/.test(entry) ? " Write decimals with a point: 0.33, not 0,33." : "";
    return fail("unparsable", `Could not read ${quoted(entry)} as ${wanted}, e.g. ${example}.${decimalComma}`);
  }

  const expected = unit === "" ? 1 : quantityMath.unit(unit);
  const expectedKind = describeQuantity(expected);
  if (typeof value === "number" && unit !== "") {
    return fail(
      "missing-unit",
      `${quoted(entry)} has no unit; this asks for ${expectedKind}. Add the unit, e.g. ${formatInUnit(value * siFactor(unit), unit)}.`,
    );
  }
  const sameKind = typeof expected === "number" ? describeQuantity(value) === "a plain number" : typeof value !== "number" && value.equalBase(expected);
  if (!sameKind) {
    const askFor = unit === "" ? "a plain number, without a unit" : expectedKind;
    return fail("wrong-dimension", `${quoted(entry)} is ${describeQuantity(value)}; this asks for ${askFor}.${bracketAdvice(entry, value, expected)}`);
  }

  const si = numericValue(value);
  return { ok: true, value: si, shown: formatInUnit(si, unit) };
}

function sameText(entry: string, shown: string): boolean {
  const squeeze = (text: string) => normalizeEntry(text).replace(/\s+/g, "");
  return squeeze(entry) === squeeze(shown);
}

function percent(tolerance: number): string {
  return `${Number((tolerance * 100).toPrecision(2))} %`;
}

/**
 * Grades an entry against an answer: correct when it lies within the answer's relative tolerance.
 * An entry that cannot be read is "unreadable", with the message that says why, and is not wrong.
 */
export function gradeNumericAnswer(entry: string, answer: NumericAnswer): NumericGrade {
  const parsed = parseQuantity(entry, answer.unit);
  if (!parsed.ok) return { status: "unreadable", correct: false, value: null, problem: parsed.problem, message: parsed.message };
  const correct = Math.abs(parsed.value - answer.value) <= answer.tolerance * Math.abs(answer.value);
  const readAs = sameText(entry, parsed.shown) ? parsed.shown : `${quoted(entry)} works out to ${parsed.shown}, which`;
  const message = correct
    ? `Correct: ${parsed.shown}.`
    : answer.tolerance === 0
      ? `Not yet: ${readAs} is not the answer (only the exact value counts).`
      : `Not yet: ${readAs} is not the answer (answers within ${percent(answer.tolerance)} count).`;
  return { status: correct ? "correct" : "incorrect", correct, value: parsed.value, message };
}
