import { describedByIds, FieldFrame, fieldControlClass } from "./field-frame";

type TextFieldProps = {
  label: string;
  name: string;
  type?: "text" | "email" | "password";
  defaultValue?: string;
  error?: string;
  hint?: string;
  autoComplete?: string;
  required?: boolean;
  minLength?: number;
  maxLength?: number;
};

export function TextField({ label, name, type = "text", defaultValue, error, hint, ...rest }: TextFieldProps) {
  const id = `field-${name}`;
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error}>
      <input
        id={id}
        name={name}
        type={type}
        defaultValue={defaultValue}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedByIds(id, { hint, error })}
        className={fieldControlClass(error, "shadow-xs placeholder:text-ink-faint")}
        {...rest}
      />
    </FieldFrame>
  );
}
