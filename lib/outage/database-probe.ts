import pg from "pg";
import { readDatabaseEnv } from "@/lib/env";

// Whether the database answers, as the request proxy needs it before a page renders: a page that
// fails half-way can no longer change its status, so the outage has to be known first. One
// connection of its own, kept open so that the server's goodbye on shutdown (or a lost link)
// reaches it at once; the verdict is re-checked at most once a second either way.

const verdictLifetimeMs = 1_000;
const probeTimeoutMs = 2_000;

type Verdict = { reachable: boolean; checkedAt: number };

let pool: pg.Pool | undefined;
let verdict: Verdict | undefined;
let probing: Promise<boolean> | undefined;

function probePool(): pg.Pool {
  if (!pool) {
    pool = new pg.Pool({
      connectionString: readDatabaseEnv().DATABASE_URL,
      max: 1,
      idleTimeoutMillis: 0,
      // The kept connection must not hold a process open that has nothing else left to do.
      allowExitOnIdle: true,
      connectionTimeoutMillis: probeTimeoutMs,
      query_timeout: probeTimeoutMs,
    });
    // The server closed the kept connection (shut down, restarted, link lost): ask again next time.
    pool.on("error", () => {
      verdict = undefined;
    });
  }
  return pool;
}

async function probe(): Promise<boolean> {
  try {
    await probePool().query("select 1");
    return true;
  } catch {
    return false;
  }
}

/** True while the last check, at most a second old, reached the database; concurrent callers share one check. */
export async function isDatabaseReachable(now = Date.now()): Promise<boolean> {
  if (verdict && now - verdict.checkedAt < verdictLifetimeMs) return verdict.reachable;
  probing ??= probe().then((reachable) => {
    verdict = { reachable, checkedAt: Date.now() };
    probing = undefined;
    return reachable;
  });
  return probing;
}
