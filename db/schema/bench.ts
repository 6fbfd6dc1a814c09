import { relations } from "drizzle-orm";
import {
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  unique,
  uuid,
} from "drizzle-orm/pg-core";
import { cohorts } from "./cohorts";
import { users } from "./users";

// Bench exercises are defined in lessons/ (a lesson's `bench`); these tables hold the learner's
// work on one and the instructor's reviews of it.

export const benchSubmissionStatusEnum = pgEnum("bench_submission_status", ["draft", "submitted", "accepted", "returned"]);
export type BenchSubmissionStatus = (typeof benchSubmissionStatusEnum.enumValues)[number];

/**
 * A learner's work on one bench exercise: one row per learner and exercise, reopened when an
 * instructor returns it, so the reviews below form its history. Stated values are in SI units and
 * stay empty while the work is a draft.
 */
export const benchSubmissions = pgTable(
  "bench_submissions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    learnerId: uuid("learner_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    // The cohort decides which instructors may see the work; records outlive nothing silently.
    cohortId: uuid("cohort_id")
      .notNull()
      .references(() => cohorts.id, { onDelete: "restrict" }),
    exerciseSlug: text("exercise_slug").notNull(),
    status: benchSubmissionStatusEnum("status").notNull().default("draft"),
    cableKind: text("cable_kind"),
    lengthM: doublePrecision("length_m"),
    seriesResistanceOhm: doublePrecision("series_resistance_ohm"),
    driverVoltageV: doublePrecision("driver_voltage_v"),
    riseTimeS: doublePrecision("rise_time_s"),
    overshootV: doublePrecision("overshoot_v"),
    /** Answers to the exercise's free-text asks, by ask id. */
    textAnswers: jsonb("text_answers").$type<Record<string, string>>().notNull().default({}),
    note: text("note").notNull().default(""),
    submittedAt: timestamp("submitted_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    unique("bench_submissions_learner_exercise_unique").on(table.learnerId, table.exerciseSlug),
    index("bench_submissions_status_submitted_idx").on(table.status, table.submittedAt),
    index("bench_submissions_cohort_status_submitted_idx").on(table.cohortId, table.status, table.submittedAt),
  ],
);

/** A stored bench photo: written only once the upload completed and its content proved to be an image. */
export const benchPhotos = pgTable(
  "bench_photos",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    submissionId: uuid("submission_id")
      .notNull()
      .references(() => benchSubmissions.id, { onDelete: "cascade" }),
    fileKey: text("file_key").notNull().unique(),
    name: text("name").notNull(),
    size: integer("size").notNull(),
    contentType: text("content_type").notNull(),
    width: integer("width").notNull(),
    height: integer("height").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("bench_photos_submission_created_idx").on(table.submissionId, table.createdAt)],
);

export const benchReviewDecisionEnum = pgEnum("bench_review_decision", ["accept", "return"]);
export type BenchReviewDecision = (typeof benchReviewDecisionEnum.enumValues)[number];

/**
 * One review. `scores` holds the points given per criterion of the exercise's rubric (by
 * criterion id, as the rubric stood when reviewed), `maxTotal` what the rubric allowed then.
 */
export const benchReviews = pgTable(
  "bench_reviews",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    submissionId: uuid("submission_id")
      .notNull()
      .references(() => benchSubmissions.id, { onDelete: "cascade" }),
    reviewerId: uuid("reviewer_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    scores: jsonb("scores").$type<Record<string, number>>().notNull(),
    total: integer("total").notNull(),
    maxTotal: integer("max_total").notNull(),
    feedback: text("feedback").notNull(),
    decision: benchReviewDecisionEnum("decision").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("bench_reviews_submission_created_idx").on(table.submissionId, table.createdAt)],
);

export const benchSubmissionsRelations = relations(benchSubmissions, ({ one, many }) => ({
  learner: one(users, { fields: [benchSubmissions.learnerId], references: [users.id] }),
  cohort: one(cohorts, { fields: [benchSubmissions.cohortId], references: [cohorts.id] }),
  photos: many(benchPhotos),
  reviews: many(benchReviews),
}));

export const benchPhotosRelations = relations(benchPhotos, ({ one }) => ({
  submission: one(benchSubmissions, { fields: [benchPhotos.submissionId], references: [benchSubmissions.id] }),
}));

export const benchReviewsRelations = relations(benchReviews, ({ one }) => ({
  submission: one(benchSubmissions, { fields: [benchReviews.submissionId], references: [benchSubmissions.id] }),
  reviewer: one(users, { fields: [benchReviews.reviewerId], references: [users.id] }),
}));

export type BenchSubmission = typeof benchSubmissions.$inferSelect;
export type NewBenchSubmission = typeof benchSubmissions.$inferInsert;
export type BenchPhoto = typeof benchPhotos.$inferSelect;
export type BenchReview = typeof benchReviews.$inferSelect;
