"use client";

import Link from "next/link";
import { useActionState } from "react";
import { FormAlert } from "@/components/forms/form-alert";
import { SelectField } from "@/components/forms/select-field";
import { SubmitButton } from "@/components/forms/submit-button";
import { TextField } from "@/components/forms/text-field";
import { buttonClass } from "@/components/ui/button-class";
import { idleFormState } from "@/lib/http/form-state";
import { saveCohortAction, type CohortFormState } from "./actions";
import { DateField } from "./date-field";

export type CohortFormValues = {
  cohortId: string | null;
  name: string;
  courseSlug: string;
  startsOn: string;
  endsOn: string;
  instructorIds: string[];
};

type Instructor = { id: string; name: string; email: string; active: boolean };

export function CohortForm({
  initial,
  courses,
  instructors,
  cancelHref,
}: {
  initial: CohortFormValues;
  courses: { value: string; label: string }[];
  instructors: Instructor[];
  cancelHref: string;
}) {
  const [state, formAction, pending] = useActionState<CohortFormState, FormData>(saveCohortAction, idleFormState);
  const values = state.status === "error" ? state.values : {};
  const errors = state.status === "error" ? state.fieldErrors : {};
  const chosen = new Set(values.instructorIds !== undefined ? values.instructorIds.split(",").filter(Boolean) : initial.instructorIds);
  const creating = initial.cohortId === null;

  return (
    <form action={formAction} noValidate className="space-y-5">
      <FormAlert tone="error" message={state.status === "error" ? state.message : null} />
      <input type="hidden" name="cohortId" value={initial.cohortId ?? ""} />
      <TextField label="Cohort name" name="name" required maxLength={120} defaultValue={values.name ?? initial.name} error={errors.name}
        hint="Learners and instructors see it. For example: Data lines — autumn evenings." />
      <SelectField label="Course" name="courseSlug" options={courses} defaultValue={values.courseSlug ?? initial.courseSlug} error={errors.courseSlug} />
      <div className="grid gap-4 sm:grid-cols-2">
        <DateField label="First day" name="startsOn" defaultValue={values.startsOn ?? initial.startsOn} error={errors.startsOn} />
        <DateField label="Last day" name="endsOn" defaultValue={values.endsOn ?? initial.endsOn} error={errors.endsOn} />
      </div>
      <fieldset className="space-y-2" aria-describedby={errors.instructorIds ? "instructors-error" : undefined}>
        <legend className="text-sm font-medium text-ink">Instructors</legend>
        {instructors.length === 0 ? (
          <p className="text-sm text-ink-soft">
            Your school has no instructors yet. Invite one from the school page; you can add them here later.
          </p>
        ) : (
          <ul className="divide-y divide-line rounded-lg border border-line-strong">
            {instructors.map((instructor) => (
              <li key={instructor.id}>
                <label className="flex cursor-pointer items-start gap-3 px-3 py-2.5 hover:bg-sunken">
                  <input
                    type="checkbox"
                    name="instructorIds"
                    value={instructor.id}
                    defaultChecked={chosen.has(instructor.id)}
                    className="mt-1 size-4 accent-accent"
                  />
                  <span className="min-w-0">
                    <span className="block font-medium">
                      {instructor.name}
                      {instructor.active ? null : <span className="ml-2 text-xs font-normal text-danger">deactivated</span>}
                    </span>
                    <span className="block text-sm break-all text-ink-soft">{instructor.email}</span>
                  </span>
                </label>
              </li>
            ))}
          </ul>
        )}
        {errors.instructorIds ? (
          <p id="instructors-error" className="text-sm font-medium text-danger">
            {errors.instructorIds}
          </p>
        ) : null}
      </fieldset>
      <div className="flex flex-wrap items-center gap-3">
        <SubmitButton pending={pending} pendingLabel={creating ? "Creating…" : "Saving…"} wide={false}>
          {creating ? "Create cohort" : "Save changes"}
        </SubmitButton>
        <Link href={cancelHref} className={buttonClass("quiet")}>
          Cancel
        </Link>
      </div>
    </form>
  );
}
