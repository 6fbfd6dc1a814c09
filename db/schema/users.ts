import { relations, sql } from "drizzle-orm";
import { boolean, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { cohortMemberships } from "./cohorts";
import { schools } from "./schools";
import { sessions } from "./sessions";

export const roleEnum = pgEnum("role", ["admin", "instructor", "learner"]);
export type Role = (typeof roleEnum.enumValues)[number];
export const roles = roleEnum.enumValues;

/**
 * The password hash of an account made by enrolment before its owner accepted the invitation. It
 * is no valid hash, so no password matches it; accepting the invitation replaces it.
 */
export const unsetPasswordHash = "!unset";

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    schoolId: uuid("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "restrict" }),
    // Stored trimmed and lower-case so the unique indexes match how people type addresses.
    email: text("email").notNull(),
    name: text("name").notNull(),
    role: roleEnum("role").notNull(),
    passwordHash: text("password_hash").notNull(),
    active: boolean("active").notNull().default(true),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    // An address signs in to one account at most.
    uniqueIndex("users_sign_in_email_unique")
      .on(table.email)
      .where(sql`${table.passwordHash} <> ${sql.raw(`'${unsetPasswordHash}'`)}`),
    // A school enrols an address once. Another school may enrol the same address (its account then
    // waits for an invitation its owner cannot accept), so that enrolling never tells a school
    // whether the address has an account elsewhere.
    uniqueIndex("users_school_email_unique").on(table.schoolId, table.email),
  ],
);

export const usersRelations = relations(users, ({ one, many }) => ({
  school: one(schools, { fields: [users.schoolId], references: [schools.id] }),
  sessions: many(sessions),
  memberships: many(cohortMemberships),
}));

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
