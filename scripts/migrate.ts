// Applies the committed migrations in drizzle/ to DATABASE_URL. Safe to run on every start:
// migrations already applied are skipped.
import { fileURLToPath } from "node:url";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { createDatabase, createPool } from "../db/connection";
import { describeDatabaseFailure } from "../db/describe-failure";
import { syncCourseCatalogue } from "../db/sync-course-catalogue";
import { getCourse } from "../lessons";
import { readDatabaseEnv } from "../lib/env";

const migrationsFolder = fileURLToPath(new URL("../drizzle", import.meta.url));

async function main(): Promise<void> {
  const { DATABASE_URL } = readDatabaseEnv();
  const pool = createPool(DATABASE_URL, 1);
  try {
    const database = createDatabase(pool);
    await migrate(database, { migrationsFolder });
    await syncCourseCatalogue(database, getCourse());
    console.log(`Database migrated and course catalogue refreshed (${new URL(DATABASE_URL).pathname.slice(1)}).`);
  } finally {
    await pool.end();
  }
}

main().catch((error: unknown) => {
  console.error(`Migration failed: ${describeDatabaseFailure(error)}`);
  process.exit(1);
});
