import "server-only";
import { readDatabaseEnv } from "@/lib/env";
import { createDatabase, createPool, type Database } from "./connection";

// One pool per server process. In development the module is re-evaluated on every edit, so the
// instance is parked on globalThis to stop each reload from opening a new pool.
const globalForDb = globalThis as { edgewiseDb?: Database };

// No page or route needs a statement longer than this (the largest, a 10,000-row roster import,
// writes in batches of 1,000); past it the request fails instead of holding a connection.
const requestStatementLimits = { statementTimeoutMs: 15_000 };

function openDatabase(): Database {
  globalForDb.edgewiseDb ??= createDatabase(createPool(readDatabaseEnv().DATABASE_URL, undefined, requestStatementLimits));
  return globalForDb.edgewiseDb;
}

// Opened on first use rather than at import, so `next build` can load route modules without a
// database and without DATABASE_URL.
export const db: Database = new Proxy({} as Database, {
  get(_target, key) {
    const database = openDatabase();
    const value = Reflect.get(database, key, database);
    return typeof value === "function" ? value.bind(database) : value;
  },
});
