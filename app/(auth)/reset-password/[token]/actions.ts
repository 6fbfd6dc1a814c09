"use server";

import { redirect } from "next/navigation";
import { z } from "zod";
import { newPasswordSchema, tokenSchema, withMatchingPasswords } from "@/lib/auth/fields";
import { completePasswordReset, type CompletePasswordResetResult } from "@/lib/auth/password-reset";
import { homePathFor } from "@/lib/auth/permissions";
import { replaceSessionCookie } from "@/lib/auth/session-cookie";
import {
  failedFormState,
  formDataOrEmpty,
  invalidFormState,
  readFormValues,
  unexpectedFormState,
  type FormState,
} from "@/lib/http/form-state";
import { passwordResetProblems } from "../../link-problems";

export type CompleteResetField = "token" | "password" | "confirmPassword";
export type CompleteResetState = FormState<CompleteResetField>;

const completeSchema = withMatchingPasswords(
  z.object({
    token: tokenSchema,
    password: newPasswordSchema,
    confirmPassword: z.string({ error: "Type the password again." }),
  }),
);

export async function completePasswordResetAction(
  _previous: CompleteResetState,
  formData: FormData,
): Promise<CompleteResetState> {
  formData = formDataOrEmpty(formData);
  const values = readFormValues(formData, ["token"] as const);
  const parsed = completeSchema.safeParse(Object.fromEntries(formData));
  if (!parsed.success) return invalidFormState(parsed.error, values);

  let result: CompletePasswordResetResult;
  try {
    result = await completePasswordReset({ token: parsed.data.token, password: parsed.data.password });
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  if (!result.ok) return failedFormState(passwordResetProblems[result.reason], values);
  await replaceSessionCookie(result.cookie);
  redirect(homePathFor(result.role));
}
