import { relations } from "drizzle-orm";
import { pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { cohorts } from "./cohorts";
import { users } from "./users";

export const schools = pgTable("schools", {
  id: uuid("id").primaryKey().defaultRandom(),
  slug: text("slug").notNull().unique(),
  name: text("name").notNull(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

export const schoolsRelations = relations(schools, ({ many }) => ({
  users: many(users),
  cohorts: many(cohorts),
}));

export type School = typeof schools.$inferSelect;
export type NewSchool = typeof schools.$inferInsert;
