import { parseQuantity } from "@/lib/answers";
import { formatOhms } from "./quantities";

// Loaded only when a learner types a value: the entry parser is larger than the rest of the
// controls together, and most changes are made with the slider.

export type ResistorEntry = { ok: true; value: number; note: string } | { ok: false; message: string };

/**
 * The value on offer nearest a resistance, and a note saying what was set. Nearest by ratio, as
 * the E-series values are spaced (IEC 60063): 4.3 kΩ lies nearer 4.7 kΩ than 3.9 kΩ does.
 */
export function snapToOffer(ohms: number, values: readonly number[], series: string): { value: number; note: string } {
  const lowest = values[0];
  const highest = values[values.length - 1];
  if (ohms < lowest) return { value: lowest, note: `${formatOhms(ohms)} is below this control's range; set to its lowest value, ${formatOhms(lowest)}.` };
  if (ohms > highest) return { value: highest, note: `${formatOhms(ohms)} is above this control's range; set to its highest value, ${formatOhms(highest)}.` };
  const distance = (value: number) => Math.abs(Math.log(value / ohms));
  const value = values.reduce((best, candidate) => (distance(candidate) < distance(best) ? candidate : best), lowest);
  if (distance(value) < 1e-9) return { value, note: `Set to ${formatOhms(value)}, an ${series} value.` };
  return { value, note: `${formatOhms(ohms)} is not an ${series} value; snapped to the nearest, ${formatOhms(value)}.` };
}

/** A resistance as the trade writes it ("47R", "4k7", "1K", "47 Ω", "47 ohm", or a bare 47), snapped to the control's values. */
export function readResistorEntry(entry: string, values: readonly number[], series: string): ResistorEntry {
  const typed = parseQuantity(entry, "ohm");
  // A bare number on a resistor's control can only mean ohms.
  const parsed = !typed.ok && typed.problem === "missing-unit" ? parseQuantity(`${entry.trim()} ohm`, "ohm") : typed;
  if (!parsed.ok) return { ok: false, message: parsed.message };
  if (!(parsed.value > 0)) return { ok: false, message: "A series resistor's value is above 0 Ω." };
  return { ok: true, ...snapToOffer(parsed.value, values, series) };
}
