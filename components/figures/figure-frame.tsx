import type { ReactNode } from "react";

/**
 * The frame every lesson figure shares: the drawing, its controls, a plain-text readout of what
 * the drawing shows (for screen readers and for anyone who prefers numbers) and the caption.
 * It is never split across printed pages, where it prints as drawn, with the values it was set to.
 */
export function FigureFrame({
  label,
  caption,
  controls,
  readout,
  children,
}: {
  label: string;
  caption: string;
  controls?: ReactNode;
  /** Omitted when the drawing carries its own summary in words (the scope view does). */
  readout?: ReactNode;
  children: ReactNode;
}) {
  return (
    <figure aria-label={label} className="my-10 break-inside-avoid rounded-card border border-line bg-surface print:my-6">
      <div className="px-3 pt-4 sm:px-5">{children}</div>
      {controls ? <div className="space-y-4 border-t border-line px-4 py-4 sm:px-5">{controls}</div> : null}
      {readout ? (
        <div className="border-t border-line bg-sunken/60 px-4 py-3 text-sm text-ink sm:px-5" aria-live="polite">
          {readout}
        </div>
      ) : null}
      <figcaption className="border-t border-line px-4 py-3 text-sm leading-6 text-ink-soft sm:px-5">{caption}</figcaption>
    </figure>
  );
}
