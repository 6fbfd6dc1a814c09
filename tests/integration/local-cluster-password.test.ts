/**
 * The private PostgreSQL clusters let in only who knows the password scripts/postgres.sh keeps
 * beside each cluster: the test run's own cluster refuses a connection without it or with a wrong
 * one. A cluster made before passwords were required (trusting every loopback connection, still
 * running) is given its password on the next `postgres.sh up`, and its data stays.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { appendFile, chmod, chown, mkdir, readFile, rm, stat, writeFile } from "node:fs/promises";
import path from "node:path";
import pg from "pg";
import { afterAll, describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");

/** Connects, runs one query and disconnects; rejects with the driver's or the server's refusal. */
async function queryOnce(url: string, sql: string): Promise<unknown[]> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query(sql)).rows;
  } finally {
    await client.end();
  }
}

function withPassword(url: string, password: string): string {
  const changed = new URL(url);
  changed.password = password;
  return changed.toString();
}

describe("the test run's cluster", () => {
  const url = process.env.DATABASE_URL!;

  it("lets in a connection with the password kept beside it", async () => {
    const kept = (await readFile(`${process.env.PGDATA}.password`, "utf8")).trim();
    expect(kept).toMatch(/^[0-9a-f]{48}$/);
    expect(new URL(url).password).toBe(kept);
    expect(await queryOnce(url, "select 1 as one")).toEqual([{ one: 1 }]);
  });

  it("asks a connection without a password for one, and refuses a wrong one", async () => {
    // The server answers with a SCRAM challenge, which the driver cannot meet without a password:
    // a cluster that trusted loopback connections would have let it in.
    await expect(queryOnce(withPassword(url, ""), "select 1")).rejects.toThrow(/SASL: SCRAM-SERVER-FIRST-MESSAGE/);
    await expect(queryOnce(withPassword(url, "0".repeat(48)), "select 1")).rejects.toMatchObject({ code: "28P01" });
  });
});

// Ports clear of the start-script test's private run (56000+offset … +31).
const oldClusterPort = 56050 + Number(process.env.TEST_PORT_OFFSET ?? 0);
const dataDir = path.join(root, ".data", "cluster-upgrade-check");
const pgdata = path.join(dataDir, "pg");

function serverBin(): string {
  const versions = spawnSync("bash", ["-c", "ls -d /usr/lib/postgresql/*/bin/postgres | sort -V | tail -n 1"], { encoding: "utf8" });
  return path.dirname(versions.stdout.trim());
}

/** As the server's own user: root may not run PostgreSQL's programs. */
function asServerUser(program: string, args: string[]): void {
  const [command, fullArgs] = process.getuid?.() === 0 ? ["runuser", ["-u", "postgres", "--", program, ...args]] : [program, args];
  execFileSync(command, fullArgs, { stdio: "pipe" });
}

async function giveToServerUser(file: string): Promise<void> {
  if (process.getuid?.() !== 0) return;
  const ids = execFileSync("id", ["-u", "postgres"], { encoding: "utf8" }).trim();
  const group = execFileSync("id", ["-g", "postgres"], { encoding: "utf8" }).trim();
  await chown(file, Number(ids), Number(group));
}

/** A cluster as scripts/postgres.sh made them before passwords: every loopback connection trusted. */
async function makeTrustingCluster(): Promise<void> {
  const bin = serverBin();
  await mkdir(pgdata, { recursive: true });
  await giveToServerUser(pgdata);
  await chmod(pgdata, 0o700);
  asServerUser(path.join(bin, "initdb"), ["-D", pgdata, "-U", "postgres", "-A", "trust", "-E", "UTF8", "--locale=C.UTF-8"]);
  await appendFile(
    path.join(pgdata, "postgresql.conf"),
    `listen_addresses = '127.0.0.1'\nport = ${oldClusterPort}\nunix_socket_directories = ''\n`,
  );
  const log = `${pgdata}.log`;
  await writeFile(log, "");
  await giveToServerUser(log);
  asServerUser(path.join(bin, "pg_ctl"), ["-D", pgdata, "-l", log, "-w", "start"]);
}

afterAll(async () => {
  spawnSync("bash", ["scripts/postgres.sh", "stop"], {
    cwd: root,
    env: { ...process.env, EDGEWISE_DATA_DIR: dataDir, PGDATA: pgdata, PGPORT: String(oldClusterPort) },
  });
  await rm(dataDir, { recursive: true, force: true });
});

describe("a cluster made before passwords were required", () => {
  it("gets a password on its next start, keeps its data, and then refuses connections without it", { timeout: 120_000 }, async () => {
    await rm(dataDir, { recursive: true, force: true });
    await makeTrustingCluster();
    const trusting = `postgres://postgres@127.0.0.1:${oldClusterPort}/postgres`;
    await queryOnce(trusting, "create database edgewise");
    const database = trusting.replace(/\/postgres$/, "/edgewise");
    await queryOnce(database, "create table demo_rows (name text); insert into demo_rows values ('Harrowgate demo learner')");

    // Left running, as after a crash of `npm start`: the script stops it to set the password.
    const up = spawnSync("bash", ["scripts/postgres.sh", "up", "edgewise"], {
      cwd: root,
      env: { ...process.env, EDGEWISE_DATA_DIR: dataDir, PGDATA: pgdata, PGPORT: String(oldClusterPort) },
      encoding: "utf8",
    });
    expect(up.status, up.stdout + up.stderr).toBe(0);
    expect(up.stdout).toContain("Giving the database cluster in .data/cluster-upgrade-check/pg a password");

    const passwordFile = `${pgdata}.password`;
    const password = (await readFile(passwordFile, "utf8")).trim();
    expect(password).toMatch(/^[0-9a-f]{48}$/);
    expect((await stat(passwordFile)).mode & 0o077).toBe(0);
    expect(await queryOnce(withPassword(database, password), "select name from demo_rows")).toEqual([{ name: "Harrowgate demo learner" }]);
    await expect(queryOnce(database, "select 1")).rejects.toThrow(/SASL: SCRAM-SERVER-FIRST-MESSAGE/);
    await expect(queryOnce(withPassword(database, "0".repeat(48)), "select 1")).rejects.toMatchObject({ code: "28P01" });

    // A second start finds the cluster done and leaves the password as it is.
    const again = spawnSync("bash", ["scripts/postgres.sh", "up", "edgewise"], {
      cwd: root,
      env: { ...process.env, EDGEWISE_DATA_DIR: dataDir, PGDATA: pgdata, PGPORT: String(oldClusterPort) },
      encoding: "utf8",
    });
    expect(again.status, again.stdout + again.stderr).toBe(0);
    expect(again.stdout).not.toContain("password");
    expect((await readFile(passwordFile, "utf8")).trim()).toBe(password);
  });
});
