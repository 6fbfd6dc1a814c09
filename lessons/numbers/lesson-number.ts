import { z } from "zod";
import { DISPLAY_UNIT_NAMES, type DisplayUnit } from "./display-units";

/**
 * A number a lesson's text quotes: its value in SI units, the unit and decimal places it is
 * printed with unless a placeholder says otherwise, and where it comes from (the simulator's
 * catalogue or defaults, the course's drivers, a formula with its inputs, a simulator run, a
 * standard, a worked example's premise).
 */
export const lessonNumberSchema = z.strictObject({
  value: z.number().finite(),
  unit: z.enum(DISPLAY_UNIT_NAMES),
  decimals: z.number().int().min(0).max(6),
  source: z.string().trim().min(1),
});

/** Dotted camelCase names: `lone.z0`, `case1.launched`. */
export const numberNameSchema = z
  .string()
  .regex(/^[a-z][A-Za-z0-9]*(\.[a-zA-Z0-9]+)*$/, "must be a dotted camelCase name such as case1.launched");

export const lessonNumbersSchema = z.record(numberNameSchema, lessonNumberSchema);

export type LessonNumber = z.infer<typeof lessonNumberSchema>;
export type LessonNumbers = z.infer<typeof lessonNumbersSchema>;

export function quantity(value: number, unit: DisplayUnit, decimals: number, source: string): LessonNumber {
  return { value, unit, decimals, source };
}

/** Numbers grouped by name; `{ case1: { launched } }` is referenced as `case1.launched`. */
export type NumberTree = { readonly [name: string]: LessonNumber | NumberTree };

const isNumber = (node: LessonNumber | NumberTree): node is LessonNumber => typeof node.value === "number";

export function flattenNumbers(tree: NumberTree, prefix = ""): LessonNumbers {
  return Object.fromEntries(
    Object.entries(tree).flatMap(([name, node]) =>
      isNumber(node) ? [[`${prefix}${name}`, node]] : Object.entries(flattenNumbers(node, `${prefix}${name}.`)),
    ),
  );
}
