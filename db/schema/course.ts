import { relations } from "drizzle-orm";
import {
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uuid,
} from "drizzle-orm/pg-core";
import { cohorts } from "./cohorts";
import { users } from "./users";

// The course content itself lives in lessons/ (typed, validated at load). These catalogue tables
// mirror its slugs so that attempts and progress reference something the database can enforce;
// they are refreshed from lessons/ by scripts/migrate.ts.

export const courses = pgTable("courses", {
  slug: text("slug").primaryKey(),
  title: text("title").notNull(),
  unlockInOrder: boolean("unlock_in_order").notNull().default(true),
  syncedAt: timestamp("synced_at", { withTimezone: true }).notNull().defaultNow(),
});

export const lessons = pgTable(
  "lessons",
  {
    slug: text("slug").primaryKey(),
    courseSlug: text("course_slug")
      .notNull()
      .references(() => courses.slug, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    title: text("title").notNull(),
  },
  (table) => [unique("lessons_course_number_unique").on(table.courseSlug, table.number)],
);

export const labs = pgTable("labs", {
  slug: text("slug").primaryKey(),
  lessonSlug: text("lesson_slug")
    .notNull()
    .references(() => lessons.slug, { onDelete: "cascade" }),
  title: text("title").notNull(),
});

/**
 * One graded submission. `choices` holds exactly what the learner submitted and `variantSeed` the
 * seed of their scenario, so the run can be rebuilt and re-simulated to redraw its scope view;
 * `outcome` keeps the grader's verdicts and margins as they were at grading time.
 */
export const labAttempts = pgTable(
  "lab_attempts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    labSlug: text("lab_slug")
      .notNull()
      .references(() => labs.slug, { onDelete: "restrict" }),
    cohortId: uuid("cohort_id").references(() => cohorts.id, { onDelete: "set null" }),
    // A retried submission carries the same key and is stored once.
    idempotencyKey: text("idempotency_key").notNull(),
    attemptNumber: integer("attempt_number").notNull(),
    variantSeed: text("variant_seed").notNull(),
    choices: jsonb("choices").notNull(),
    outcome: jsonb("outcome").notNull(),
    score: integer("score").notNull(),
    passed: boolean("passed").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    unique("lab_attempts_user_idempotency_unique").on(table.userId, table.idempotencyKey),
    unique("lab_attempts_user_lab_number_unique").on(table.userId, table.labSlug, table.attemptNumber),
    index("lab_attempts_lab_created_idx").on(table.labSlug, table.createdAt),
    // Covers the cohort grade book's per-learner summary, so it reads an index, not the table's history.
    index("lab_attempts_user_lab_summary_idx").on(table.userId, table.labSlug, table.passed, table.score, table.createdAt),
  ],
);

/**
 * The learner's latest work on a lab's workbench, not yet submitted: the choices of every run and
 * the answers typed into the lab's questions, saved as they change so that the workbench reopens
 * where it was left. One row per learner and lab, overwritten by each save.
 */
export const labDrafts = pgTable(
  "lab_drafts",
  {
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    labSlug: text("lab_slug")
      .notNull()
      .references(() => labs.slug, { onDelete: "cascade" }),
    choices: jsonb("choices").notNull(),
    answers: jsonb("answers").notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.userId, table.labSlug] })],
);

export const quickCheckAnswers = pgTable(
  "quick_check_answers",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    lessonSlug: text("lesson_slug")
      .notNull()
      .references(() => lessons.slug, { onDelete: "restrict" }),
    checkId: text("check_id").notNull(),
    entry: text("entry").notNull(),
    // The entry converted to SI; null when the entry could not be read as a number with a unit.
    value: doublePrecision("value"),
    correct: boolean("correct").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("quick_check_answers_user_lesson_idx").on(table.userId, table.lessonSlug)],
);

export const lessonProgress = pgTable(
  "lesson_progress",
  {
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    lessonSlug: text("lesson_slug")
      .notNull()
      .references(() => lessons.slug, { onDelete: "restrict" }),
    startedAt: timestamp("started_at", { withTimezone: true }).notNull().defaultNow(),
    completedAt: timestamp("completed_at", { withTimezone: true }),
  },
  (table) => [primaryKey({ columns: [table.userId, table.lessonSlug] })],
);

export const labAttemptsRelations = relations(labAttempts, ({ one }) => ({
  user: one(users, { fields: [labAttempts.userId], references: [users.id] }),
  lab: one(labs, { fields: [labAttempts.labSlug], references: [labs.slug] }),
  cohort: one(cohorts, { fields: [labAttempts.cohortId], references: [cohorts.id] }),
}));

export type CourseRow = typeof courses.$inferSelect;
export type LessonRow = typeof lessons.$inferSelect;
export type LabRow = typeof labs.$inferSelect;
export type LabAttempt = typeof labAttempts.$inferSelect;
export type NewLabAttempt = typeof labAttempts.$inferInsert;
export type LabDraft = typeof labDrafts.$inferSelect;
export type QuickCheckAnswer = typeof quickCheckAnswers.$inferSelect;
export type LessonProgress = typeof lessonProgress.$inferSelect;
