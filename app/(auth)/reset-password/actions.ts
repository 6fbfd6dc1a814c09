"use server";

import { after } from "next/server";
import { z } from "zod";
import { emailSchema } from "@/lib/auth/fields";
import { admitPasswordResetRequest, passwordResetLifetimeMinutes, requestPasswordReset } from "@/lib/auth/password-reset";
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

export type RequestResetField = "email";
export type RequestResetState = FormState<RequestResetField>;

const requestSchema = z.object({ email: emailSchema });

export async function requestPasswordResetAction(
  _previous: RequestResetState,
  formData: FormData,
): Promise<RequestResetState> {
  formData = formDataOrEmpty(formData);
  const values = readFormValues(formData, ["email"] as const);
  const parsed = requestSchema.safeParse(Object.fromEntries(formData));
  if (!parsed.success) return invalidFormState(parsed.error, values);

  let admitted: Awaited<ReturnType<typeof admitPasswordResetRequest>>;
  try {
    admitted = await admitPasswordResetRequest({ email: parsed.data.email, clientAddress: await readClientAddress() });
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  if (!admitted.allowed) {
    return failedFormState(`Too many reset requests. Try again in ${describeWait(admitted.retryAfterSeconds)}.`, values);
  }

  // The lookup and the e-mail happen after the response, so the answer comes back equally fast
  // whether or not the address has an account.
  after(() =>
    requestPasswordReset({ email: parsed.data.email }).catch((error: unknown) => {
      console.error("Password reset e-mail failed", error);
    }),
  );
  return {
    status: "success",
    message: `If an account uses ${parsed.data.email}, a link to choose a new password is on its way. It works for ${passwordResetLifetimeMinutes} minutes.`,
  };
}
