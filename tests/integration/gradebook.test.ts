import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import Papa from "papaparse";
import pg from "pg";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as downloadGradebook } from "@/app/api/cohorts/[cohortId]/gradebook.csv/route";
import { db } from "@/db/client";
import { demoAdmin } from "@/db/demo-data";
import {
  findCohortLearnerForViewer,
  listCohortAttemptDays,
  listGradebookCells,
  listGradebookLearners,
  listLearnerAttemptsForViewer,
  listLearnerBenchWorkForViewer,
  listLearnerQuickCheckAnswersForViewer,
  type GradebookViewer,
} from "@/db/queries/gradebook";
import { benchReviews, benchSubmissions, cohortMemberships, cohorts, labAttempts, schools, users, type User } from "@/db/schema";
import { getCourse, getLab } from "@/lessons";
import { formatInUnit } from "@/lib/answers";
import { createSession } from "@/lib/auth/session-store";
import { gradebookItems, stuckRule } from "@/lib/gradebook";
import { loadCohortGradebook, loadCohortOverview, loadLearnerRecord } from "@/lib/gradebook/load";
import { gradeWork, outcomeOf, scoreWork, variantSeedFor } from "@/lib/grading";
import { simulateRun } from "@/lib/sim";
import { createPerson, findDemoSchoolId } from "./support/people";
import { FAR_END_SHAPES } from "@/lib/quick-checks/far-end-shape";
import { answerCheck, quickChecksOf, rightEntryFor } from "./support/quick-checks";

// The grade book against the real database: rows in, grid out; every query refuses viewers who
// do not teach the cohort or run its school; the query count does not grow with the cohort; the
// CSV export through its route handler with real sessions.

const day = 86_400_000;
const now = new Date();
const daysAgo = (n: number, hour = 10) => new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() - n, hour));
const isoDay = (date: Date) => date.toISOString().slice(0, 10);

const items = gradebookItems(getCourse());
const labSlugs = items.filter((item) => item.kind === "lab").map((item) => item.slug);
const [lab1, lab2] = labSlugs;
const benchSlug = items.find((item) => item.kind === "bench")!.slug;
const column = (kind: "lab" | "bench", slug: string) => items.findIndex((item) => item.key === `${kind}:${slug}`);

type Inserted = { score: number; passed: boolean; createdAt: Date };

/** Grades real choices (the lab's worked solution or its first mistake) and stores them as the learner's next attempts. */
async function insertAttempts(params: { user: User; cohortId: string; labSlug: string; good: boolean; at: Date[]; firstNumber?: number }) {
  const lab = getLab(params.labSlug)!;
  const seed = variantSeedFor(params.user.id, lab.slug);
  const answers = Object.fromEntries(lab.questions.map((q) => [q.id, formatInUnit(q.answer.value, q.answer.unit)]));
  const work = gradeWork({ lab, seed, choices: params.good ? lab.reference.solution : lab.reference.mistakes[0].choices, answers });
  const inserted: Inserted[] = [];
  for (const [i, createdAt] of params.at.entries()) {
    const grade = scoreWork(lab, work, (params.firstNumber ?? 1) + i);
    const [row] = await db
      .insert(labAttempts)
      .values({
        userId: params.user.id,
        labSlug: lab.slug,
        cohortId: params.cohortId,
        idempotencyKey: randomUUID(),
        attemptNumber: grade.attemptNumber,
        variantSeed: seed,
        choices: work.choices,
        outcome: outcomeOf(grade),
        score: grade.score,
        passed: grade.passed,
        createdAt,
      })
      .returning();
    inserted.push(row!);
  }
  return inserted;
}

async function createCohort(schoolId: string, label: string, startsOn: string) {
  const [cohort] = await db
    .insert(cohorts)
    .values({ schoolId, name: `Grade book ${label} ${randomUUID().slice(0, 8)}`, courseSlug: getCourse().slug, startsOn, endsOn: isoDay(new Date(now.getTime() + 60 * day)) })
    .returning();
  return cohort!;
}

async function enrol(cohortId: string, user: User, role: "learner" | "instructor", at = now) {
  await db.insert(cohortMemberships).values({ cohortId, userId: user.id, role, createdAt: at });
}

async function learnerNamed(name: string, active = true) {
  const person = await createPerson({ role: "learner", password: "grade book learner", active });
  const [renamed] = await db.update(users).set({ name }).where(eq(users.id, person.id)).returning();
  return renamed!;
}

/** Counts the statements the pool sends while `work` runs. */
async function countQueries<T>(work: () => Promise<T>): Promise<{ result: T; queries: number }> {
  const original = pg.Client.prototype.query;
  let queries = 0;
  pg.Client.prototype.query = function (this: pg.Client, ...args: unknown[]) {
    queries += 1;
    return (original as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof original;
  try {
    return { result: await work(), queries };
  } finally {
    pg.Client.prototype.query = original;
  }
}

const viewerOf = (user: Pick<User, "id" | "role" | "schoolId">): GradebookViewer => ({ id: user.id, role: user.role, schoolId: user.schoolId });

async function cookieFor(user: User): Promise<string> {
  const cookie = await createSession(user.id);
  return `${cookie.name}=${cookie.value}`;
}

function requestCsv(cohortId: string, cookie?: string) {
  const request = new Request(`http://127.0.0.1/api/cohorts/${cohortId}/gradebook.csv`, { headers: cookie ? { cookie } : {} });
  return downloadGradebook(request, { params: Promise.resolve({ cohortId }) });
}

let cohortId: string;
let otherCohortId: string;
let instructor: User;
let otherInstructor: User;
let demoSchoolAdmin: GradebookViewer;
let foreignAdmin: User;
const learners = {} as Record<"ana" | "ben" | "cal" | "dee" | "eve", User>;
const attempts = {} as Record<"anaLab1" | "anaLab2" | "benLab1", Inserted[]>;

beforeAll(async () => {
  const schoolId = await findDemoSchoolId();
  const cohort = await createCohort(schoolId, "main", isoDay(new Date(now.getTime() - 40 * day)));
  const other = await createCohort(schoolId, "other", isoDay(new Date(now.getTime() - 40 * day)));
  cohortId = cohort.id;
  otherCohortId = other.id;

  instructor = await createPerson({ role: "instructor", password: "grade book instructor" });
  otherInstructor = await createPerson({ role: "instructor", password: "grade book instructor" });
  await enrol(cohortId, instructor, "instructor");
  await enrol(otherCohortId, otherInstructor, "instructor");

  const [admin] = await db.select().from(users).where(eq(users.email, demoAdmin.email));
  demoSchoolAdmin = viewerOf(admin!);
  const [foreignSchool] = await db.insert(schools).values({ slug: `elsewhere-${randomUUID().slice(0, 8)}`, name: "Elsewhere Institute" }).returning();
  foreignAdmin = (await createPerson({ role: "admin", password: "another school" }));
  [foreignAdmin] = await db.update(users).set({ schoolId: foreignSchool!.id }).where(eq(users.id, foreignAdmin.id)).returning();

  learners.ana = await learnerNamed('Ana "Sparks" Oduya, jr.');
  learners.ben = await learnerNamed("Ben Achterberg");
  learners.cal = await learnerNamed("=HYPERLINK(\"http://x.example\")");
  learners.dee = await learnerNamed("Dee Switched-Off", false);
  learners.eve = await learnerNamed("Eve Othercohort");
  const enrolledLongAgo = new Date(now.getTime() - 30 * day);
  for (const key of ["ana", "ben", "dee"] as const) await enrol(cohortId, learners[key], "learner", enrolledLongAgo);
  await enrol(cohortId, learners.cal, "learner");
  await enrol(otherCohortId, learners.eve, "learner", enrolledLongAgo);

  attempts.anaLab1 = [
    ...(await insertAttempts({ user: learners.ana, cohortId, labSlug: lab1, good: false, at: [daysAgo(3)] })),
    ...(await insertAttempts({ user: learners.ana, cohortId, labSlug: lab1, good: true, at: [daysAgo(2), daysAgo(1)], firstNumber: 2 })),
  ];
  attempts.anaLab2 = await insertAttempts({
    user: learners.ana,
    cohortId,
    labSlug: lab2,
    good: false,
    at: [daysAgo(2, 11), daysAgo(2, 12), daysAgo(1, 11), daysAgo(1, 12), daysAgo(1, 13)],
  });
  attempts.benLab1 = await insertAttempts({ user: learners.ben, cohortId, labSlug: lab1, good: true, at: [daysAgo(12)] });
  await insertAttempts({ user: learners.dee, cohortId, labSlug: lab1, good: false, at: [daysAgo(20), daysAgo(20, 11), daysAgo(20, 12), daysAgo(20, 13), daysAgo(20, 14)] });
  await insertAttempts({ user: learners.eve, cohortId: otherCohortId, labSlug: lab1, good: true, at: [daysAgo(1)] });

  const [returned] = await db
    .insert(benchSubmissions)
    .values({ learnerId: learners.ana.id, cohortId, exerciseSlug: benchSlug, status: "returned", submittedAt: daysAgo(4), updatedAt: daysAgo(4) })
    .returning();
  await db.insert(benchReviews).values({
    submissionId: returned!.id,
    reviewerId: instructor.id,
    scores: { "measurement-correct": 2, "trace-readable": 1, "conclusion-sound": 1, "design-worked": 2 },
    total: 6,
    maxTotal: 10,
    feedback: "Probe ground too long: redo the measurement with the spring tip.",
    decision: "return",
    createdAt: daysAgo(3, 9),
  });
  await db.insert(benchSubmissions).values({ learnerId: learners.ben.id, cohortId, exerciseSlug: benchSlug, status: "submitted", submittedAt: daysAgo(2), updatedAt: daysAgo(2) });
});

describe("the progress grid from the database", () => {
  it("aggregates each learner's attempts into best score, pass, attempts and last activity per item", async () => {
    const loaded = await loadCohortGradebook({ cohortId, viewer: viewerOf(instructor), now });
    expect(loaded).not.toBeNull();
    const { gradebook } = loaded!;
    expect(gradebook.rows.map((row) => row.learner.name)).toEqual([
      '=HYPERLINK("http://x.example")',
      'Ana "Sparks" Oduya, jr.',
      "Ben Achterberg",
      "Dee Switched-Off",
    ]);
    const [cal, ana, ben, dee] = gradebook.rows;

    const anaLab1 = ana.cells[column("lab", lab1)];
    expect(anaLab1).toMatchObject({
      state: "passed",
      bestScore: Math.max(...attempts.anaLab1.map((a) => a.score)),
      passed: true,
      attempts: 3,
      failedAttempts: 1,
      lastActivityAt: daysAgo(1),
    });
    expect(attempts.anaLab2.every((a) => !a.passed)).toBe(true);
    expect(ana.cells[column("lab", lab2)]).toMatchObject({ state: "stuck", attempts: 5, failedAttempts: 5, passed: false });
    expect(ana.cells[column("bench", benchSlug)]).toMatchObject({ state: "returned", bestScore: 60, attempts: 1, failedAttempts: 1, passed: false });
    expect(ana.standing).toBe("stuck");
    expect(ana.attention).toEqual([expect.objectContaining({ kind: "failing", itemLabel: "Lab 2", failedAttempts: stuckRule.failedAttempts })]);
    expect(ana.lastActivityAt).toEqual(daysAgo(1, 13));

    expect(ben.cells[column("lab", lab1)]).toMatchObject({ state: "passed", attempts: 1, bestScore: attempts.benLab1[0].score });
    expect(ben.cells[column("bench", benchSlug)]).toMatchObject({ state: "waiting", bestScore: null, attempts: 1, failedAttempts: 0 });
    expect(ben.lastActivityAt).toEqual(daysAgo(2));
    expect(ben.standing).toBe("on-track");

    expect(dee.standing).toBe("switched-off");
    expect(dee.attention).toEqual([]);
    expect(cal.standing).toBe("not-started");
    expect(cal.cells.every((cell) => cell.state === "not-started")).toBe(true);
    expect(gradebook.counts).toMatchObject({ stuck: 1, "on-track": 1, "switched-off": 1, "not-started": 1, complete: 0 });
  });

  it("flags a learner idle for a week", async () => {
    // Noon six days on, whatever the hour the suite runs: Ben's last work was two days ago at 10:00.
    const later = daysAgo(-6, 12);
    const { gradebook } = (await loadCohortGradebook({ cohortId, viewer: viewerOf(instructor), now: later }))!;
    const ben = gradebook.rows.find((row) => row.learner.id === learners.ben.id)!;
    expect(ben.attention).toEqual([{ kind: "idle", idleDays: 8, lastActivityAt: daysAgo(2) }]);
  });

  it("counts the cohort's lab attempts per day for the chart", async () => {
    const overview = (await loadCohortOverview({ cohortId, viewer: viewerOf(instructor), now }))!;
    const byDay = new Map(overview.days.map((d) => [d.day, d]));
    expect(byDay.get(isoDay(daysAgo(1)))).toEqual({ day: isoDay(daysAgo(1)), passed: 1, failed: 3 });
    expect(byDay.get(isoDay(daysAgo(2)))).toEqual({ day: isoDay(daysAgo(2)), passed: 1, failed: 2 });
    expect(byDay.get(isoDay(daysAgo(20)))).toEqual({ day: isoDay(daysAgo(20)), passed: 0, failed: 5 });
    expect(overview.days.at(-1)!.day).toBe(isoDay(now));
    const lab1Distribution = overview.distributions.find((d) => d.itemKey === `lab:${lab1}`)!;
    // Ana, Ben and Cal are active; Dee's account is switched off and left out.
    expect(lab1Distribution.unscored).toBe(1);
    expect(lab1Distribution.bins.reduce((sum, bin) => sum + bin.learners, 0)).toBe(2);
  });

  it("issues the same three statements for a cohort of 4 or of 34 learners", async () => {
    const small = await countQueries(() => loadCohortGradebook({ cohortId, viewer: viewerOf(instructor), now }));
    expect(small.queries).toBe(3);

    const extra = await createCohort(await findDemoSchoolId(), "scale", isoDay(now));
    await enrol(extra.id, instructor, "instructor");
    for (let i = 0; i < 34; i += 1) {
      const learner = await learnerNamed(`Scale learner ${String(i).padStart(2, "0")}`);
      await enrol(extra.id, learner, "learner");
      if (i % 2 === 0) await insertAttempts({ user: learner, cohortId: extra.id, labSlug: lab1, good: i % 4 === 0, at: [daysAgo(1)] });
    }
    const large = await countQueries(() => loadCohortGradebook({ cohortId: extra.id, viewer: viewerOf(instructor), now }));
    expect(large.result!.gradebook.rows).toHaveLength(34);
    expect(large.result!.gradebook.rows.filter((row) => row.cells[0].attempts === 1)).toHaveLength(17);
    expect(large.queries).toBe(small.queries);
  });
});

describe("who may see a cohort", () => {
  it("shows the same grid to an admin of the cohort's school", async () => {
    const asAdmin = await loadCohortGradebook({ cohortId, viewer: demoSchoolAdmin, now });
    const asInstructor = await loadCohortGradebook({ cohortId, viewer: viewerOf(instructor), now });
    expect(asAdmin?.gradebook).toEqual(asInstructor?.gradebook);
  });

  it("gives another cohort's instructor, another school's admin and a learner nothing from any query", async () => {
    const outsiders = [viewerOf(otherInstructor), viewerOf(foreignAdmin), viewerOf(learners.ana)];
    for (const viewer of outsiders) {
      const params = { cohortId, viewer };
      const learnerParams = { ...params, learnerId: learners.ana.id };
      expect(await loadCohortGradebook(params)).toBeNull();
      expect(await listGradebookLearners(params)).toEqual([]);
      expect(await listGradebookCells(params)).toEqual([]);
      expect(await listCohortAttemptDays(params)).toEqual([]);
      expect(await findCohortLearnerForViewer(learnerParams)).toBeUndefined();
      expect(await listLearnerAttemptsForViewer(learnerParams)).toEqual([]);
      expect(await listLearnerBenchWorkForViewer(learnerParams)).toEqual([]);
      expect(await listLearnerQuickCheckAnswersForViewer(learnerParams)).toEqual([]);
      expect(await loadLearnerRecord(learnerParams)).toBeNull();
    }
    // The other instructor still sees their own cohort.
    expect((await loadCohortGradebook({ cohortId: otherCohortId, viewer: viewerOf(otherInstructor) }))?.gradebook.rows).toHaveLength(1);
  });

  it("does not open a learner of another cohort through this cohort", async () => {
    expect(await loadLearnerRecord({ cohortId, learnerId: learners.eve.id, viewer: viewerOf(instructor) })).toBeNull();
    expect(await listLearnerAttemptsForViewer({ cohortId, learnerId: learners.eve.id, viewer: viewerOf(instructor) })).toEqual([]);
  });
});

describe("a learner's page", () => {
  it("lists every attempt per lab, each rebuilt to redraw what was graded", async () => {
    const record = (await loadLearnerRecord({ cohortId, learnerId: learners.ana.id, viewer: viewerOf(instructor) }))!;
    expect(record.learner.name).toBe('Ana "Sparks" Oduya, jr.');
    expect(record.labs.map((lab) => lab.item.slug)).toEqual(labSlugs);
    const first = record.labs[0];
    expect(first.attempts.map((a) => [a.attemptNumber, a.passed])).toEqual([
      [1, false],
      [2, true],
      [3, true],
    ]);
    const stored = await db.select().from(labAttempts).where(eq(labAttempts.userId, learners.ana.id));
    for (const attempt of first.attempts) {
      const graded = stored.find((row) => row.id === attempt.id)!;
      const storedRuns = (graded.outcome as { runs: { runId: string; decoded: string }[] }).runs;
      for (const run of attempt.runs) {
        expect(simulateRun(run.input!).decoded).toBe(storedRuns.find((r) => r.runId === run.runId)!.decoded);
      }
    }
    expect(record.labs[1].attempts).toHaveLength(5);
    expect(record.labs[2].attempts).toEqual([]);
    const bench = record.bench.find((b) => b.item.slug === benchSlug)!;
    expect(bench.work).toMatchObject({ status: "returned", reviews: [expect.objectContaining({ total: 6, maxTotal: 10, decision: "return" })] });
  });
});

describe("a learner's quick checks", () => {
  it("shows the instructor every stored answer in words, right or wrong, under its lesson and check", async () => {
    const learner = learners.ana;
    const lesson = getCourse().lessons[1]!;
    const [numeric] = quickChecksOf(lesson).filter((c) => c.kind === "check");
    const [choice] = quickChecksOf(lesson).filter((c) => c.kind === "choice");
    const right = rightEntryFor(learner.id, lesson, choice!);
    expect(choice).toMatchObject({ ask: "predict" });
    const wrong = FAR_END_SHAPES.find((shape) => shape !== right)!;
    const answers = [
      await answerCheck(learner.id, lesson, choice!, wrong),
      await answerCheck(learner.id, lesson, choice!, right),
      await answerCheck(learner.id, lesson, numeric!, "2 kHz"),
    ];
    expect(answers.map((a) => a.correct)).toEqual([false, true, false]);

    const record = (await loadLearnerRecord({ cohortId, learnerId: learner.id, viewer: viewerOf(instructor) }))!;
    const shown = record.checks.find((l) => l.slug === lesson.slug)!;
    expect(shown.number).toBe(lesson.number);
    const choiceShown = shown.checks.find((c) => c.id === choice!.id)!;
    expect(choiceShown.kind).toBe("Predict, then run");
    expect(choiceShown.expected).toBe(answers[1]!.entry);
    expect(choiceShown.asked).toMatch(/^The run: /);
    expect(choiceShown.answers.map(({ entry, correct }) => ({ entry, correct }))).toEqual([answers[0], answers[1]]);
    expect(shown.checks.find((c) => c.id === numeric!.id)!.answers).toMatchObject([{ entry: "2 kHz", correct: false }]);
    // Lessons the learner never answered in are left out.
    expect(record.checks.map((l) => l.slug)).not.toContain(getCourse().lessons[7]!.slug);
  });
});

describe("grade book CSV download", () => {
  it("sends the cohort's instructor every learner with per-item best score and pass, escaped", async () => {
    const response = await requestCsv(cohortId, await cookieFor(instructor));
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(response.headers.get("content-disposition")).toMatch(/^attachment; filename="gradebook-grade-book-main-[a-f0-9]{8}-\d{4}-\d{2}-\d{2}\.csv"$/);
    expect(response.headers.get("cache-control")).toBe("private, no-store");

    const bytes = new Uint8Array(await response.arrayBuffer());
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = new TextDecoder("utf-8", { ignoreBOM: true }).decode(bytes);
    expect(text.startsWith("\uFEFF")).toBe(true);
    expect(text).toContain('"Ana ""Sparks"" Oduya, jr."');
    const { data, errors } = Papa.parse<string[]>(text.slice(1), { newline: "\r\n" });
    expect(errors).toEqual([]);
    const [header, ...rows] = data;
    const at = (name: string) => header.indexOf(name);
    expect(header.slice(0, 3)).toEqual(["Learner", "E-mail", "Account"]);
    expect(rows.map((row) => row[0])).toEqual([
      `'=HYPERLINK("http://x.example")`,
      'Ana "Sparks" Oduya, jr.',
      "Ben Achterberg",
      "Dee Switched-Off",
    ]);
    const [cal, ana, , dee] = rows;
    expect(ana[1]).toBe(learners.ana.email);
    expect(ana[at(`Lab 1 (${getLab(lab1)!.title}) best score`)]).toBe(String(Math.max(...attempts.anaLab1.map((a) => a.score))));
    expect(ana[at("Lab 1 passed")]).toBe("yes");
    expect(ana[at("Lab 2 passed")]).toBe("no");
    expect(ana[at("Items passed")]).toBe("1");
    expect(ana[at("Needs attention")]).toMatch(/^5 failed attempts at Lab 2 /);
    expect(dee[at("Account")]).toBe("switched off");
    expect(cal[at(`Lab 1 (${getLab(lab1)!.title}) best score`)]).toBe("");
    expect(cal[at("Lab 1 passed")]).toBe("no");
  });

  it("sends an admin of the school the same file", async () => {
    const [admin] = await db.select().from(users).where(eq(users.email, demoAdmin.email));
    const response = await requestCsv(cohortId, await cookieFor(admin!));
    expect(response.status).toBe(200);
    expect(await response.text()).toContain("Ben Achterberg");
  });

  it("refuses everyone else: 404 for another cohort's instructor or school, 403 for a learner, 401 without a session", async () => {
    for (const outsider of [otherInstructor, foreignAdmin]) {
      const response = await requestCsv(cohortId, await cookieFor(outsider));
      expect(response.status).toBe(404);
      const body = await response.text();
      expect(body).not.toContain("Achterberg");
      expect(JSON.parse(body)).toMatchObject({ error: { code: "not-found" } });
    }
    const asLearner = await requestCsv(cohortId, await cookieFor(learners.ana));
    expect(asLearner.status).toBe(403);
    expect(await asLearner.json()).toMatchObject({ error: { code: "forbidden" } });
    const anonymous = await requestCsv(cohortId);
    expect(anonymous.status).toBe(401);
    expect((await requestCsv("not-a-cohort", await cookieFor(instructor))).status).toBe(404);
  });
});
