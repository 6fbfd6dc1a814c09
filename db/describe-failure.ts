import { EnvError } from "../lib/env";

/** One readable line for a failed database script, instead of a stack trace. */
export function describeDatabaseFailure(error: unknown): string {
  if (error instanceof EnvError) return error.message;
  const cause = error instanceof Error && error.cause instanceof Error ? error.cause : error;
  const code = (cause as { code?: string } | null)?.code;
  if (code === "ECONNREFUSED") return "the database server is not accepting connections (is PostgreSQL running?)";
  if (code === "28P01") return "the database refused the password in DATABASE_URL (the scripts read the local cluster's from .data/pg.password)";
  if (code === "3D000") return "the database does not exist (create it first, e.g. with scripts/postgres.sh up)";
  if (code === "42P01") return "a table is missing: apply the migrations first (npx tsx scripts/migrate.ts)";
  return cause instanceof Error ? cause.message : String(cause);
}
