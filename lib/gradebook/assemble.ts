import type { BenchSubmissionStatus } from "@/db/schema";
import type { GradebookItem, GradebookItemKind } from "./items";
import { itemKey } from "./items";
import { findIdleReason, isStuckOnLab } from "./stuck-rule";

/** A learner of the cohort as the grade book query returns them. */
export type LearnerRow = {
  learnerId: string;
  name: string;
  email: string;
  active: boolean;
  enrolledAt: Date;
  /** Latest reading or quick-check answer: activity that belongs to no column. */
  lastLessonActivityAt: Date | null;
};

/** One learner's work on one item, aggregated in SQL. */
export type CellRow = {
  learnerId: string;
  kind: GradebookItemKind;
  slug: string;
  /** Best lab score, or the best reviewed bench score in percent; null while nothing is scored. */
  bestScore: number | null;
  passed: boolean;
  /** Graded lab attempts, or bench hand-ins (reviews plus one waiting for review). */
  attempts: number;
  /** Failed lab attempts, or bench hand-ins returned for rework. */
  failedAttempts: number;
  lastActivityAt: Date;
  /** Bench exercises only. */
  benchStatus: BenchSubmissionStatus | null;
};

export type CellState = "not-started" | "trying" | "stuck" | "passed" | "draft" | "waiting" | "returned";

export type GradebookCell = {
  state: CellState;
  bestScore: number | null;
  passed: boolean;
  attempts: number;
  failedAttempts: number;
  lastActivityAt: Date | null;
};

export type Attention =
  | { kind: "failing"; itemKey: string; itemLabel: string; itemTitle: string; failedAttempts: number }
  | { kind: "idle"; idleDays: number; lastActivityAt: Date | null };

export type Standing = "stuck" | "not-started" | "on-track" | "complete" | "switched-off";

export type GradebookRow = {
  learner: { id: string; name: string; email: string; active: boolean };
  /** One per item, in the order of `Gradebook.items`. */
  cells: GradebookCell[];
  passedCount: number;
  /** Mean of the best scores over every item, an item not yet scored counting 0; 0–100. */
  totalScore: number;
  lastActivityAt: Date | null;
  attention: Attention[];
  standing: Standing;
};

export type Gradebook = {
  items: GradebookItem[];
  rows: GradebookRow[];
  counts: Record<Standing, number>;
};

const emptyCell: GradebookCell = { state: "not-started", bestScore: null, passed: false, attempts: 0, failedAttempts: 0, lastActivityAt: null };

const benchStates: Record<BenchSubmissionStatus, CellState> = {
  draft: "draft",
  submitted: "waiting",
  returned: "returned",
  accepted: "passed",
};

function cellOf(row: CellRow): GradebookCell {
  const { bestScore, passed, attempts, failedAttempts, lastActivityAt } = row;
  const state: CellState =
    row.kind === "bench"
      ? benchStates[row.benchStatus ?? "draft"]
      : passed
        ? "passed"
        : isStuckOnLab(row)
          ? "stuck"
          : "trying";
  return { state, bestScore, passed, attempts, failedAttempts, lastActivityAt };
}

function latestOf(dates: (Date | null)[]): Date | null {
  return dates.reduce<Date | null>((latest, date) => (date && (!latest || date > latest) ? date : latest), null);
}

function standingOf(active: boolean, allPassed: boolean, attention: Attention[], lastActivityAt: Date | null): Standing {
  if (!active) return "switched-off";
  if (allPassed) return "complete";
  if (attention.length > 0) return "stuck";
  return lastActivityAt ? "on-track" : "not-started";
}

/**
 * The grade book from the two aggregate queries: one row per learner (in the order given), one
 * cell per item. Rows for items no longer in the course are ignored.
 */
export function assembleGradebook(params: {
  items: GradebookItem[];
  learners: LearnerRow[];
  cells: CellRow[];
  cohortStartsOn: string;
  now: Date;
}): Gradebook {
  const { items } = params;
  const column = new Map(items.map((item, index) => [item.key, index]));
  const cellsByLearner = new Map<string, GradebookCell[]>();
  for (const row of params.cells) {
    const index = column.get(itemKey(row.kind, row.slug));
    if (index === undefined) continue;
    let cells = cellsByLearner.get(row.learnerId);
    if (!cells) cellsByLearner.set(row.learnerId, (cells = items.map(() => emptyCell)));
    cells[index] = cellOf(row);
  }

  const counts: Record<Standing, number> = { stuck: 0, "not-started": 0, "on-track": 0, complete: 0, "switched-off": 0 };
  const rows = params.learners.map((learner): GradebookRow => {
    const cells = cellsByLearner.get(learner.learnerId) ?? items.map(() => emptyCell);
    const passedCount = cells.filter((cell) => cell.passed).length;
    const allPassed = items.length > 0 && passedCount === items.length;
    const lastActivityAt = latestOf([learner.lastLessonActivityAt, ...cells.map((cell) => cell.lastActivityAt)]);

    const attention: Attention[] = [];
    if (learner.active && !allPassed) {
      cells.forEach((cell, index) => {
        if (cell.state !== "stuck") return;
        const item = items[index];
        attention.push({ kind: "failing", itemKey: item.key, itemLabel: item.label, itemTitle: item.title, failedAttempts: cell.failedAttempts });
      });
      const idle = findIdleReason({ lastActivityAt, enrolledAt: learner.enrolledAt, cohortStartsOn: params.cohortStartsOn, now: params.now });
      if (idle) attention.push({ kind: "idle", ...idle });
    }

    const standing = standingOf(learner.active, allPassed, attention, lastActivityAt);
    counts[standing] += 1;
    const scoreSum = cells.reduce((sum, cell) => sum + (cell.bestScore ?? 0), 0);
    return {
      learner: { id: learner.learnerId, name: learner.name, email: learner.email, active: learner.active },
      cells,
      passedCount,
      totalScore: items.length === 0 ? 0 : Math.round(scoreSum / items.length),
      lastActivityAt,
      attention,
      standing,
    };
  });
  return { items, rows, counts };
}
