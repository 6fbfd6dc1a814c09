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

/** `ignore`: bookkeeping the action is meant to write even when it refuses (sign-in throttling). */
export async function readDatabaseState(ignore: readonly string[] = []): Promise<DatabaseState> {
  const names = (await listTables()).filter((name) => !ignore.includes(name));
  const query = names
    .map((name) => `select '${name}' as name, count(*)::int as rows, coalesce(sum(hashtext(t::text)::bigint), 0)::text as hash from "${name}" t`)
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
