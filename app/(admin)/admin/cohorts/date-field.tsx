import { describedByIds, FieldFrame, fieldControlClass } from "@/components/forms/field-frame";

/** A calendar date input with the same label, hint and error layout as the shared text fields. */
export function DateField({
  label,
  name,
  defaultValue,
  error,
}: {
  label: string;
  name: string;
  defaultValue?: string;
  error?: string;
}) {
  const id = `field-${name}`;
  return (
    <FieldFrame id={id} label={label} error={error}>
      <input
        id={id}
        name={name}
        type="date"
        required
        defaultValue={defaultValue}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedByIds(id, { error })}
        className={fieldControlClass(error)}
      />
    </FieldFrame>
  );
}
