import { bigint, index, integer, pgTable, text } from "drizzle-orm/pg-core";

/**
 * The counters of every rate limit (lib/rate-limit), one row per limit and key, in the layout the
 * rate-limiter-flexible PostgreSQL store reads and writes: `key` is "<limit>:<user or address>",
 * `points` what was spent in the current window and `expire` when that window ends (milliseconds
 * since 1970). Kept in PostgreSQL so every app server counts against the same rows, and each spend
 * is one upsert, so concurrent requests cannot overspend. Rows expired over an hour are deleted.
 */
export const rateLimits = pgTable(
  "rate_limits",
  {
    key: text("key").primaryKey(),
    points: integer("points").notNull().default(0),
    expire: bigint("expire", { mode: "number" }),
  },
  (table) => [index("rate_limits_expire_idx").on(table.expire)],
);
