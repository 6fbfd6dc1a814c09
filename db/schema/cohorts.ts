import { relations } from "drizzle-orm";
import { date, index, pgEnum, pgTable, primaryKey, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { schools } from "./schools";
import { users } from "./users";

export const cohorts = pgTable(
  "cohorts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    schoolId: uuid("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    courseSlug: text("course_slug").notNull(),
    startsOn: date("starts_on", { mode: "string" }).notNull(),
    endsOn: date("ends_on", { mode: "string" }).notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [unique("cohorts_school_name_unique").on(table.schoolId, table.name)],
);

export const cohortRoleEnum = pgEnum("cohort_role", ["learner", "instructor"]);
export type CohortRole = (typeof cohortRoleEnum.enumValues)[number];

export const cohortMemberships = pgTable(
  "cohort_memberships",
  {
    cohortId: uuid("cohort_id")
      .notNull()
      .references(() => cohorts.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: cohortRoleEnum("role").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    primaryKey({ columns: [table.cohortId, table.userId] }),
    index("cohort_memberships_user_id_idx").on(table.userId),
  ],
);

export const cohortsRelations = relations(cohorts, ({ one, many }) => ({
  school: one(schools, { fields: [cohorts.schoolId], references: [schools.id] }),
  memberships: many(cohortMemberships),
}));

export const cohortMembershipsRelations = relations(cohortMemberships, ({ one }) => ({
  cohort: one(cohorts, { fields: [cohortMemberships.cohortId], references: [cohorts.id] }),
  user: one(users, { fields: [cohortMemberships.userId], references: [users.id] }),
}));

export type Cohort = typeof cohorts.$inferSelect;
export type NewCohort = typeof cohorts.$inferInsert;
export type CohortMembership = typeof cohortMemberships.$inferSelect;
