// The dev cluster's database as the scripts reach it when DATABASE_URL is not set: `npm start`'s
// private cluster on 127.0.0.1:54329, signed in with the password scripts/postgres.sh keeps in
// .data/pg.password (EDGEWISE_DATA_DIR moves the folder).
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

// npm runs scripts from the project's folder; drizzle-kit loads its config where import.meta has no dirname.
const dataDir = process.env.EDGEWISE_DATA_DIR ?? path.resolve(".data");

/** Without the password file (no cluster made yet) the URL has none, and the server says so on connecting. */
export function devDatabaseUrl(database = "edgewise"): string {
  const passwordFile = path.join(dataDir, "pg.password");
  const password = existsSync(passwordFile) ? `:${readFileSync(passwordFile, "utf8").trim()}` : "";
  return `postgres://postgres${password}@127.0.0.1:54329/${database}`;
}
