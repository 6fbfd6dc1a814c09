"use client";

import { useActionState } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { SubmitButton } from "@/components/forms/submit-button";
import { TextField } from "@/components/forms/text-field";
import { passwordLimits } from "@/lib/auth/fields";
import { idleFormState } from "@/lib/http/form-state";
import { acceptInvitationAction, type AcceptInvitationState } from "./actions";

export function AcceptInvitationForm({ token, email }: { token: string; email: string }) {
  const [state, formAction, pending] = useActionState<AcceptInvitationState, FormData>(
    acceptInvitationAction,
    idleFormState,
  );
  const values = state.status === "error" ? state.values : {};
  const errors = state.status === "error" ? state.fieldErrors : {};
  return (
    <form action={formAction} noValidate className="space-y-5">
      <FormAlert tone="error" message={state.status === "error" ? state.message : null} />
      <input type="hidden" name="token" value={token} />
      <div className="space-y-1.5">
        <p className="text-sm font-medium text-ink">E-mail address</p>
        <p className="rounded-lg border border-line bg-sunken px-3 py-2.5 text-base break-all text-ink-soft">{email}</p>
      </div>
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        required
        maxLength={120}
        hint="As it should appear to your instructor and on your certificate."
        defaultValue={values.name}
        error={errors.name}
      />
      <TextField
        label="Choose a password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={passwordLimits.min}
        hint={`At least ${passwordLimits.min} characters. A short sentence is easy to remember.`}
        error={errors.password}
      />
      <TextField
        label="Type the password again"
        name="confirmPassword"
        type="password"
        autoComplete="new-password"
        required
        error={errors.confirmPassword}
      />
      <SubmitButton pending={pending} pendingLabel="Setting up your account…">
        Set up my account
      </SubmitButton>
    </form>
  );
}
