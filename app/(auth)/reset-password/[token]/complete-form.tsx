"use client";

import { useActionState } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { SubmitButton } from "@/components/forms/submit-button";
import { TextField } from "@/components/forms/text-field";
import { passwordLimits } from "@/lib/auth/fields";
import { idleFormState } from "@/lib/http/form-state";
import { completePasswordResetAction, type CompleteResetState } from "./actions";

export function CompleteResetForm({ token }: { token: string }) {
  const [state, formAction, pending] = useActionState<CompleteResetState, FormData>(
    completePasswordResetAction,
    idleFormState,
  );
  const errors = state.status === "error" ? state.fieldErrors : {};
  return (
    <form action={formAction} noValidate className="space-y-5">
      <FormAlert tone="error" message={state.status === "error" ? state.message : null} />
      <input type="hidden" name="token" value={token} />
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={passwordLimits.min}
        hint={`At least ${passwordLimits.min} characters.`}
        error={errors.password}
      />
      <TextField
        label="Type the new password again"
        name="confirmPassword"
        type="password"
        autoComplete="new-password"
        required
        error={errors.confirmPassword}
      />
      <SubmitButton pending={pending} pendingLabel="Saving…">
        Save the new password
      </SubmitButton>
    </form>
  );
}
