"use client";

import { useActionState } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { SubmitButton } from "@/components/forms/submit-button";
import { TextField } from "@/components/forms/text-field";
import { idleFormState } from "@/lib/http/form-state";
import { requestPasswordResetAction, type RequestResetState } from "./actions";

export function RequestResetForm() {
  const [state, formAction, pending] = useActionState<RequestResetState, FormData>(
    requestPasswordResetAction,
    idleFormState,
  );
  const values = state.status === "error" ? state.values : {};
  const errors = state.status === "error" ? state.fieldErrors : {};
  return (
    <form action={formAction} noValidate className="space-y-5">
      <FormAlert
        tone={state.status === "success" ? "success" : "error"}
        message={state.status === "idle" ? null : state.message}
      />
      <TextField
        label="E-mail address"
        name="email"
        type="email"
        autoComplete="email"
        required
        defaultValue={values.email}
        error={errors.email}
      />
      <SubmitButton pending={pending} pendingLabel="Sending…">
        Send me a reset link
      </SubmitButton>
    </form>
  );
}
