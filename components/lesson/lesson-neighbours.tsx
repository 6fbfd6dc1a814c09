import Link from "next/link";
import type { LessonProgressView } from "@/lib/progress";

type Neighbour = { slug: string; number: number; title: string };

/** Links to the lessons either side; the next one says so when it is still locked. */
export function LessonNeighbours({ previous, next }: { previous?: Neighbour; next?: LessonProgressView }) {
  if (!previous && !next) return null;
  return (
    <nav aria-label="Lessons" className="mt-12 grid gap-3 border-t border-line pt-6 sm:grid-cols-2 print:hidden">
      {previous ? (
        <Link href={`/lessons/${previous.slug}`} className="rounded-lg border border-line bg-surface px-4 py-3 no-underline hover:border-line-strong">
          <span className="block text-xs font-semibold uppercase tracking-wide text-ink-faint">← Lesson {previous.number}</span>
          <span className="mt-0.5 block font-medium text-ink">{previous.title}</span>
        </Link>
      ) : (
        <span />
      )}
      {next ? (
        <Link href={`/lessons/${next.slug}`} className="rounded-lg border border-line bg-surface px-4 py-3 text-right no-underline hover:border-line-strong">
          <span className="block text-xs font-semibold uppercase tracking-wide text-ink-faint">
            Lesson {next.number} {next.state === "locked" ? "· opens when this one is done" : "→"}
          </span>
          <span className="mt-0.5 block font-medium text-ink">{next.title}</span>
        </Link>
      ) : null}
    </nav>
  );
}
