"use client";

import { useActionState } from "react";
import { describedByIds, FieldFrame, fieldControlClass } from "@/components/forms/field-frame";
import { FormAlert } from "@/components/forms/form-alert";
import { SelectField } from "@/components/forms/select-field";
import { SubmitButton } from "@/components/forms/submit-button";
import { TextField } from "@/components/forms/text-field";
import type { BenchField } from "@/lib/bench/submission-form";
import { idleFormState } from "@/lib/http/form-state";
import { submitBenchWork, type BenchFormState } from "./actions";

function TextArea({ name, label, defaultValue, error, rows }: { name: string; label: string; defaultValue?: string; error?: string; rows: number }) {
  const id = `field-${name}`;
  return (
    <FieldFrame id={id} label={label} error={error}>
      <textarea
        id={id}
        name={name}
        rows={rows}
        maxLength={2000}
        defaultValue={defaultValue}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedByIds(id, { error })}
        className={fieldControlClass(error)}
      />
    </FieldFrame>
  );
}

/** The readings and the note. Values are typed with units, as on the bench: "14 ns", "0.4 V". */
export function BenchForm({
  exerciseSlug,
  fields,
  noteLabel,
  defaults,
  resubmission,
}: {
  exerciseSlug: string;
  fields: BenchField[];
  noteLabel: string;
  defaults: Record<string, string>;
  resubmission: boolean;
}) {
  const [state, formAction, pending] = useActionState<BenchFormState, FormData>(submitBenchWork.bind(null, exerciseSlug), idleFormState);
  const values = state.status === "error" ? { ...defaults, ...state.values } : defaults;
  const errors: Partial<Record<string, string>> = state.status === "error" ? state.fieldErrors : {};
  const quantities = fields.filter((f) => f.kind === "quantity");

  return (
    <form action={formAction} noValidate className="space-y-5">
      {fields
        .filter((f) => f.kind === "cable")
        .map((field) => (
          // Keyed by its value: React restores a select to its first default when a form action resets the form.
          <SelectField
            key={`${field.name}:${values[field.name] ?? ""}`}
            label={field.label}
            name={field.name}
            options={[{ value: "", label: "Choose the cable…" }, ...field.options]}
            defaultValue={values[field.name] ?? ""}
            error={errors[field.name]}
          />
        ))}
      <div className="grid gap-4 sm:grid-cols-2">
        {quantities.map((field) => (
          <TextField
            key={field.name}
            label={`${field.label} (${field.unitLabel})`}
            name={field.name}
            defaultValue={values[field.name]}
            error={errors[field.name]}
            hint={field.hint}
            autoComplete="off"
          />
        ))}
      </div>
      {fields
        .filter((f) => f.kind === "text")
        .map((field) => (
          <TextArea key={field.name} name={field.name} label={field.label} rows={4} defaultValue={values[field.name]} error={errors[field.name]} />
        ))}
      <TextArea name="note" label={noteLabel} rows={4} defaultValue={values.note} error={errors.note} />
      <FormAlert tone={state.status === "success" ? "success" : "error"} message={state.status === "idle" ? null : state.message} />
      <SubmitButton pending={pending} pendingLabel="Handing in…" wide={false}>
        {resubmission ? "Hand in again for review" : "Hand in for review"}
      </SubmitButton>
    </form>
  );
}
