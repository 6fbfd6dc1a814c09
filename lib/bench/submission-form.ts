import { z } from "zod";
import type { BenchStatedValues } from "@/db/queries/bench";
import type { BenchExercise } from "@/lessons";
import { formatInUnit, parseQuantity } from "@/lib/answers";
import { displayUnit } from "@/lib/answers/quantity-kinds";
import { CABLE_KINDS, cableCatalogue } from "@/lib/sim";

// The bench form is drawn from the exercise's own asks, plus the driver's output level (the
// simulator's prediction needs it) and the learner's note. Measured values are typed with their
// units, read by the course's quantity parser and stored in SI.

type QuantityColumn = "lengthM" | "seriesResistanceOhm" | "driverVoltageV" | "riseTimeS" | "overshootV";

export type BenchField =
  | { name: string; kind: "cable"; label: string; options: { value: string; label: string }[] }
  | { name: string; kind: "quantity"; label: string; unit: string; unitLabel: string; column: QuantityColumn; hint: string }
  | { name: string; kind: "text"; label: string; long: boolean };

/** Plausible ranges (SI) for what a learner states; wider than any bench run, narrow enough to catch a slipped unit. */
const quantityRanges: Record<QuantityColumn, { min: number; max: number; minIncluded: boolean; hint: string }> = {
  lengthM: { min: 0, max: 300, minIncluded: false, hint: "e.g. 7.5 m" },
  seriesResistanceOhm: { min: 0, max: 10_000, minIncluded: true, hint: "e.g. 33 ohm, or 0 ohm when none is fitted" },
  driverVoltageV: { min: 0.5, max: 24, minIncluded: true, hint: "the driver's high level, e.g. 3.3 V or 5 V" },
  riseTimeS: { min: 0, max: 10e-6, minIncluded: false, hint: "e.g. 18 ns" },
  overshootV: { min: 0, max: 24, minIncluded: true, hint: "e.g. 0.6 V, or 0 V when there is none" },
};

const columnOfKind = {
  length: "lengthM",
  resistor: "seriesResistanceOhm",
  riseTime: "riseTimeS",
  overshoot: "overshootV",
} as const satisfies Record<string, QuantityColumn>;

export const driverVoltageField = { name: "driver-voltage", label: "Driver output high level", unit: "V" } as const;
export const noteField = { name: "note", label: "Your note: what you measured, and what you conclude" } as const;
const maxTextLength = 2000;

const cableOptions = CABLE_KINDS.map((kind) => ({ value: kind, label: cableCatalogue[kind].label }));

export function benchFormFields(exercise: BenchExercise): BenchField[] {
  const fields: BenchField[] = exercise.asks.map((ask): BenchField => {
    if (ask.kind === "cable") return { name: ask.id, kind: "cable", label: ask.label, options: cableOptions };
    if (ask.kind === "text") return { name: ask.id, kind: "text", label: ask.label, long: true };
    const column = columnOfKind[ask.kind];
    return { name: ask.id, kind: "quantity", label: ask.label, unit: ask.unit, unitLabel: displayUnit(ask.unit), column, hint: quantityRanges[column].hint };
  });
  const afterCable = fields.findIndex((field) => field.kind === "cable") + 1;
  fields.splice(afterCable, 0, {
    name: driverVoltageField.name,
    kind: "quantity",
    label: driverVoltageField.label,
    unit: driverVoltageField.unit,
    unitLabel: displayUnit(driverVoltageField.unit),
    column: "driverVoltageV",
    hint: quantityRanges.driverVoltageV.hint,
  });
  return fields;
}

function quantitySchema(field: Extract<BenchField, { kind: "quantity" }>) {
  const range = quantityRanges[field.column];
  return z.string({ error: "Type a value with its unit." }).transform((entry, ctx) => {
    const parsed = parseQuantity(entry, field.unit);
    if (!parsed.ok) {
      ctx.addIssue({ code: "custom", message: parsed.message });
      return z.NEVER;
    }
    const low = range.minIncluded ? parsed.value < range.min : parsed.value <= range.min;
    if (low || parsed.value > range.max) {
      const from = formatInUnit(range.min, field.unit);
      const to = formatInUnit(range.max, field.unit);
      ctx.addIssue({ code: "custom", message: `${parsed.shown} is outside what a bench run gives (${range.minIncluded ? "" : "above "}${from} to ${to}). Check the unit.` });
      return z.NEVER;
    }
    return parsed.value;
  });
}

const textSchema = (what: string) =>
  z
    .string({ error: `Write ${what}.` })
    .trim()
    .min(1, `Write ${what}.`)
    .max(maxTextLength, `Keep it under ${maxTextLength} characters.`);

function benchFormSchema(fields: BenchField[]) {
  const shape: Record<string, z.ZodType> = {};
  for (const field of fields) {
    if (field.kind === "cable") shape[field.name] = z.enum(CABLE_KINDS, { error: "Choose the cable you used from the list." });
    else if (field.kind === "quantity") shape[field.name] = quantitySchema(field);
    else shape[field.name] = textSchema("an answer");
  }
  shape[noteField.name] = textSchema("a short note of what you measured");
  return z.object(shape);
}

export type BenchFormResult =
  | { ok: true; values: BenchStatedValues }
  | { ok: false; fieldErrors: Record<string, string>; entries: Record<string, string> };

/** Reads the posted form: the stated values in SI, or a message per field that cannot be used. */
export function parseBenchForm(exercise: BenchExercise, formData: FormData): BenchFormResult {
  const fields = benchFormFields(exercise);
  const names = [...fields.map((f) => f.name), noteField.name];
  const entries = Object.fromEntries(names.map((name) => [name, formData.get(name)]).filter(([, v]) => typeof v === "string")) as Record<
    string,
    string
  >;
  const parsed = benchFormSchema(fields).safeParse(entries);
  if (!parsed.success) {
    const fieldErrors: Record<string, string> = {};
    for (const issue of parsed.error.issues) {
      const name = String(issue.path[0] ?? "");
      fieldErrors[name] ??= issue.message;
    }
    return { ok: false, fieldErrors, entries };
  }
  const data = parsed.data as Record<string, string | number>;
  const values: BenchStatedValues = {
    cableKind: null,
    lengthM: null,
    seriesResistanceOhm: null,
    driverVoltageV: null,
    riseTimeS: null,
    overshootV: null,
    textAnswers: {},
    note: String(data[noteField.name]),
  };
  for (const field of fields) {
    const value = data[field.name];
    if (field.kind === "cable") values.cableKind = String(value);
    else if (field.kind === "quantity") values[field.column] = Number(value);
    else values.textAnswers[field.name] = String(value);
  }
  return { ok: true, values };
}

/** The form's entries for stored values, in the units the form asks for, to refill it. */
export function entriesFromStored(exercise: BenchExercise, stored: BenchStatedValues): Record<string, string> {
  const entries: Record<string, string> = {};
  for (const field of benchFormFields(exercise)) {
    if (field.kind === "cable" && stored.cableKind) entries[field.name] = stored.cableKind;
    if (field.kind === "text" && stored.textAnswers[field.name]) entries[field.name] = stored.textAnswers[field.name]!;
    if (field.kind === "quantity") {
      const value = stored[field.column];
      if (value !== null) entries[field.name] = formatInUnit(value, field.unit);
    }
  }
  if (stored.note) entries[noteField.name] = stored.note;
  return entries;
}

/** The stated values as label and text, in the form's units, for reading back. */
export function describeStatedValues(exercise: BenchExercise, stored: BenchStatedValues): { label: string; value: string }[] {
  return benchFormFields(exercise).map((field) => {
    if (field.kind === "cable") {
      const kind = CABLE_KINDS.find((k) => k === stored.cableKind);
      return { label: field.label, value: kind ? cableCatalogue[kind].label : "—" };
    }
    if (field.kind === "text") return { label: field.label, value: stored.textAnswers[field.name] ?? "—" };
    const value = stored[field.column];
    return { label: field.label, value: value === null ? "—" : formatInUnit(value, field.unit) };
  });
}
