import { DISPLAY_UNITS, type DisplayUnit } from "./display-units";

/**
 * How one number is printed in lesson text, in the course's typography: a typographic minus,
 * thousands grouped with commas, a space before the unit ("63 %", "4.73 V").
 * - `decimals`: places after the point (of the mantissa when a power of ten is shown);
 * - `bare`: the number without its unit, for arithmetic written out ("5 V × 351 / (20 + 351)");
 * - `abs`: the magnitude, for "1 + 0.892" written from Γ = −0.892;
 * - `sign`: a "+" before positive numbers (reflection coefficients);
 * - `exponent`: a fixed power of ten ("523 × 10⁻⁹ H/m" with exponent −9 in H/m);
 * - `scientific`: a normalised power of ten ("3.11 × 10⁻¹⁷");
 * - `superscript`: a whole number as an exponent ("0.665³"), without its unit.
 */
export type FormatOptions = {
  unit: DisplayUnit;
  decimals: number;
  bare?: boolean;
  abs?: boolean;
  sign?: boolean;
  exponent?: number;
  scientific?: boolean;
  superscript?: boolean;
};

const SUPERSCRIPT: Record<string, string> = {
  "-": "⁻",
  "0": "⁰",
  "1": "¹",
  "2": "²",
  "3": "³",
  "4": "⁴",
  "5": "⁵",
  "6": "⁶",
  "7": "⁷",
  "8": "⁸",
  "9": "⁹",
};

const superscript = (n: number) => [...String(n)].map((c) => SUPERSCRIPT[c]).join("");

const grouped = (magnitude: number, decimals: number) =>
  new Intl.NumberFormat("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(magnitude);

/** The magnitude as printed, and whether it rounds to zero (which then carries no sign). */
function magnitudeText(magnitude: number, options: FormatOptions): { text: string; zero: boolean } {
  const { decimals } = options;
  const power = options.scientific
    ? Math.floor(Math.log10(Number(magnitude.toPrecision(decimals + 1))))
    : options.exponent;
  if (power === undefined || magnitude === 0) {
    const text = grouped(magnitude, decimals);
    return { text, zero: Number(magnitude.toFixed(decimals)) === 0 };
  }
  const mantissa = magnitude / 10 ** power;
  return { text: `${grouped(mantissa, decimals)} × 10${superscript(power)}`, zero: Number(mantissa.toFixed(decimals)) === 0 };
}

export function formatQuantity(value: number, options: FormatOptions): string {
  if (options.superscript) return superscript(Math.round(value / DISPLAY_UNITS[options.unit].scale));
  const shown = value / DISPLAY_UNITS[options.unit].scale;
  const signed = options.abs ? Math.abs(shown) : shown;
  const { text, zero } = magnitudeText(Math.abs(signed), options);
  const sign = zero ? "" : signed < 0 ? "−" : options.sign ? "+" : "";
  const unit = options.bare || options.unit === "" ? "" : ` ${options.unit}`;
  return `${sign}${text}${unit}`;
}
