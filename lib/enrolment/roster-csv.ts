import Papa from "papaparse";

// Reads a roster (one learner per row: name and e-mail) from CSV text as spreadsheets write it:
// a header naming the columns in any common spelling, comma, semicolon or tab between fields,
// quoted fields, a byte-order mark, Windows line ends. Structure only; the values are judged by
// classify-roster.ts.

export type RosterSeparator = "," | ";" | "\t";

/** One data row; `row` counts lines as a spreadsheet numbers them, the header being row 1. */
export type RosterEntry = { row: number; name: string; email: string; problem: string | null };

export type RosterParse =
  | { ok: true; entries: RosterEntry[]; separator: RosterSeparator; hasHeader: boolean }
  | { ok: false; problem: string };

export const maxRosterRows = 10_000;

const headerAliases = {
  name: ["name", "fullname", "learner", "learnername", "student", "studentname", "participant", "person", "displayname"],
  first: ["firstname", "givenname", "forename", "first"],
  last: ["lastname", "surname", "familyname", "last"],
  email: ["email", "emailaddress", "mail", "mailaddress", "electronicmail"],
} as const;

type Column = keyof typeof headerAliases;
type Layout = { name?: number; first?: number; last?: number; email: number; width: number; hasHeader: boolean };

const separatorNames: Record<RosterSeparator, string> = { ",": "commas", ";": "semicolons", "\t": "tabs" };

function normaliseHeader(cell: string): string {
  return cell
    .normalize("NFKD")
    .toLowerCase()
    .replace(/[^a-z]/g, "");
}

/** The separator used most often outside quotes on the first line; commas when there is none. */
export function detectSeparator(text: string): RosterSeparator {
  const counts: Record<RosterSeparator, number> = { ",": 0, ";": 0, "\t": 0 };
  let quoted = false;
  for (const char of text) {
    if (char === '"') quoted = !quoted;
    else if (!quoted && (char === "\n" || char === "\r")) break;
    else if (!quoted && char in counts) counts[char as RosterSeparator] += 1;
  }
  const ranked = (Object.keys(counts) as RosterSeparator[]).sort((a, b) => counts[b] - counts[a]);
  return counts[ranked[0]!] > 0 ? ranked[0]! : ",";
}

function findHeaderLayout(cells: string[]): Layout | null {
  const found: Partial<Record<Column, number>> = {};
  cells.forEach((cell, index) => {
    const key = normaliseHeader(cell);
    for (const column of Object.keys(headerAliases) as Column[]) {
      if (found[column] === undefined && (headerAliases[column] as readonly string[]).includes(key)) found[column] = index;
    }
  });
  if (found.email === undefined) return null;
  return { ...found, email: found.email, width: cells.length, hasHeader: true };
}

/** A file without a header: the column holding an "@" is the e-mail, the first other one the name. */
function guessHeaderlessLayout(cells: string[]): Layout | null {
  const email = cells.findIndex((cell) => cell.includes("@"));
  if (email < 0) return null;
  const name = cells.findIndex((cell, index) => index !== email && cell.trim() !== "");
  return { email, name: name < 0 ? undefined : name, width: cells.length, hasHeader: false };
}

function describeLayoutProblem(layout: Layout): string | null {
  if (layout.name !== undefined || (layout.first !== undefined && layout.last !== undefined)) return null;
  if (!layout.hasHeader) return "Each row needs a name and an e-mail address; this file seems to hold e-mail addresses only.";
  return "The file has an e-mail column but no name column. Add a column headed “name” (or “first name” and “last name”).";
}

function readName(cells: string[], layout: Layout): string {
  if (layout.name !== undefined) return cells[layout.name] ?? "";
  return [cells[layout.first!] ?? "", cells[layout.last!] ?? ""].map((part) => part.trim()).filter(Boolean).join(" ");
}

function neededWidth(layout: Layout): number {
  return Math.max(layout.email, layout.name ?? -1, layout.first ?? -1, layout.last ?? -1) + 1;
}

function describeRowProblem(cells: string[], layout: Layout, separator: RosterSeparator, unclosedQuote: boolean): string | null {
  if (unclosedQuote) {
    const swallowed = cells.join(separator).split(/\r\n|\r|\n/).length - 1;
    const tail = swallowed > 0 ? ` The ${swallowed} line${swallowed === 1 ? "" : "s"} after it were read into this row.` : "";
    return `A quotation mark opens a field that is never closed.${tail}`;
  }
  if (cells.length < neededWidth(layout)) {
    return `This row has ${cells.length} field${cells.length === 1 ? "" : "s"}; a name and an e-mail separated by ${separatorNames[separator]} are needed.`;
  }
  const extra = cells.slice(layout.width).filter((cell) => cell.trim() !== "");
  if (extra.length > 0) {
    return `This row has ${cells.length} fields but the ${layout.hasHeader ? "header" : "first row"} has ${layout.width}. A name containing a separator must be in quotes.`;
  }
  return null;
}

export function parseRosterCsv(input: string): RosterParse {
  const text = input.replace(/^\uFEFF/, "");
  if (text.trim() === "") return { ok: false, problem: "The file is empty." };
  const separator = detectSeparator(text);
  const parsed = Papa.parse<string[]>(text, { delimiter: separator, skipEmptyLines: false });
  const unclosedRows = new Set(parsed.errors.filter((error) => error.code === "MissingQuotes").map((error) => error.row));

  const rows = parsed.data.map((cells, index) => ({ cells, index })).filter(({ cells }) => cells.some((cell) => cell.trim() !== ""));
  const first = rows[0];
  if (!first) return { ok: false, problem: "The file is empty." };
  const layout = findHeaderLayout(first.cells) ?? guessHeaderlessLayout(first.cells);
  if (!layout) {
    return {
      ok: false,
      problem: "We could not find the columns. The first line should name them, for example: name,e-mail",
    };
  }
  const layoutProblem = describeLayoutProblem(layout);
  if (layoutProblem) return { ok: false, problem: layoutProblem };

  const dataRows = layout.hasHeader ? rows.slice(1) : rows;
  if (dataRows.length === 0) return { ok: false, problem: "The file has a header but no learners under it." };
  if (dataRows.length > maxRosterRows) {
    return { ok: false, problem: `The file has ${dataRows.length} rows; at most ${maxRosterRows} can be imported at once. Split it into smaller files.` };
  }

  const entries = dataRows.map(({ cells, index }): RosterEntry => {
    const problem = describeRowProblem(cells, layout, separator, unclosedRows.has(index));
    return {
      row: index + 1,
      name: problem ? (cells[layout.name ?? layout.first ?? 0] ?? "").trim() : readName(cells, layout).trim(),
      email: (cells[layout.email] ?? "").trim(),
      problem,
    };
  });
  return { ok: true, entries, separator, hasHeader: layout.hasHeader };
}
