import { DISPLAY_UNITS, isDisplayUnit } from "./display-units";
import { formatQuantity, type FormatOptions } from "./format-quantity";
import type { LessonNumber, LessonNumbers } from "./lesson-number";

/**
 * `{{name}}` in lesson text prints the named number with its unit and decimals; options after a
 * `|` change how: `{{lone.z0|dp=0|bare}}` → "351". Options:
 *   dp=N      N decimal places            unit=U   another unit of the same kind (ns → µs)
 *   bare      without the unit            abs      the magnitude (Γ = −0.892 → 0.892)
 *   sign      "+" before positive numbers exp=N    a fixed power of ten (523 × 10⁻⁹)
 *   sci       a normalised power of ten (3.11 × 10⁻¹⁷)
 *   sup       a whole number as an exponent (Γs{{n|sup}} → Γs³)
 */
export const PLACEHOLDER = /\{\{([^{}]*)\}\}/g;

type Parsed = { name: string; options: FormatOptions } | { problem: string };

const FLAGS = { bare: "bare", abs: "abs", sign: "sign", sci: "scientific", sup: "superscript" } as const;

function parseOptions(name: string, entry: LessonNumber, options: string[]): Parsed {
  const format: FormatOptions = { unit: entry.unit, decimals: entry.decimals };
  for (const option of options) {
    const [key, argument] = option.split("=", 2).map((part) => part.trim());
    if (argument === undefined && Object.hasOwn(FLAGS, key)) {
      format[FLAGS[key as keyof typeof FLAGS]] = true;
    } else if (key === "dp" && /^[0-6]$/.test(argument ?? "")) {
      format.decimals = Number(argument);
    } else if (key === "exp" && /^-?\d{1,2}$/.test(argument ?? "")) {
      format.exponent = Number(argument);
    } else if (key === "unit" && argument !== undefined && isDisplayUnit(argument)) {
      if (DISPLAY_UNITS[argument].dimension !== DISPLAY_UNITS[entry.unit].dimension) {
        return { problem: `{{${name}}} is in ${entry.unit || "plain numbers"} and cannot be shown in ${argument}` };
      }
      format.unit = argument;
    } else {
      return { problem: `unknown option "${option}" in {{${name}}}; use dp=N, unit=U, bare, abs, sign, exp=N, sci or sup` };
    }
  }
  return { name, options: format };
}

function parsePlaceholder(inner: string, numbers: LessonNumbers): Parsed {
  const [rawName, ...options] = inner.split("|");
  const name = rawName.trim();
  const entry = Object.hasOwn(numbers, name) ? numbers[name] : undefined;
  if (!entry) return { problem: `unknown number {{${name}}}: define it in the lesson's numbers.ts` };
  return parseOptions(name, entry, options);
}

/** The text with every placeholder printed, and what was wrong with any that could not be. */
export function resolvePlaceholders(text: string, numbers: LessonNumbers): { text: string; problems: string[] } {
  const problems: string[] = [];
  const resolved = text.replace(PLACEHOLDER, (whole, inner: string) => {
    const parsed = parsePlaceholder(inner, numbers);
    if ("problem" in parsed) {
      problems.push(parsed.problem);
      return whole;
    }
    return formatQuantity(numbers[parsed.name].value, parsed.options);
  });
  const stray = resolved.replace(PLACEHOLDER, "").match(/\{\{|\}\}/);
  if (stray) problems.push(`"${stray[0]}" without its pair: a placeholder is {{name}} or {{name|option}}`);
  return { text: resolved, problems };
}

/** The names a text refers to. */
export function placeholderNames(text: string): string[] {
  return [...text.matchAll(PLACEHOLDER)].map((match) => match[1].split("|")[0].trim());
}
