"use client";

import { useActionState } from "react";
import { SubmitButton } from "@/components/forms/submit-button";
import { TextField } from "@/components/forms/text-field";
import { idleFormState } from "@/lib/http/form-state";
import { StatusNotice } from "../../status-notice";
import { enrolLearnerAction, type EnrolState } from "./actions";

export function EnrolForm({ cohortId }: { cohortId: string }) {
  const [state, formAction, pending] = useActionState<EnrolState, FormData>(enrolLearnerAction, idleFormState);
  const values = state.status === "error" ? state.values : {};
  const errors = state.status === "error" ? state.fieldErrors : {};
  return (
    <form action={formAction} noValidate className="space-y-4">
      <StatusNotice tone={state.status === "idle" ? "success" : state.status} message={state.status === "idle" ? null : state.message} />
      <input type="hidden" name="cohortId" value={cohortId} />
      <TextField label="Learner's name" name="name" autoComplete="off" required maxLength={120} defaultValue={values.name} error={errors.name} />
      <TextField label="Learner's e-mail" name="email" type="email" autoComplete="off" required defaultValue={values.email} error={errors.email} />
      <SubmitButton pending={pending} pendingLabel="Enrolling…" wide={false}>
        Enrol and invite
      </SubmitButton>
    </form>
  );
}
