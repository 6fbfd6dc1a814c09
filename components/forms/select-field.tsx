import { describedByIds, FieldFrame, fieldControlClass } from "./field-frame";

type Option = { value: string; label: string };

export function SelectField({
  label,
  name,
  options,
  defaultValue,
  error,
}: {
  label: string;
  name: string;
  options: readonly Option[];
  defaultValue?: string;
  error?: string;
}) {
  const id = `field-${name}`;
  return (
    <FieldFrame id={id} label={label} error={error}>
      <select
        id={id}
        name={name}
        defaultValue={defaultValue}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedByIds(id, { error })}
        className={fieldControlClass(error)}
      >
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    </FieldFrame>
  );
}
