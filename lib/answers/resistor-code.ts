/**
 * The resistance code printed on resistors and schematics (IEC 60062's letter and digit code): the
 * letter stands where the decimal point would be and gives the multiplier, R for ohms, K for
 * kilohms, M for megohms. "4K7" is 4.7 kΩ, "321R" 321 Ω, "R47" 0.47 Ω, "1K" 1 kΩ. The trade also
 * writes the letter after a decimal number ("4.7k"), read here the same way. Case is ignored, as
 * people type "4k7" as often as "4K7".
 */
const resistorCode = /^(?:(\d+)([RKM])(\d*)|(\d*\.\d+|\d+\.?)([RKM])|([RKM])(\d+))$/i;

const multipliers: Record<string, number> = { R: 1, K: 1e3, M: 1e6 };

/** The resistance in ohms that a code such as "4k7" names, or null when the entry is not one. */
export function readResistorCode(entry: string): number | null {
  const match = resistorCode.exec(entry.trim());
  if (!match) return null;
  const [, whole, letter, fraction, decimal, decimalLetter, leadingLetter, leadingFraction] = match;
  if (whole !== undefined) return Number(`${whole}.${fraction || "0"}`) * multipliers[letter!.toUpperCase()]!;
  if (decimal !== undefined) return Number(decimal) * multipliers[decimalLetter!.toUpperCase()]!;
  return Number(`0.${leadingFraction}`) * multipliers[leadingLetter!.toUpperCase()]!;
}
