/**
 * Benchmark of the cohort progress grid's server data function (lib/gradebook/load.ts) on a
 * generated cohort of 500 learners × 12 items, beside seven more cohorts of the same size so the
 * tables hold other schools' work too.
 *
 * Creates its own database on the development cluster (dropped at the end unless --keep),
 * migrates it with drizzle-orm's migrator, fills it, then reports:
 * - the median time of the grid's data function over repeated runs, and its ratio to the 300 ms
 *   target (issue 5, point 6);
 * - the SQL statements one run sends (counted at the pg client), and the indexes each one's plan uses;
 * - a reference measured in the same process: the same grid read with one query per learner
 *   (the N+1 shape), to show what the aggregate queries save on this machine;
 * - the whole server response of the cohort page (`next start`, production build, an
 *   instructor's session), request to last byte. The app's course has the real 10 items (8 labs,
 *   2 bench exercises): the page shows those for the same 500 learners.
 * Nothing here fails a build; the target is printed as met or not met.
 *
 * Run: npm run bench:gradebook  (needs tsx --conditions=react-server for the server-only modules)
 */
import { randomUUID } from "node:crypto";
import { execFileSync } from "node:child_process";
import { availableParallelism, loadavg } from "node:os";
import { fileURLToPath } from "node:url";
import { sql } from "drizzle-orm";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import pg from "pg";
import { createDatabase, createPool, type Database } from "../db/connection";
import {
  benchReviews,
  benchSubmissions,
  cohortMemberships,
  cohorts,
  labAttempts,
  lessonProgress,
  quickCheckAnswers,
  schools,
  users,
  type NewLabAttempt,
} from "../db/schema";
import { syncCourseCatalogue } from "../db/sync-course-catalogue";
import { getCourse, type Course, type Lesson } from "../lessons";
import { formatInUnit } from "../lib/answers";
import { gradebookItems } from "../lib/gradebook";
import { gradeWork, outcomeOf, scoreWork } from "../lib/grading";
import { devDatabaseUrl } from "./dev-database-url";

const TARGET_MS = 300;
const LEARNERS = 500;
const COHORTS = 8;
const WARM_UP = 3;
const RUNS = 15;
const REFERENCE_RUNS = 3;
const SCRATCH_DB = "edgewise_gradebook_bench";
const PAGE_PORT = Number(process.env.GRADEBOOK_APP_PORT ?? 57102);
const keep = process.argv.includes("--keep");

/** The course with two more labs (copies of lessons 7 and 8's), so the grid has 12 items: 10 labs and 2 bench exercises. */
function benchCourse(): Course {
  const course = getCourse();
  const extra = course.lessons.slice(-2).map(
    (lesson, i): Lesson => ({
      ...lesson,
      slug: `${lesson.slug}-extra`,
      number: course.lessons.length + i + 1,
      lab: lesson.lab && { ...lesson.lab, slug: `${lesson.lab.slug}-extra`, title: `${lesson.lab.title} (again)` },
      bench: undefined,
    }),
  );
  return { ...course, lessons: [...course.lessons, ...extra] };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** A small deterministic PRNG, so every run of the benchmark builds the same cohort. */
function mulberry32(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function scratchUrls(): { admin: string; scratch: string } {
  const base = new URL(process.env.DATABASE_URL ?? devDatabaseUrl());
  const admin = new URL(base);
  admin.pathname = "/postgres";
  const scratch = new URL(base);
  scratch.pathname = `/${SCRATCH_DB}`;
  return { admin: admin.toString(), scratch: scratch.toString() };
}

async function recreateDatabase(adminUrl: string, drop: boolean): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`drop database if exists ${SCRATCH_DB} with (force)`);
    if (!drop) await client.query(`create database ${SCRATCH_DB}`);
  } finally {
    await client.end();
  }
}

async function insertInBatches<T>(rows: T[], insert: (batch: T[]) => Promise<unknown>, size = 1000): Promise<void> {
  for (let i = 0; i < rows.length; i += size) await insert(rows.slice(i, i + size));
}

/** One graded outcome per lab and per kind (pass, fail), reused for every generated attempt: real size, real shape. */
function gradedOutcomes(course: Course) {
  const outcomes = new Map<string, { pass: ReturnType<typeof outcomeOf>; fail: ReturnType<typeof outcomeOf>; choices: unknown }>();
  for (const lesson of course.lessons) {
    const lab = lesson.lab;
    if (!lab) continue;
    const answers = Object.fromEntries(lab.questions.map((q) => [q.id, formatInUnit(q.answer.value, q.answer.unit)]));
    const good = gradeWork({ lab, seed: "bench", choices: lab.reference.solution, answers });
    const bad = gradeWork({ lab, seed: "bench", choices: lab.reference.mistakes[0].choices, answers });
    outcomes.set(lab.slug, { pass: outcomeOf(scoreWork(lab, good, 1)), fail: outcomeOf(scoreWork(lab, bad, 1)), choices: good.choices });
  }
  return outcomes;
}

async function fillCohorts(database: Database, course: Course) {
  const random = mulberry32(20260301);
  const now = Date.now();
  const day = 86_400_000;
  const [school] = await database.insert(schools).values({ slug: "bench-school", name: "Benchmark Trades School" }).returning();
  const [reviewer] = await database
    .insert(users)
    .values({ schoolId: school!.id, email: "reviewer@bench.example", name: "Bench Reviewer", role: "instructor", passwordHash: "not-a-login" })
    .returning();
  const labSlugs = course.lessons.flatMap((l) => (l.lab ? [l.lab.slug] : []));
  const benchSlugs = course.lessons.flatMap((l) => (l.bench ? [l.bench.slug] : []));
  const rubrics = new Map(course.lessons.flatMap((l) => (l.bench ? [[l.bench.slug, l.bench.rubric] as const] : [])));
  // The same share of every criterion, so the stored points add up to the stored total.
  const scoresAt = (exerciseSlug: string, share: number) =>
    Object.fromEntries(rubrics.get(exerciseSlug)!.map((c) => [c.id, Math.round(c.points * share)]));
  const checkLessons = course.lessons.slice(0, 8);
  const outcomes = gradedOutcomes(course);
  const cohortIds: string[] = [];
  let attemptCount = 0;

  for (let c = 0; c < COHORTS; c += 1) {
    const [cohort] = await database
      .insert(cohorts)
      .values({ schoolId: school!.id, name: `Bench cohort ${c + 1}`, courseSlug: course.slug, startsOn: new Date(now - 60 * day).toISOString().slice(0, 10), endsOn: new Date(now + 30 * day).toISOString().slice(0, 10) })
      .returning();
    cohortIds.push(cohort!.id);
    await database.insert(cohortMemberships).values({ cohortId: cohort!.id, userId: reviewer!.id, role: "instructor" });

    const learners = await database
      .insert(users)
      .values(
        Array.from({ length: LEARNERS }, (_, i) => ({
          schoolId: school!.id,
          email: `learner-${c + 1}-${String(i).padStart(3, "0")}@bench.example`,
          name: `Learner ${c + 1}-${String(i).padStart(3, "0")}`,
          role: "learner" as const,
          passwordHash: "not-a-login",
        })),
      )
      .returning({ id: users.id });
    await database.insert(cohortMemberships).values(learners.map((l) => ({ cohortId: cohort!.id, userId: l.id, role: "learner" as const })));

    const attempts: NewLabAttempt[] = [];
    const checks: (typeof quickCheckAnswers.$inferInsert)[] = [];
    const progress: (typeof lessonProgress.$inferInsert)[] = [];
    const submissions: (typeof benchSubmissions.$inferInsert & { reviewed: boolean })[] = [];
    for (const learner of learners) {
      // How far this learner has got: up to every lab, weighted to the middle of the course.
      const reached = Math.min(labSlugs.length, Math.floor((random() + random()) * (labSlugs.length / 2 + 1)));
      let clock = now - 55 * day + random() * 5 * day;
      for (let l = 0; l < reached; l += 1) {
        const tries = 1 + Math.floor(random() * random() * 8);
        const passesAt = random() < 0.85 ? tries : 0;
        for (let t = 1; t <= tries; t += 1) {
          clock += random() * 2 * day;
          const pass = t === passesAt;
          const stored = outcomes.get(labSlugs[l]!)!;
          attempts.push({
            userId: learner.id,
            labSlug: labSlugs[l]!,
            cohortId: cohort!.id,
            idempotencyKey: randomUUID(),
            attemptNumber: t,
            variantSeed: `${learner.id}:${labSlugs[l]}`,
            choices: stored.choices,
            outcome: pass ? stored.pass : stored.fail,
            score: pass ? 60 + Math.floor(random() * 41) : Math.floor(random() * 40),
            passed: pass,
            createdAt: new Date(Math.min(clock, now)),
          });
        }
      }
      for (const lesson of checkLessons.slice(0, Math.min(reached + 1, checkLessons.length))) {
        progress.push({ userId: learner.id, lessonSlug: lesson.slug, startedAt: new Date(now - 50 * day) });
        for (let k = 0; k < 3; k += 1) {
          checks.push({ userId: learner.id, lessonSlug: lesson.slug, checkId: `check-${k}`, entry: "330 ns", value: 3.3e-7, correct: random() < 0.7, createdAt: new Date(now - random() * 50 * day) });
        }
      }
      for (const [b, exerciseSlug] of benchSlugs.entries()) {
        if (reached < 7 + b) continue;
        const status = (["draft", "submitted", "returned", "accepted"] as const)[Math.floor(random() * 4)]!;
        submissions.push({ learnerId: learner.id, cohortId: cohort!.id, exerciseSlug, status, submittedAt: status === "draft" ? null : new Date(now - 3 * day), reviewed: status === "returned" || status === "accepted" });
      }
    }
    await insertInBatches(attempts, (batch) => database.insert(labAttempts).values(batch), 500);
    await insertInBatches(checks, (batch) => database.insert(quickCheckAnswers).values(batch));
    await insertInBatches(progress, (batch) => database.insert(lessonProgress).values(batch).onConflictDoNothing());
    const stored = submissions.length
      ? await database.insert(benchSubmissions).values(submissions.map(({ reviewed: _reviewed, ...row }) => row)).returning({ id: benchSubmissions.id, status: benchSubmissions.status, exerciseSlug: benchSubmissions.exerciseSlug })
      : [];
    const reviews = stored
      .filter((s) => s.status === "returned" || s.status === "accepted")
      .map((s) => {
        const scores = scoresAt(s.exerciseSlug, s.status === "accepted" ? 0.8 : 0.5);
        return {
          submissionId: s.id,
          reviewerId: reviewer!.id,
          scores,
          total: Object.values(scores).reduce((sum, points) => sum + points, 0),
          maxTotal: 10,
          feedback: "Generated review.",
          decision: s.status === "accepted" ? ("accept" as const) : ("return" as const),
        };
      });
    if (reviews.length) await insertInBatches(reviews, (batch) => database.insert(benchReviews).values(batch));
    attemptCount += attempts.length;
  }
  await database.execute(sql`analyze`);
  return { cohortId: cohortIds[0]!, reviewerId: reviewer!.id, schoolId: school!.id, attemptCount };
}

type Captured = { text: string; values: unknown[] };

/** Counts (and keeps) the statements sent through any pg client while `work` runs. */
async function captureQueries<T>(work: () => Promise<T>): Promise<{ result: T; statements: Captured[] }> {
  const original = pg.Client.prototype.query;
  const statements: Captured[] = [];
  pg.Client.prototype.query = function (this: pg.Client, ...args: unknown[]) {
    const [first, second] = args as [string | { text: string; values?: unknown[] }, unknown[] | undefined];
    statements.push(typeof first === "string" ? { text: first, values: second ?? [] } : { text: first.text, values: first.values ?? second ?? [] });
    return (original as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof original;
  try {
    return { result: await work(), statements };
  } finally {
    pg.Client.prototype.query = original;
  }
}

type PlanNode = { "Node Type": string; "Index Name"?: string; "Relation Name"?: string; Plans?: PlanNode[] };

function scansOf(node: PlanNode, into: string[] = []): string[] {
  if (node["Index Name"]) into.push(`${node["Node Type"]} ${node["Index Name"]}`);
  else if (node["Node Type"] === "Seq Scan") into.push(`Seq Scan ${node["Relation Name"]}`);
  for (const child of node.Plans ?? []) scansOf(child, into);
  return into;
}

async function timed(work: () => Promise<unknown>, runs: number): Promise<number[]> {
  const times: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    const started = performance.now();
    await work();
    times.push(performance.now() - started);
  }
  return times;
}

async function main(): Promise<void> {
  const root = fileURLToPath(new URL("..", import.meta.url));
  execFileSync("bash", ["scripts/postgres.sh", "up"], { cwd: root, stdio: ["ignore", "ignore", "inherit"] });
  const urls = scratchUrls();
  await recreateDatabase(urls.admin, false);
  const setupPool = createPool(urls.scratch, 4);
  const course = benchCourse();
  const items = gradebookItems(course);
  try {
    const setup = createDatabase(setupPool);
    await migrate(setup, { migrationsFolder: fileURLToPath(new URL("../drizzle", import.meta.url)) });
    await syncCourseCatalogue(setup, course);
    const started = performance.now();
    const filled = await fillCohorts(setup, course);
    console.log(
      `Generated ${COHORTS} cohorts × ${LEARNERS} learners × ${items.length} items (${items.filter((i) => i.kind === "lab").length} labs, ${items.filter((i) => i.kind === "bench").length} bench exercises): ${filled.attemptCount} lab attempts in ${((performance.now() - started) / 1000).toFixed(1)} s.`,
    );

    // The app's own database client reads DATABASE_URL on first use.
    process.env.DATABASE_URL = urls.scratch;
    const { loadCohortGradebook, loadCohortOverview } = await import("../lib/gradebook/load");
    const viewer = { id: filled.reviewerId, role: "instructor" as const, schoolId: filled.schoolId };
    const params = { cohortId: filled.cohortId, viewer, course };
    const grid = () => loadCohortGradebook(params);

    const { result, statements } = await captureQueries(grid);
    if (!result || result.gradebook.rows.length !== LEARNERS || result.gradebook.items.length !== items.length) {
      throw new Error("the grid did not come back with every learner and item");
    }
    await timed(grid, WARM_UP);
    const gridTimes = await timed(grid, RUNS);
    const overview = await captureQueries(() => loadCohortOverview(params));
    const overviewTimes = await timed(() => loadCohortOverview(params), RUNS);

    // Reference: the same learners and cells read one learner at a time (one statement each), as a grid built naively would.
    const referencePool = createPool(urls.scratch, 10);
    const referenceDb = createDatabase(referencePool);
    const learnerIds = result.gradebook.rows.map((row) => row.learner.id);
    const perLearner = async () => {
      for (const id of learnerIds) {
        await referenceDb.execute(sql`
          select lab_slug, max(score), bool_or(passed), count(*), max(created_at)
          from lab_attempts where user_id = ${id} group by lab_slug`);
      }
    };
    const referenceTimes = await timed(perLearner, REFERENCE_RUNS);
    await referencePool.end();

    const plans = await Promise.all(
      statements.map(async (statement) => {
        const explained = await setupPool.query(`explain (format json) ${statement.text}`, statement.values);
        const plan = (explained.rows[0] as { "QUERY PLAN": { Plan: PlanNode }[] })["QUERY PLAN"][0]!.Plan;
        return scansOf(plan);
      }),
    );

    const gridMedian = median(gridTimes);
    const overviewMedian = median(overviewTimes);
    const referenceMedian = median(referenceTimes);
    const rows = result.gradebook.rows;
    console.log(`Machine: ${availableParallelism()} cores, load average ${loadavg()[0]!.toFixed(2)} (timings scale with load).`);
    console.log(`\nGrid data function (loadCohortGradebook), ${RUNS} runs after ${WARM_UP} warm-up:`);
    console.log(`  median ${gridMedian.toFixed(1)} ms (min ${Math.min(...gridTimes).toFixed(1)}, max ${Math.max(...gridTimes).toFixed(1)})`);
    console.log(`  target ${TARGET_MS} ms: ratio ${(gridMedian / TARGET_MS).toFixed(3)} → ${gridMedian < TARGET_MS ? "met" : "NOT met"}`);
    console.log(`  ${statements.length} SQL statements per request, whatever the cohort's size:`);
    statements.forEach((statement, i) => {
      const first = statement.text.replace(/\s+/g, " ").trim().slice(0, 70);
      console.log(`    ${i + 1}. ${first}…\n       plan uses: ${plans[i]!.join(", ") || "(no table scan)"}`);
    });
    console.log(`  grid: ${rows.length} learners, ${rows.filter((r) => r.standing === "stuck").length} needing attention, ${rows.filter((r) => r.standing === "complete").length} with every item passed`);
    console.log(`\nWhole cohort page data (grid + charts, loadCohortOverview): median ${overviewMedian.toFixed(1)} ms, ${overview.statements.length} statements.`);
    console.log(`Reference in this process, one statement per learner (${learnerIds.length} statements, labs only): median ${referenceMedian.toFixed(1)} ms → the grid is ${(referenceMedian / gridMedian).toFixed(1)}× faster.`);

    const { timeCohortPage } = await import("./bench-gradebook/page-response");
    const lastLearner = rows.map((row) => row.learner.name).sort().at(-1)!;
    const page = await timeCohortPage({ port: PAGE_PORT, cohortId: filled.cohortId, instructorId: filled.reviewerId, lastLearner, warmUp: WARM_UP, runs: RUNS });
    if (!page.cellsShown) throw new Error(`the cohort page did not list ${lastLearner}`);
    const pageMedian = median(page.times);
    console.log(`\nCohort page, whole server response (next start, ${LEARNERS} learners × ${gradebookItems(getCourse()).length} items of the app's course, ${(page.bytes / 1000).toFixed(0)} kB of HTML), ${RUNS} runs after ${WARM_UP} warm-up:`);
    console.log(`  median ${pageMedian.toFixed(1)} ms (min ${Math.min(...page.times).toFixed(1)}, max ${Math.max(...page.times).toFixed(1)}), ×${(pageMedian / overviewMedian).toFixed(1)} its data function`);
    console.log(`  target ${TARGET_MS} ms: ratio ${(pageMedian / TARGET_MS).toFixed(3)} → ${pageMedian < TARGET_MS ? "met" : "NOT met"}`);
  } finally {
    await setupPool.end();
    const shared = (globalThis as { edgewiseDb?: { $client: pg.Pool } }).edgewiseDb;
    await shared?.$client.end();
    if (!keep) await recreateDatabase(urls.admin, true);
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
