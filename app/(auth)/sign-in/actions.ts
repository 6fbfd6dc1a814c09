"use server";

import { redirect } from "next/navigation";
import { z } from "zod";
import { safeReturnPath } from "@/lib/auth/access";
import { emailSchema } from "@/lib/auth/fields";
import { homePathFor } from "@/lib/auth/permissions";
import { replaceSessionCookie } from "@/lib/auth/session-cookie";
import { signInWithPassword, type SignInResult } from "@/lib/auth/sign-in";
import { readClientAddress } from "@/lib/client-address/client-address";
import { describeWait } from "@/lib/http/errors";
import {
  failedFormState,
  formDataOrEmpty,
  invalidFormState,
  readFormValues,
  unexpectedFormState,
  type FormState,
} from "@/lib/http/form-state";

export type SignInField = "email" | "password" | "next";
export type SignInState = FormState<SignInField>;

const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200, "That password is too long."),
  next: z.string().optional(),
});

export async function signIn(_previous: SignInState, formData: FormData): Promise<SignInState> {
  formData = formDataOrEmpty(formData);
  const values = readFormValues(formData, ["email", "next"] as const);
  const parsed = signInSchema.safeParse(Object.fromEntries(formData));
  if (!parsed.success) return invalidFormState(parsed.error, values);

  let result: SignInResult;
  try {
    result = await signInWithPassword({
      email: parsed.data.email,
      password: parsed.data.password,
      clientAddress: await readClientAddress(),
    });
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  if (!result.ok && result.reason === "throttled") {
    return failedFormState(`Too many attempts. Try again in ${describeWait(result.retryAfterSeconds)}.`, values);
  }
  if (!result.ok) return failedFormState("That e-mail and password do not match an account. Check both and try again.", values);

  await replaceSessionCookie(result.cookie);
  redirect(safeReturnPath(parsed.data.next) ?? homePathFor(result.user.role));
}
