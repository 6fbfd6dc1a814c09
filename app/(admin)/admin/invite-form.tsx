"use client";

import { useActionState } from "react";
import { SelectField } from "@/components/forms/select-field";
import { SubmitButton } from "@/components/forms/submit-button";
import { TextField } from "@/components/forms/text-field";
import { idleFormState } from "@/lib/http/form-state";
import { invitePerson, type InviteState } from "./actions";
import { StatusNotice } from "./status-notice";

const roleOptions = [
  { value: "learner", label: "Learner" },
  { value: "instructor", label: "Instructor" },
] as const;

export function InviteForm({ cohorts }: { cohorts: { id: string; name: string }[] }) {
  const [state, formAction, pending] = useActionState<InviteState, FormData>(invitePerson, idleFormState);
  const values = state.status === "error" ? state.values : {};
  const errors = state.status === "error" ? state.fieldErrors : {};
  const cohortOptions = [{ value: "", label: "No cohort yet" }, ...cohorts.map((c) => ({ value: c.id, label: c.name }))];
  return (
    <form action={formAction} noValidate className="space-y-4">
      <StatusNotice tone={state.status === "idle" ? "success" : state.status} message={state.status === "idle" ? null : state.message} />
      <TextField label="E-mail address" name="email" type="email" required defaultValue={values.email} error={errors.email} />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Role" name="role" options={roleOptions} defaultValue={values.role ?? "learner"} error={errors.role} />
        <SelectField
          label="Cohort"
          name="cohortId"
          options={cohortOptions}
          defaultValue={values.cohortId ?? ""}
          error={errors.cohortId}
        />
      </div>
      <SubmitButton pending={pending} pendingLabel="Sending invitation…" wide={false}>
        Send invitation
      </SubmitButton>
    </form>
  );
}
