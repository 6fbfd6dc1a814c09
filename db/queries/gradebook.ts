import { and, asc, eq, sql, type SQL } from "drizzle-orm";
import { z } from "zod";
import { db } from "../client";
import {
  benchReviews,
  benchSubmissions,
  benchSubmissionStatusEnum,
  cohortMemberships,
  cohorts,
  labAttempts,
  lessonProgress,
  quickCheckAnswers,
  users,
  type Cohort,
  type LabAttempt,
  type Role,
} from "../schema";

// The instructor's view of a cohort. Every query carries the viewer and checks, in the same
// statement, that they may see the cohort: its instructors, and the admins of its school.
// Nobody else gets a row, whatever ids they pass.

export type GradebookViewer = { id: string; role: Role; schoolId: string };

function viewerSeesCohort(viewer: GradebookViewer, cohortId: string): SQL {
  if (viewer.role === "instructor") {
    return sql`exists (
      select 1 from ${cohortMemberships} v
      where v.cohort_id = ${cohortId} and v.user_id = ${viewer.id} and v.role = 'instructor'
    )`;
  }
  if (viewer.role === "admin") {
    return sql`exists (select 1 from ${cohorts} c where c.id = ${cohortId} and c.school_id = ${viewer.schoolId})`;
  }
  return sql`false`;
}

/** The cohort, when the viewer teaches it or runs its school. */
export async function findCohortForViewer(params: { cohortId: string; viewer: GradebookViewer }): Promise<Cohort | undefined> {
  const [row] = await db
    .select()
    .from(cohorts)
    .where(and(eq(cohorts.id, params.cohortId), viewerSeesCohort(params.viewer, params.cohortId)))
    .limit(1);
  return row;
}

const timestamp = z.coerce.date();
const optionalTimestamp = z.coerce.date().nullable();

const learnerRowSchema = z.object({
  learner_id: z.string(),
  name: z.string(),
  email: z.string(),
  active: z.boolean(),
  enrolled_at: timestamp,
  last_lesson_activity_at: optionalTimestamp,
});

/**
 * The cohort's learners with their latest lesson activity (a lesson opened or finished, a quick
 * check answered), which no grade book column shows. Index use: the membership primary key
 * (cohort_id, user_id), then per learner lesson_progress's key and quick_check_answers (user_id, …).
 */
export async function listGradebookLearners(params: { cohortId: string; viewer: GradebookViewer }) {
  const result = await db.execute(sql`
    select u.id as learner_id, u.name, u.email, u.active, m.created_at as enrolled_at,
      greatest(
        (select max(q.created_at) from ${quickCheckAnswers} q where q.user_id = u.id),
        (select max(coalesce(p.completed_at, p.started_at)) from ${lessonProgress} p where p.user_id = u.id)
      ) as last_lesson_activity_at
    from ${cohortMemberships} m
    join ${users} u on u.id = m.user_id
    where m.cohort_id = ${params.cohortId} and m.role = 'learner' and ${viewerSeesCohort(params.viewer, params.cohortId)}
    order by u.name, u.id
  `);
  return result.rows.map((raw) => {
    const row = learnerRowSchema.parse(raw);
    return {
      learnerId: row.learner_id,
      name: row.name,
      email: row.email,
      active: row.active,
      enrolledAt: row.enrolled_at,
      lastLessonActivityAt: row.last_lesson_activity_at,
    };
  });
}

const cellRowSchema = z.object({
  learner_id: z.string(),
  kind: z.enum(["lab", "bench"]),
  slug: z.string(),
  best_score: z.number().nullable(),
  passed: z.boolean(),
  attempts: z.number(),
  failed_attempts: z.number(),
  last_activity_at: timestamp,
  bench_status: z.enum(benchSubmissionStatusEnum.enumValues).nullable(),
});

/**
 * Every learner's work per lab and per bench exercise, aggregated in one statement: for a lab the
 * best score, any pass, attempts, failed attempts and the latest; for a bench exercise the best
 * reviewed score in percent, accepted or not, hand-ins (reviews, plus one waiting), returns and
 * the latest change. Index use: lab_attempts (user_id, lab_slug, attempt_number),
 * bench_submissions (learner_id, exercise_slug), bench_reviews (submission_id, created_at).
 */
export async function listGradebookCells(params: { cohortId: string; viewer: GradebookViewer }) {
  const seen = viewerSeesCohort(params.viewer, params.cohortId);
  const result = await db.execute(sql`
    select a.user_id as learner_id, 'lab' as kind, a.lab_slug as slug,
      max(a.score)::int as best_score,
      bool_or(a.passed) as passed,
      count(*)::int as attempts,
      (count(*) filter (where not a.passed))::int as failed_attempts,
      max(a.created_at) as last_activity_at,
      null::text as bench_status
    from ${cohortMemberships} m
    join ${labAttempts} a on a.user_id = m.user_id
    where m.cohort_id = ${params.cohortId} and m.role = 'learner' and ${seen}
    group by a.user_id, a.lab_slug
    union all
    select s.learner_id, 'bench', s.exercise_slug,
      r.best_score,
      s.status = 'accepted',
      r.reviews + (s.status = 'submitted')::int,
      r.returned,
      greatest(s.updated_at, r.last_review_at),
      s.status::text
    from ${cohortMemberships} m
    join ${benchSubmissions} s on s.learner_id = m.user_id
    cross join lateral (
      select round(max(100.0 * br.total / nullif(br.max_total, 0)))::int as best_score,
        count(*)::int as reviews,
        (count(*) filter (where br.decision = 'return'))::int as returned,
        max(br.created_at) as last_review_at
      from ${benchReviews} br where br.submission_id = s.id
    ) r
    where m.cohort_id = ${params.cohortId} and m.role = 'learner' and ${seen}
  `);
  return result.rows.map((raw) => {
    const row = cellRowSchema.parse(raw);
    return {
      learnerId: row.learner_id,
      kind: row.kind,
      slug: row.slug,
      bestScore: row.best_score,
      passed: row.passed,
      attempts: row.attempts,
      failedAttempts: row.failed_attempts,
      lastActivityAt: row.last_activity_at,
      benchStatus: row.bench_status,
    };
  });
}

const attemptDaySchema = z.object({ day: z.string(), attempts: z.number(), passed: z.number() });

/** The cohort's lab attempts per UTC day, with how many of them passed. */
export async function listCohortAttemptDays(params: { cohortId: string; viewer: GradebookViewer }) {
  const result = await db.execute(sql`
    select to_char((a.created_at at time zone 'UTC')::date, 'YYYY-MM-DD') as day,
      count(*)::int as attempts,
      (count(*) filter (where a.passed))::int as passed
    from ${cohortMemberships} m
    join ${labAttempts} a on a.user_id = m.user_id
    where m.cohort_id = ${params.cohortId} and m.role = 'learner' and ${viewerSeesCohort(params.viewer, params.cohortId)}
    group by 1
    order by 1
  `);
  return result.rows.map((raw) => attemptDaySchema.parse(raw));
}

export type CohortLearner = { id: string; name: string; email: string; active: boolean; enrolledAt: Date };

/** A learner of the cohort, when the viewer may see the cohort. */
export async function findCohortLearnerForViewer(params: {
  cohortId: string;
  learnerId: string;
  viewer: GradebookViewer;
}): Promise<CohortLearner | undefined> {
  const [row] = await db
    .select({ id: users.id, name: users.name, email: users.email, active: users.active, enrolledAt: cohortMemberships.createdAt })
    .from(cohortMemberships)
    .innerJoin(users, eq(users.id, cohortMemberships.userId))
    .where(
      and(
        eq(cohortMemberships.cohortId, params.cohortId),
        eq(cohortMemberships.userId, params.learnerId),
        eq(cohortMemberships.role, "learner"),
        viewerSeesCohort(params.viewer, params.cohortId),
      ),
    )
    .limit(1);
  return row;
}

function learnerOfCohort(params: { cohortId: string; learnerId: string }): SQL {
  return sql`exists (
    select 1 from ${cohortMemberships} lm
    where lm.cohort_id = ${params.cohortId} and lm.user_id = ${params.learnerId} and lm.role = 'learner'
  )`;
}

/** Every lab attempt of a learner of the cohort, by lab and attempt number. */
export async function listLearnerAttemptsForViewer(params: {
  cohortId: string;
  learnerId: string;
  viewer: GradebookViewer;
}): Promise<LabAttempt[]> {
  return db
    .select()
    .from(labAttempts)
    .where(
      and(
        eq(labAttempts.userId, params.learnerId),
        learnerOfCohort(params),
        viewerSeesCohort(params.viewer, params.cohortId),
      ),
    )
    .orderBy(asc(labAttempts.labSlug), asc(labAttempts.attemptNumber));
}

export type LearnerQuickCheckAnswer = { lessonSlug: string; checkId: string; entry: string; correct: boolean; createdAt: Date };

/** Every quick-check answer of a learner of the cohort, oldest first. */
export async function listLearnerQuickCheckAnswersForViewer(params: {
  cohortId: string;
  learnerId: string;
  viewer: GradebookViewer;
}): Promise<LearnerQuickCheckAnswer[]> {
  return db
    .select({
      lessonSlug: quickCheckAnswers.lessonSlug,
      checkId: quickCheckAnswers.checkId,
      entry: quickCheckAnswers.entry,
      correct: quickCheckAnswers.correct,
      createdAt: quickCheckAnswers.createdAt,
    })
    .from(quickCheckAnswers)
    .where(and(eq(quickCheckAnswers.userId, params.learnerId), learnerOfCohort(params), viewerSeesCohort(params.viewer, params.cohortId)))
    .orderBy(asc(quickCheckAnswers.createdAt), asc(quickCheckAnswers.id));
}

export type LearnerBenchWork = {
  submissionId: string;
  exerciseSlug: string;
  status: (typeof benchSubmissionStatusEnum.enumValues)[number];
  submittedAt: Date | null;
  updatedAt: Date;
  reviews: { total: number; maxTotal: number; decision: "accept" | "return"; feedback: string; createdAt: Date }[];
};

/** A learner's bench submissions with their reviews, newest review first. */
export async function listLearnerBenchWorkForViewer(params: {
  cohortId: string;
  learnerId: string;
  viewer: GradebookViewer;
}): Promise<LearnerBenchWork[]> {
  const rows = await db
    .select({
      submissionId: benchSubmissions.id,
      exerciseSlug: benchSubmissions.exerciseSlug,
      status: benchSubmissions.status,
      submittedAt: benchSubmissions.submittedAt,
      updatedAt: benchSubmissions.updatedAt,
      review: {
        total: benchReviews.total,
        maxTotal: benchReviews.maxTotal,
        decision: benchReviews.decision,
        feedback: benchReviews.feedback,
        createdAt: benchReviews.createdAt,
      },
    })
    .from(benchSubmissions)
    .leftJoin(benchReviews, eq(benchReviews.submissionId, benchSubmissions.id))
    .where(
      and(
        eq(benchSubmissions.learnerId, params.learnerId),
        learnerOfCohort(params),
        viewerSeesCohort(params.viewer, params.cohortId),
      ),
    )
    .orderBy(asc(benchSubmissions.exerciseSlug), sql`${benchReviews.createdAt} desc nulls last`);

  const bySubmission = new Map<string, LearnerBenchWork>();
  for (const { review, ...submission } of rows) {
    let work = bySubmission.get(submission.submissionId);
    if (!work) bySubmission.set(submission.submissionId, (work = { ...submission, reviews: [] }));
    if (review) work.reviews.push(review);
  }
  return [...bySubmission.values()];
}
