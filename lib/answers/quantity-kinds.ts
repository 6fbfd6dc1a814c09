import { quantityMath, type QuantityUnit } from "./quantity-math";

/** Names of the quantities the course asks for, and an entry of each kind to show as an example. */
const kinds: readonly { unit: string; name: string; example: number }[] = [
  { unit: "s", name: "a time", example: 330 },
  { unit: "Hz", name: "a frequency", example: 12 },
  { unit: "V", name: "a voltage", example: 2.7 },
  { unit: "A", name: "a current", example: 40 },
  { unit: "ohm", name: "a resistance", example: 47 },
  { unit: "F", name: "a capacitance", example: 120 },
  { unit: "H", name: "an inductance", example: 150 },
  { unit: "m", name: "a length", example: 5 },
  { unit: "F/m", name: "a capacitance per metre", example: 60 },
  { unit: "H/m", name: "an inductance per metre", example: 520 },
  { unit: "s/m", name: "a delay per metre", example: 8 },
  { unit: "ohm/m", name: "a resistance per metre", example: 0.02 },
  { unit: "m/s", name: "a speed", example: 2 },
  { unit: "V/s", name: "a rate of change of voltage", example: 1 },
  { unit: "W", name: "a power", example: 60 },
  { unit: "J", name: "an energy", example: 2 },
  { unit: "C", name: "a charge", example: 1 },
  { unit: "S", name: "a conductance", example: 10 },
  { unit: "K", name: "a temperature", example: 300 },
  { unit: "kg", name: "a mass", example: 1 },
  { unit: "m^2", name: "an area", example: 1.5 },
];

const references = kinds.map((kind) => ({ ...kind, reference: quantityMath.unit(kind.unit) }));

function kindOf(unit: QuantityUnit) {
  return references.find((kind) => unit.equalBase(kind.reference));
}

/** "a voltage", or for a quantity the course never names, its units in SI. */
export function describeQuantity(value: number | QuantityUnit): string {
  if (typeof value === "number" || value.dimensions.every((d) => d === 0)) return "a plain number";
  const kind = kindOf(value);
  if (kind) return kind.name;
  return `a quantity in ${value.toSI().formatUnits()}`;
}

/** The unit as a person writes it: µs rather than us, Ω rather than ohm. */
export function displayUnit(unit: string): string {
  return unit.replace(/(^|[^A-Za-z])u(?=[A-Za-z])/g, "$1µ").replace(/ohm/g, "Ω");
}

/** A well-formed entry in the expected unit, for messages: "330 ns", "47 Ω", "0.25". */
export function exampleEntry(unit: string): string {
  if (unit === "") return "0.25";
  const kind = kindOf(quantityMath.unit(unit));
  return `${kind?.example ?? 2.5} ${displayUnit(unit)}`;
}

/** What to type, for the answer field's help line: "A time with its unit, e.g. 330 ns". */
export function describeExpectedEntry(unit: string): string {
  if (unit === "") return `A plain number, e.g. ${exampleEntry(unit)}`;
  const kind = describeQuantity(quantityMath.unit(unit)).replace(/^an? /, "");
  return `${kind.charAt(0).toUpperCase()}${kind.slice(1)} with its unit, e.g. ${exampleEntry(unit)}`;
}
