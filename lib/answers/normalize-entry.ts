/**
 * Rewrites what people commonly type but mathjs does not read: the micro sign and Greek mu for the
 * "u" prefix, the ohm sign and the unit's name in any case or plural ("Ohm", "ohms"), pi,
 * typographic minus and multiplication signs, and a capital K before hertz or ohms (kilo is lower
 * case, but "KHz" and "KΩ" are everywhere on the trade's labels).
 */
export function normalizeEntry(entry: string): string {
  return entry
    .trim()
    .replace(/[\u00b5\u03bc]/g, "u")
    .replace(/[\u2126\u03a9]/g, "ohm")
    .replace(/ohms?\b/gi, "ohm")
    .replace(/[\u2212\u2013]/g, "-")
    .replace(/[\u00d7\u22c5\u00b7]/g, "*")
    .replace(/\u03c0/g, " pi ")
    .replace(/(?<![A-Za-z])K(?=(?:Hz|ohm)\b)/g, "k");
}
