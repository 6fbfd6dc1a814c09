import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema";

export type Database = NodePgDatabase<typeof schema> & { $client: pg.Pool };
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Anything queries can run on: the database itself or an open transaction. */
export type Executor = Database | Transaction;

/** Limits for a pool that serves requests: a statement that runs this long is cancelled. */
export type StatementLimits = { statementTimeoutMs: number };

// How long to wait for a connection, counting the wait for a free one when all are busy. While the
// database is down, connecting fails at once; this bounds the case where it does not answer at all.
const connectTimeoutMs = 5_000;
// The client gives up on a query a little after the server would have cancelled it, so a server
// that stopped answering mid-query cannot hold a request either.
const clientGraceMs = 2_000;

export function createPool(connectionString: string, max = 10, limits?: StatementLimits): pg.Pool {
  const pool = new pg.Pool({
    connectionString,
    max,
    connectionTimeoutMillis: connectTimeoutMs,
    ...(limits && { statement_timeout: limits.statementTimeoutMs, query_timeout: limits.statementTimeoutMs + clientGraceMs }),
  });
  // An idle connection that the server closes (a restart, a failover) is reported here; without a
  // listener Node would end the process. The pool has already dropped that connection, and the
  // next checkout opens a fresh one, so the app recovers once the database is back.
  pool.on("error", (error) => console.error("Database connection lost while idle:", error.message));
  return pool;
}

export function createDatabase(pool: pg.Pool): Database {
  return drizzle(pool, { schema });
}
