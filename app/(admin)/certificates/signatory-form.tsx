"use client";

import { useActionState } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { SubmitButton } from "@/components/forms/submit-button";
import { TextField } from "@/components/forms/text-field";
import { idleFormState } from "@/lib/http/form-state";
import type { Signatory } from "@/lib/certificates/signatory";
import { saveSignatoryAction, type SignatoryState } from "./actions";

/** Who signs the school's certificates from now on: a name and a role, both printed on each certificate. */
export function SignatoryForm({ current }: { current: Signatory | null }) {
  const [state, formAction, pending] = useActionState<SignatoryState, FormData>(saveSignatoryAction, idleFormState);
  const values = state.status === "error" ? state.values : {};
  const errors = state.status === "error" ? state.fieldErrors : {};
  return (
    <form action={formAction} noValidate className="space-y-4">
      <FormAlert tone={state.status === "error" ? "error" : "success"} message={state.status === "idle" ? null : state.message} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Name"
          name="signatoryName"
          required
          minLength={2}
          maxLength={80}
          autoComplete="off"
          defaultValue={values.signatoryName ?? current?.name}
          error={errors.signatoryName}
        />
        <TextField
          label="Role at the school"
          name="signatoryRole"
          required
          minLength={2}
          maxLength={80}
          autoComplete="off"
          hint="For example: Head of the electrical department"
          defaultValue={values.signatoryRole ?? current?.role}
          error={errors.signatoryRole}
        />
      </div>
      <SubmitButton pending={pending} pendingLabel="Saving…" wide={false}>
        Save the signatory
      </SubmitButton>
    </form>
  );
}
