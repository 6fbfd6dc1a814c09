import Papa from "papaparse";
import type { Gradebook } from "./assemble";
import { describeAttention } from "./words";

// The grade book as a spreadsheet file. Cells that a spreadsheet would run as a formula (leading
// =, +, -, @, tab, carriage return) are prefixed with an apostrophe, so a learner's name cannot
// become a formula on the instructor's machine (OWASP, "CSV Injection").

/** UTF-8 byte order mark: spreadsheet programs otherwise guess a legacy encoding and garble accents. */
const byteOrderMark = "\uFEFF";

function minuteStamp(date: Date | null): string {
  return date ? date.toISOString().slice(0, 16).replace("T", " ") : "";
}

function gradebookCsvRows(gradebook: Gradebook): { fields: string[]; data: (string | number)[][] } {
  const fields = [
    "Learner",
    "E-mail",
    "Account",
    ...gradebook.items.flatMap((item) => [`${item.label} (${item.title}) best score`, `${item.label} passed`]),
    "Items passed",
    `Total score (mean of ${gradebook.items.length} items)`,
    "Last activity (UTC)",
    "Needs attention",
  ];
  const data = gradebook.rows.map((row) => [
    row.learner.name,
    row.learner.email,
    row.learner.active ? "active" : "switched off",
    ...row.cells.flatMap((cell) => [cell.bestScore ?? "", cell.passed ? "yes" : "no"]),
    row.passedCount,
    row.totalScore,
    minuteStamp(row.lastActivityAt),
    row.attention.map(describeAttention).join("; "),
  ]);
  return { fields, data };
}

/** RFC 4180 text: comma-separated, CRLF line ends, fields with commas, quotes or line breaks quoted. */
export function gradebookCsv(gradebook: Gradebook): string {
  return byteOrderMark + Papa.unparse(gradebookCsvRows(gradebook), { newline: "\r\n", escapeFormulae: true });
}

/** "gradebook-data-lines-january-evenings-2026-03-01.csv": ASCII only, so every browser keeps it. */
export function gradebookFileName(cohortName: string, now: Date): string {
  const slug = cohortName
    .normalize("NFD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60)
    .replace(/-+$/, "");
  return `gradebook-${slug || "cohort"}-${now.toISOString().slice(0, 10)}.csv`;
}
