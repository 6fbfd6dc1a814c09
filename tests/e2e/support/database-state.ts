import { sql } from "drizzle-orm";
import { db } from "@/db/client";

// "Nothing written" checked on the whole database: for every table, its row count and a hash of
// its rows' text, so an insert, a delete and an update alike show up. The tables are small in
// the test database, so this takes milliseconds.

export type DatabaseState = Record<string, { rows: number; hash: string }>;

let tableNames: Promise<string[]> | undefined;

function listTables(): Promise<string[]> {
  return (tableNames ??= db
    .execute<{ name: string }>(sql`select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1`)
    .then((result) => result.rows.map((row) => row.name)));
}

/**
 * Columns the app's background jobs write whatever a request does: the invitation e-mail outbox
 * takes over a link whose first send is overdue (lib/enrolment/invitation-mail-retry.ts), which
 * can fall in the middle of a check in a long run.
 */
const backgroundColumns: Record<string, readonly string[]> = {
  invitations: ["mail_pending_since", "mail_attempts", "mail_next_try_at"],
};

function rowText(name: string): string {
  const columns = backgroundColumns[name];
  return columns ? `(to_jsonb(t) ${columns.map((column) => `- '${column}'`).join(" ")})::text` : "t::text";
}

/** `ignore`: bookkeeping the action is meant to write even when it refuses (sign-in throttling). */
export async function readDatabaseState(ignore: readonly string[] = []): Promise<DatabaseState> {
  const names = (await listTables()).filter((name) => !ignore.includes(name));
  const query = names
    .map((name) => `select '${name}' as name, count(*)::int as rows, coalesce(sum(hashtext(${rowText(name)})::bigint), 0)::text as hash from "${name}" t`)
    .join(" union all ");
  const result = await db.execute<{ name: string; rows: number; hash: string }>(sql.raw(query));
  return Object.fromEntries(result.rows.map((row) => [row.name, { rows: row.rows, hash: row.hash }]));
}

/** The tables whose rows differ between two states. */
export function changedTables(before: DatabaseState, after: DatabaseState): string[] {
  return Object.keys({ ...before, ...after }).filter(
    (name) => before[name]?.rows !== after[name]?.rows || before[name]?.hash !== after[name]?.hash,
  );
}
