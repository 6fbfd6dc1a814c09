/**
 * `npm run db:backup` and `npm run db:restore` against the real test database: the archive is
 * restored into a fresh scratch database and every table of the public schema must come back with
 * the same rows, compared by count and by a digest of every row's text.
 */
import { execFile } from "node:child_process";
import { mkdtemp, rm, stat } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createPerson } from "./support/people";

const run = promisify(execFile);
const liveUrl = process.env.DATABASE_URL!;
const server = liveUrl.slice(0, liveUrl.lastIndexOf("/"));
const scratch = `edgewise_restore_check_${process.pid}`;
// Tables the seed fills, so a restore that loses everything cannot pass by comparing empty with empty.
const seededTables = ["schools", "users", "cohorts", "cohort_memberships", "courses", "lessons", "labs"];

type TableState = { rows: number; digest: string };

async function readTables(url: string): Promise<Map<string, TableState>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const { rows: tables } = await client.query<{ name: string }>(
      "select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1",
    );
    const state = new Map<string, TableState>();
    for (const { name } of tables) {
      const quoted = client.escapeIdentifier(name);
      const { rows } = await client.query<{ rows: string; digest: string }>(
        `select count(*) as rows, md5(coalesce(string_agg(t::text, E'\\n' order by t::text), '')) as digest from ${quoted} t`,
      );
      state.set(name, { rows: Number(rows[0]!.rows), digest: rows[0]!.digest });
    }
    return state;
  } finally {
    await client.end();
  }
}

async function dropScratch() {
  const client = new pg.Client({ connectionString: `${server}/postgres` });
  await client.connect();
  await client.query(`drop database if exists ${client.escapeIdentifier(scratch)} with (force)`);
  await client.end();
}

describe("database backup and restore", () => {
  let backupDir: string;
  let archive: string;
  let before: Map<string, TableState>;

  beforeAll(async () => {
    await dropScratch();
    // A row written just before the backup proves the archive is taken from the live data, not a stale file.
    await createPerson({ role: "learner", password: "backed up", label: "backup-probe" });
    backupDir = await mkdtemp(path.join(tmpdir(), "edgewise-backup-"));
    const { stdout } = await run("bash", ["scripts/db-backup.sh"], { env: { ...process.env, BACKUP_DIR: backupDir } });
    archive = stdout.trim().split("\n").at(-1)!.replace(/ \([^)]*\)$/, "");
    before = await readTables(liveUrl);
  });

  afterAll(async () => {
    await dropScratch();
    if (backupDir) await rm(backupDir, { recursive: true, force: true });
  });

  it("writes a timestamped archive and prints its path and size", async () => {
    expect(path.dirname(archive)).toBe(backupDir);
    expect(path.basename(archive)).toMatch(/^edgewise-\d{8}T\d{6}Z\.dump$/);
    expect((await stat(archive)).size).toBeGreaterThan(1000);
  });

  it("restores into a fresh database with every row of every table", async () => {
    const { stdout } = await run("bash", ["scripts/db-restore.sh", archive, scratch], { env: process.env });
    expect(stdout).toContain(`Restored into ${scratch}`);

    const after = await readTables(`${server}/${scratch}`);
    expect([...after.keys()]).toEqual([...before.keys()]);
    for (const table of seededTables) expect(before.get(table)?.rows, table).toBeGreaterThan(0);
    for (const [table, state] of before) expect(after.get(table), table).toEqual(state);
  });

  it("refuses to restore over an existing database without --force and leaves it untouched", async () => {
    const live = liveUrl.slice(liveUrl.lastIndexOf("/") + 1);
    const refusal = await run("bash", ["scripts/db-restore.sh", archive, live], { env: process.env }).catch((error) => error);
    expect(refusal.code).toBe(1);
    expect(refusal.stderr).toContain("is the live database");
    expect(refusal.stderr).toContain("--force");
    expect((await readTables(liveUrl)).get("users")).toEqual(before.get("users"));
  });

  it("refuses a file that is not a backup", async () => {
    const refusal = await run("bash", ["scripts/db-restore.sh", "package.json", `${scratch}_x`], { env: process.env }).catch((e) => e);
    expect(refusal.code).toBe(1);
    expect(refusal.stderr).toContain("is not a backup");
  });
});
