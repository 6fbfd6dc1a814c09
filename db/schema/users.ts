import { relations } from "drizzle-orm";
import { boolean, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { cohortMemberships } from "./cohorts";
import { schools } from "./schools";
import { sessions } from "./sessions";

export const roleEnum = pgEnum("role", ["admin", "instructor", "learner"]);
export type Role = (typeof roleEnum.enumValues)[number];
export const roles = roleEnum.enumValues;

export const users = pgTable("users", {
  id: uuid("id").primaryKey().defaultRandom(),
  schoolId: uuid("school_id")
    .notNull()
    .references(() => schools.id, { onDelete: "restrict" }),
  // Stored trimmed and lower-case so the unique constraint matches how people type addresses.
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  role: roleEnum("role").notNull(),
  passwordHash: text("password_hash").notNull(),
  active: boolean("active").notNull().default(true),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

export const usersRelations = relations(users, ({ one, many }) => ({
  school: one(schools, { fields: [users.schoolId], references: [schools.id] }),
  sessions: many(sessions),
  memberships: many(cohortMemberships),
}));

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
