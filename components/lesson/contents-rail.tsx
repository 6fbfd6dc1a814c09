"use client";

import { useEffect, useState } from "react";
import type { LessonSection } from "./section-headings";

/** The lesson's sections as links; the one being read is marked as the reader scrolls. */
export function ContentsRail({ sections }: { sections: readonly LessonSection[] }) {
  const [current, setCurrent] = useState<string | null>(null);

  useEffect(() => {
    const headings = sections.map((s) => document.getElementById(s.id)).filter((h): h is HTMLElement => h !== null);
    if (headings.length === 0) return;
    const onScroll = () => {
      // The section being read is the last heading above a line a quarter of the way down the window.
      const line = window.innerHeight / 4;
      const above = headings.filter((h) => h.getBoundingClientRect().top <= line);
      setCurrent(above.at(-1)?.id ?? null);
    };
    onScroll();
    window.addEventListener("scroll", onScroll, { passive: true });
    window.addEventListener("resize", onScroll);
    return () => {
      window.removeEventListener("scroll", onScroll);
      window.removeEventListener("resize", onScroll);
    };
  }, [sections]);

  return (
    <ol className="space-y-0.5 border-l border-line text-sm">
      {sections.map((section) => {
        const here = section.id === current;
        return (
          <li key={section.id}>
            <a
              href={`#${section.id}`}
              aria-current={here ? "location" : undefined}
              className={`-ml-px block border-l-2 py-1.5 pr-2 pl-3 no-underline transition-colors ${
                here ? "border-accent font-semibold text-accent-strong" : "border-transparent text-ink-soft hover:border-line-strong hover:text-ink"
              }`}
            >
              {section.title}
            </a>
          </li>
        );
      })}
    </ol>
  );
}
