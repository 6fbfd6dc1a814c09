/**
 * The live region every form announces its result in. It is always rendered, empty when there
 * is nothing to say, because screen readers only announce changes to a region already present.
 */
export function FormAlert({ tone, message }: { tone: "error" | "success" | "info"; message: string | null }) {
  const tones = {
    error: "border-danger/30 bg-danger-soft text-danger",
    success: "border-ok/30 bg-ok-soft text-ok",
    info: "border-accent/30 bg-accent-soft text-accent-strong",
  } as const;
  return (
    <div aria-live="polite" role="status">
      {message ? <p className={`rounded-lg border px-3 py-2.5 text-sm font-medium ${tones[tone]}`}>{message}</p> : null}
    </div>
  );
}
