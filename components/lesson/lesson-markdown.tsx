import type { ReactNode } from "react";
import Markdown, { type Components } from "react-markdown";
import remarkGfm from "remark-gfm";
import { headingId } from "./section-headings";

function textOf(node: ReactNode): string {
  if (typeof node === "string" || typeof node === "number") return String(node);
  if (Array.isArray(node)) return node.map(textOf).join("");
  if (node && typeof node === "object" && "props" in node) return textOf((node.props as { children?: ReactNode }).children);
  return "";
}

const components: Components = {
  h2: ({ children }) => (
    <h2 id={headingId(textOf(children))} className="mt-12 mb-4 scroll-mt-24 text-2xl font-semibold tracking-tight text-ink first:mt-0">
      {children}
    </h2>
  ),
  h3: ({ children }) => <h3 className="mt-8 mb-3 text-lg font-semibold text-ink">{children}</h3>,
  h4: ({ children }) => <h4 className="mt-6 mb-2 font-semibold text-ink">{children}</h4>,
  p: ({ children }) => <p className="my-4 leading-7">{children}</p>,
  ul: ({ children }) => <ul className="my-4 list-disc space-y-1.5 pl-6 leading-7 marker:text-copper">{children}</ul>,
  ol: ({ children }) => <ol className="my-4 list-decimal space-y-1.5 pl-6 leading-7 marker:text-ink-faint">{children}</ol>,
  li: ({ children }) => <li className="pl-1">{children}</li>,
  strong: ({ children }) => <strong className="font-semibold text-ink">{children}</strong>,
  a: ({ children, href }) => (
    <a href={href} className="font-medium text-accent underline decoration-accent/40 underline-offset-2 hover:decoration-accent">
      {children}
    </a>
  ),
  code: ({ children }) => <code className="rounded bg-sunken px-1.5 py-0.5 font-mono text-[0.9em]">{children}</code>,
  blockquote: ({ children }) => <blockquote className="my-5 border-l-4 border-line-strong pl-4 text-ink-soft">{children}</blockquote>,
  hr: () => <hr className="my-8 border-line" />,
  // Wide tables scroll inside their own box on a phone instead of widening the page.
  table: ({ children }) => (
    <div className="my-6 break-inside-avoid overflow-x-auto rounded-lg border border-line print:overflow-visible" role="region" aria-label="Table" tabIndex={0}>
      <table className="w-full border-collapse text-left text-sm tabular-nums">{children}</table>
    </div>
  ),
  thead: ({ children }) => <thead className="bg-sunken text-ink">{children}</thead>,
  th: ({ children, style }) => (
    <th scope="col" style={style} className="border-b border-line px-3 py-2 font-semibold whitespace-nowrap">
      {children}
    </th>
  ),
  td: ({ children, style }) => (
    <td style={style} className="border-b border-line px-3 py-2 align-top">
      {children}
    </td>
  ),
};

/** Lesson prose: GitHub-flavoured markdown (tables above all) in the course's type scale. */
export function LessonMarkdown({ markdown, className = "" }: { markdown: string; className?: string }) {
  return (
    <div className={`text-base text-ink-soft [&>*:first-child]:mt-0 [&>*:last-child]:mb-0 ${className}`}>
      <Markdown remarkPlugins={[remarkGfm]} components={components}>
        {markdown}
      </Markdown>
    </div>
  );
}
