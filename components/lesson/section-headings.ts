import type { Block } from "@/lessons";

/** The id a lesson's "## " heading gets, so the contents rail can link to it. */
export function headingId(text: string): string {
  return `section-${text
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")}`;
}

export type LessonSection = { id: string; title: string };

/** The lesson's second-level headings in order: the entries of its contents rail. */
export function lessonSections(blocks: readonly Block[]): LessonSection[] {
  return blocks.flatMap((block) =>
    block.kind === "text"
      ? [...block.markdown.matchAll(/^## +(.+?)\s*$/gm)].map((match) => ({ id: headingId(match[1]!), title: match[1]! }))
      : [],
  );
}
