import { relations, sql } from "drizzle-orm";
import { check, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { cohorts } from "./cohorts";
import { users } from "./users";

export const schools = pgTable(
  "schools",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    slug: text("slug").notNull().unique(),
    name: text("name").notNull(),
    // Who signs the school's certificates, set by its admin; copied onto each certificate as it is issued.
    signatoryName: text("signatory_name"),
    signatoryRole: text("signatory_role"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [check("schools_signatory_complete", sql`(${table.signatoryName} is null) = (${table.signatoryRole} is null)`)],
);

export const schoolsRelations = relations(schools, ({ many }) => ({
  users: many(users),
  cohorts: many(cohorts),
}));

export type School = typeof schools.$inferSelect;
export type NewSchool = typeof schools.$inferInsert;
