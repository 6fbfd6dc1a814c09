import { relations, sql } from "drizzle-orm";
import { index, integer, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { cohorts } from "./cohorts";
import { schools } from "./schools";
import { roleEnum, users } from "./users";

// Only the SHA-256 of the e-mailed token is kept, so a database leak does not hand out accounts.
export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    schoolId: uuid("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: roleEnum("role").notNull(),
    cohortId: uuid("cohort_id").references(() => cohorts.id, { onDelete: "set null" }),
    tokenHash: text("token_hash").notNull().unique(),
    invitedById: uuid("invited_by_id").references(() => users.id, { onDelete: "set null" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    // The e-mail outbox: set while the link has not been e-mailed; a background job sends it again
    // at mailNextTryAt, backing off after each failed try. Null once sent.
    mailPendingSince: timestamp("mail_pending_since", { withTimezone: true }),
    mailAttempts: integer("mail_attempts").notNull().default(0),
    mailNextTryAt: timestamp("mail_next_try_at", { withTimezone: true }),
  },
  (table) => [
    index("invitations_school_id_idx").on(table.schoolId),
    index("invitations_email_idx").on(table.email),
    index("invitations_mail_waiting_idx").on(table.mailNextTryAt).where(sql`${table.mailPendingSince} is not null`),
  ],
);

export const invitationsRelations = relations(invitations, ({ one }) => ({
  school: one(schools, { fields: [invitations.schoolId], references: [schools.id] }),
  cohort: one(cohorts, { fields: [invitations.cohortId], references: [cohorts.id] }),
  invitedBy: one(users, { fields: [invitations.invitedById], references: [users.id] }),
}));

export type Invitation = typeof invitations.$inferSelect;
export type NewInvitation = typeof invitations.$inferInsert;
