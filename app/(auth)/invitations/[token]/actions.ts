"use server";

import { redirect } from "next/navigation";
import { z } from "zod";
import { newPasswordSchema, personNameSchema, tokenSchema, withMatchingPasswords } from "@/lib/auth/fields";
import { acceptInvitation, type AcceptInvitationResult } from "@/lib/auth/invitations";
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
import { invitationProblems } from "../../link-problems";

export type AcceptInvitationField = "token" | "name" | "password" | "confirmPassword";
export type AcceptInvitationState = FormState<AcceptInvitationField>;

const acceptSchema = withMatchingPasswords(
  z.object({
    token: tokenSchema,
    name: personNameSchema,
    password: newPasswordSchema,
    confirmPassword: z.string({ error: "Type the password again." }),
  }),
);

export async function acceptInvitationAction(
  _previous: AcceptInvitationState,
  formData: FormData,
): Promise<AcceptInvitationState> {
  formData = formDataOrEmpty(formData);
  const values = readFormValues(formData, ["token", "name"] as const);
  const parsed = acceptSchema.safeParse(Object.fromEntries(formData));
  if (!parsed.success) return invalidFormState(parsed.error, values);

  let result: AcceptInvitationResult;
  try {
    result = await acceptInvitation(parsed.data);
  } catch (error) {
    return unexpectedFormState(error, values);
  }
  if (!result.ok) return failedFormState(invitationProblems[result.reason], values);
  await replaceSessionCookie(result.cookie);
  redirect(homePathFor(result.role));
}
