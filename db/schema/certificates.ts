import { relations, sql } from "drizzle-orm";
import { check, index, jsonb, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { cohorts } from "./cohorts";
import { courses } from "./course";
import { schools } from "./schools";
import { users } from "./users";

/** What the certificate states about the learner's results, frozen at the moment it was issued. */
export type CertificateScoreSummary = {
  labs: { slug: string; title: string; bestScore: number; minScore: number }[];
  averageScore: number;
  benchExercises: { slug: string; title: string; points: number; maxPoints: number }[];
};

/** What the course certifies, as the certificate states it: derived from the course when it is issued. */
export type CertificateCertification = {
  competences: string[];
  studyHours: number;
};

/**
 * One per learner and course. Names and titles are copied in when it is issued, so the document
 * and its public verification keep saying what was certified even if a name or a title changes later.
 */
export const certificates = pgTable(
  "certificates",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    // The verification code without its grouping dashes: 16 characters of base32, 80 random bits.
    code: text("code").notNull().unique(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    courseSlug: text("course_slug")
      .notNull()
      .references(() => courses.slug, { onDelete: "restrict" }),
    schoolId: uuid("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "restrict" }),
    cohortId: uuid("cohort_id").references(() => cohorts.id, { onDelete: "set null" }),
    learnerName: text("learner_name").notNull(),
    courseTitle: text("course_title").notNull(),
    schoolName: text("school_name").notNull(),
    cohortName: text("cohort_name"),
    scoreSummary: jsonb("score_summary").$type<CertificateScoreSummary>().notNull(),
    // Null on certificates issued before certificates stated them (see lib/certificates/certification.ts).
    certification: jsonb("certification").$type<CertificateCertification>(),
    // Who signed for the school when it was issued; null when the school had named nobody then.
    signatoryName: text("signatory_name"),
    signatoryRole: text("signatory_role"),
    issuedAt: timestamp("issued_at", { withTimezone: true }).notNull().defaultNow(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    revokeReason: text("revoke_reason"),
    revokedBy: uuid("revoked_by").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [
    check("certificates_signatory_complete", sql`(${table.signatoryName} is null) = (${table.signatoryRole} is null)`),
    unique("certificates_user_course_unique").on(table.userId, table.courseSlug),
    index("certificates_school_issued_idx").on(table.schoolId, table.issuedAt),
    check("certificates_revocation_complete", sql`(${table.revokedAt} is null) = (${table.revokeReason} is null)`),
  ],
);

export const certificatesRelations = relations(certificates, ({ one }) => ({
  user: one(users, { fields: [certificates.userId], references: [users.id] }),
  school: one(schools, { fields: [certificates.schoolId], references: [schools.id] }),
  cohort: one(cohorts, { fields: [certificates.cohortId], references: [cohorts.id] }),
}));

export type Certificate = typeof certificates.$inferSelect;
export type NewCertificate = typeof certificates.$inferInsert;
