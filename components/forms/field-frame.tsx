/** The look of every form control: the border turns red while the field has an error. */
export function fieldControlClass(error: string | undefined, extra = ""): string {
  return `block w-full rounded-lg border bg-surface px-3 py-2.5 text-base text-ink outline-none focus:border-accent focus:ring-2 focus:ring-accent/25 ${extra} ${
    error ? "border-danger" : "border-line-strong"
  }`;
}

/** The ids a control points at with aria-describedby, for its hint and its error. */
export function describedByIds(id: string, { hint, error }: { hint?: string; error?: string }): string | undefined {
  return [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(" ") || undefined;
}

/** Label above, control, then hint and error below: the layout every field of ours shares. */
export function FieldFrame({
  id,
  label,
  hint,
  error,
  children,
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  children: React.ReactNode;
}) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-sm font-medium text-ink">
        {label}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-faint">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm font-medium text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}
