import type { Attention, CellState, GradebookCell, Standing } from "./assemble";
import { stuckRule } from "./stuck-rule";

// The grade book's words, shared by the grid, the learner's page and the CSV export, so that
// what a colour marks on screen is always also said in text.

export const standingLabels: Record<Standing, string> = {
  stuck: "Needs attention",
  "not-started": "Not started",
  "on-track": "On track",
  complete: "All passed",
  "switched-off": "Account switched off",
};

export const cellStateLabels: Record<CellState, string> = {
  "not-started": "not started",
  trying: "not passed yet",
  stuck: "stuck",
  passed: "passed",
  draft: "draft",
  waiting: "waiting for review",
  returned: "returned for rework",
};

const dayFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

/** "12 Mar 2026", in UTC like every date the app shows. */
export function formatActivityDay(date: Date): string {
  return dayFormat.format(date);
}

export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}

export function describeAttention(attention: Attention): string {
  if (attention.kind === "failing") {
    return `${plural(attention.failedAttempts, "failed attempt")} at ${attention.itemLabel} (${attention.itemTitle}) without a pass`;
  }
  return attention.lastActivityAt
    ? `No activity for ${plural(attention.idleDays, "day")} (last on ${formatActivityDay(attention.lastActivityAt)})`
    : `No activity in the ${plural(attention.idleDays, "day")} since the course opened to them`;
}

/** One cell in words, for its tooltip and for screen readers. */
export function describeCell(itemLabel: string, cell: GradebookCell): string {
  if (cell.state === "not-started") return `${itemLabel}: not started`;
  const parts = [`${itemLabel}: ${cellStateLabels[cell.state]}`];
  if (cell.bestScore !== null) parts.push(`best score ${cell.bestScore}`);
  if (cell.attempts > 0) parts.push(plural(cell.attempts, "attempt"));
  if (cell.state === "stuck") parts.push(`${cell.failedAttempts} failed (${stuckRule.failedAttempts} or more without a pass)`);
  if (cell.lastActivityAt) parts.push(`last on ${formatActivityDay(cell.lastActivityAt)}`);
  return parts.join(", ");
}
