export type NoticeTone = "success" | "warning" | "error";

const tones: Record<NoticeTone, string> = {
  success: "border-ok/30 bg-ok-soft text-ok",
  warning: "border-copper/40 bg-copper-soft text-ink",
  error: "border-danger/30 bg-danger-soft text-danger",
};

/**
 * The live region for results on the admin pages. A warning is for something that worked but
 * needs the admin's attention (an e-mail that did not go out), so it must not read as success.
 */
export function StatusNotice({ tone, message, className = "" }: { tone: NoticeTone; message: string | null; className?: string }) {
  return (
    <div aria-live="polite" role="status" className={className}>
      {message ? <p className={`rounded-lg border px-3 py-2.5 text-sm font-medium ${tones[tone]}`}>{message}</p> : null}
    </div>
  );
}
