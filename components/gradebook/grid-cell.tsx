import type { GradebookCell, GradebookItem } from "@/lib/gradebook";
import { describeCell } from "@/lib/gradebook/words";

// Each state has a mark and a word as well as a tint, so the grid reads the same in grey.
const looks: Record<GradebookCell["state"], { tint: string; mark: string; word: string }> = {
  "not-started": { tint: "", mark: "", word: "" },
  trying: { tint: "bg-copper-soft/70", mark: "✗", word: "failed" },
  stuck: { tint: "bg-danger-soft", mark: "⚠", word: "stuck" },
  passed: { tint: "bg-ok-soft", mark: "✓", word: "passed" },
  draft: { tint: "bg-sunken", mark: "✎", word: "draft" },
  waiting: { tint: "bg-accent-soft", mark: "⧗", word: "to review" },
  returned: { tint: "bg-copper-soft/70", mark: "↺", word: "returned" },
};

function tries(cell: GradebookCell): string {
  if (cell.attempts === 0) return "";
  return `${cell.attempts} ${cell.attempts === 1 ? "try" : "tries"}`;
}

/** One learner × item cell: best score large, state and tries small, the full story in its tooltip. */
export function GridCell({ item, cell }: { item: GradebookItem; cell: GradebookCell }) {
  const description = describeCell(item.label, cell);
  if (cell.state === "not-started") {
    return (
      <span className="block px-1.5 py-2 text-center text-ink-faint" title={description}>
        <span aria-hidden="true">·</span>
        <span className="sr-only">not started</span>
      </span>
    );
  }
  const look = looks[cell.state];
  return (
    <span className={`block rounded-md px-1.5 py-1 text-center leading-tight ${look.tint}`} title={description} data-state={cell.state}>
      <span className="block text-base font-semibold tabular-nums text-ink">{cell.bestScore ?? "–"}</span>
      <span className={`block whitespace-nowrap text-xs ${cell.state === "stuck" ? "font-semibold text-danger" : "text-ink-soft"}`}>
        <span aria-hidden="true">{look.mark} </span>
        {look.word}
      </span>
      <span className="block whitespace-nowrap text-xs text-ink-faint">{tries(cell)}</span>
    </span>
  );
}
