import { bigserial, boolean, index, pgTable, text, timestamp } from "drizzle-orm/pg-core";

// Kept in PostgreSQL rather than process memory so throttling holds across app server replicas.
// The e-mail is stored as typed (normalised), whether or not an account exists for it.
export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    email: text("email").notNull(),
    clientAddress: text("client_address").notNull(),
    succeeded: boolean("succeeded").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    index("sign_in_attempts_email_created_at_idx").on(table.email, table.createdAt),
    index("sign_in_attempts_client_address_created_at_idx").on(table.clientAddress, table.createdAt),
  ],
);

export type SignInAttempt = typeof signInAttempts.$inferSelect;
