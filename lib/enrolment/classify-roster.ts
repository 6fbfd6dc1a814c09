import { emailSchema, personNameSchema } from "@/lib/auth/fields";
import type { RosterEntry } from "./roster-csv";

// Decides, row by row, what an import would do: enrol (valid), skip because the person is already
// there (duplicate), or refuse because the row cannot be read (invalid), always with the reason.

export type RowStatus = "valid" | "duplicate" | "invalid";

export type ClassifiedRow = { row: number; name: string; email: string; status: RowStatus; reason: string | null };

/**
 * Addresses the school already knows, as found in the database for the file's addresses. Other
 * schools' accounts are not among them: an address is new to this school or known to it.
 */
export type RosterContext = {
  inCohort: ReadonlySet<string>;
  inSchool: ReadonlySet<string>;
  invited: ReadonlySet<string>;
};

export type RosterCounts = Record<RowStatus, number> & { total: number };

export const emptyRosterContext: RosterContext = {
  inCohort: new Set(),
  inSchool: new Set(),
  invited: new Set(),
};

function existingReason(email: string, context: RosterContext): string | null {
  if (context.inCohort.has(email)) return "Already in this cohort.";
  if (context.inSchool.has(email)) return "Already has an account at this school. Enrol them one by one to add them to this cohort.";
  if (context.invited.has(email)) return "Already has an open invitation to this school.";
  return null;
}

export function classifyRoster(entries: readonly RosterEntry[], context: RosterContext): ClassifiedRow[] {
  const firstRowByEmail = new Map<string, number>();
  return entries.map((entry): ClassifiedRow => {
    const invalid = (reason: string): ClassifiedRow => ({ ...pick(entry), status: "invalid", reason });
    if (entry.problem) return invalid(entry.problem);
    const name = personNameSchema.safeParse(entry.name);
    if (!name.success) return invalid(entry.name.trim() === "" ? "The name is missing." : name.error.issues[0]!.message);
    if (entry.email === "") return invalid("The e-mail address is missing.");
    const email = emailSchema.safeParse(entry.email);
    if (!email.success) return invalid(`“${entry.email}” is not an e-mail address.`);

    const row = { row: entry.row, name: name.data, email: email.data };
    const earlier = firstRowByEmail.get(email.data);
    if (earlier !== undefined) return { ...row, status: "duplicate", reason: `Same e-mail address as row ${earlier}.` };
    const reason = existingReason(email.data, context);
    if (reason) return { ...row, status: "duplicate", reason };
    firstRowByEmail.set(email.data, entry.row);
    return { ...row, status: "valid", reason: null };
  });
}

function pick(entry: RosterEntry): Pick<ClassifiedRow, "row" | "name" | "email"> {
  return { row: entry.row, name: entry.name, email: entry.email };
}

export function countRoster(rows: readonly ClassifiedRow[]): RosterCounts {
  const counts: RosterCounts = { valid: 0, duplicate: 0, invalid: 0, total: rows.length };
  for (const row of rows) counts[row.status] += 1;
  return counts;
}

/** The lower-cased addresses worth looking up: only rows whose address is well formed. */
export function rosterEmails(entries: readonly RosterEntry[]): string[] {
  const emails = new Set<string>();
  for (const entry of entries) {
    const email = emailSchema.safeParse(entry.email);
    if (!entry.problem && email.success) emails.add(email.data);
  }
  return [...emails];
}
