export { gradebookItems, itemKey, type GradebookItem, type GradebookItemKind } from "./items";
export { stuckRule, isStuckOnLab, findIdleReason, type IdleReason } from "./stuck-rule";
export {
  assembleGradebook,
  type Attention,
  type CellRow,
  type CellState,
  type Gradebook,
  type GradebookCell,
  type GradebookRow,
  type LearnerRow,
  type Standing,
} from "./assemble";
export { scoreDistributions, attemptsPerDay, type AttemptDay, type AttemptDayRow, type ScoreBin, type ScoreDistribution } from "./charts";
export { gradebookCsv, gradebookFileName } from "./csv";
export { attemptRecord, type AttemptRecord, type AttemptRunRecord } from "./attempt-record";
export { cellStateLabels, describeAttention, describeCell, formatActivityDay, plural, standingLabels } from "./words";
