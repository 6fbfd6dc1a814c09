import { LessonMarkdown } from "./lesson-markdown";

/** A safety note: set apart and plainly worded, with a label so it does not rely on colour. */
export function CautionCallout({ title, markdown }: { title: string; markdown: string }) {
  return (
    <aside aria-label={`Safety: ${title}`} className="my-8 break-inside-avoid rounded-card border border-copper/40 bg-copper-soft px-5 py-4">
      <p className="flex items-center gap-2 font-semibold text-ink">
        <svg viewBox="0 0 20 20" className="size-5 shrink-0 text-copper" aria-hidden="true">
          <path d="M10 2.5 18.5 17h-17L10 2.5Z" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinejoin="round" />
          <path d="M10 8v4.2" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
          <circle cx="10" cy="14.6" r="1" fill="currentColor" />
        </svg>
        <span>
          <span className="text-sm font-semibold uppercase tracking-wide text-copper">Safety · </span>
          {title}
        </span>
      </p>
      <LessonMarkdown markdown={markdown} className="mt-2 text-ink" />
    </aside>
  );
}
