import { z } from "zod";
import { describeError } from "./errors";

// The result a server action hands back to its form: errors are returned, not thrown, and the
// typed values come back so the form can be refilled.

export type FormState<Field extends string> =
  | { status: "idle" }
  | { status: "error"; message: string; fieldErrors: Partial<Record<Field, string>>; values: Partial<Record<Field, string>> }
  | { status: "success"; message: string };

export const idleFormState = { status: "idle" } as const;

/** Plain strings from FormData, for refilling fields; passwords are never sent back. */
export function readFormValues<Field extends string>(
  formData: FormData,
  fields: readonly Field[],
): Partial<Record<Field, string>> {
  const values: Partial<Record<Field, string>> = {};
  for (const field of fields) {
    const value = formData.get(field);
    if (typeof value === "string" && !/password/i.test(field)) values[field] = value;
  }
  return values;
}

export function invalidFormState<Field extends string>(
  error: z.ZodError,
  values: Partial<Record<Field, string>>,
  message = "Check the highlighted fields.",
): FormState<Field> {
  const fieldErrors: Partial<Record<Field, string>> = {};
  for (const issue of error.issues) {
    const field = issue.path[0] as Field | undefined;
    if (field !== undefined && !fieldErrors[field]) fieldErrors[field] = issue.message;
  }
  return { status: "error", message, fieldErrors, values };
}

export function failedFormState<Field extends string>(
  message: string,
  values: Partial<Record<Field, string>>,
  fieldErrors: Partial<Record<Field, string>> = {},
): FormState<Field> {
  return { status: "error", message, fieldErrors, values };
}

/** For a failure the person cannot fix by editing the form: logged, and answered with a safe sentence. */
export function unexpectedFormState<Field extends string>(
  error: unknown,
  values: Partial<Record<Field, string>>,
): FormState<Field> {
  return failedFormState(describeError(error).body.error.message, values);
}

/**
 * A server action is a public endpoint: anyone can call it with any arguments, not only through
 * its form. Whatever arrives in place of the form data that is not form data is read as an empty
 * form, which the action's own validation then refuses with its usual message.
 */
export function formDataOrEmpty(value: unknown): FormData {
  return value instanceof FormData ? value : new FormData();
}
