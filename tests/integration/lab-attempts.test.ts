/**
 * The grading route against the real database: the handlers are called with a Request carrying a
 * real session cookie, exactly as Next calls them.
 */
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as getAttempt } from "@/app/api/labs/[labSlug]/attempts/[attemptId]/route";
import { GET as listAttempts, POST as submitAttempt } from "@/app/api/labs/[labSlug]/attempts/route";
import { db } from "@/db/client";
import { markLessonsCompleted } from "@/db/queries/progress";
import { cohortMemberships, labAttempts } from "@/db/schema";
import { getCourse, getLab, getLessonOfLab, judgeRun, labVariant } from "@/lessons";
import { createSession } from "@/lib/auth/session-store";
import { gradeAttempt, type AttemptView, type VerdictLine } from "@/lib/grading";
import { attemptPageSizes } from "@/lib/grading/attempt-pages";
import { simulateRun, type SimInput } from "@/lib/sim";
import { createPerson, findDemoCohortId } from "./support/people";

const LAB = "lone-lead-termination";
const lab = getLab(LAB)!;
// A 3.3 V pin on 8–14 m of lone lead: about 150 Ω nearly matches the line; 33 Ω rings into the clamps.
const passing = { main: { seriesResistance: 240 } };
const failing = { main: { seriesResistance: 33 } };

type Person = { id: string; cookie: string };

/** A learner who has finished the lessons before the lab's own, so its workbench is open. */
async function readyForLab(userId: string, labSlug = LAB) {
  const number = getLessonOfLab(labSlug)!.number;
  const earlier = getCourse().lessons.filter((lesson) => lesson.number < number);
  await markLessonsCompleted({ userId, completions: earlier.map((lesson) => ({ lessonSlug: lesson.slug, completedAt: new Date() })) });
}

async function signedIn(role: "learner" | "instructor", cohortId?: string, options: { ready?: boolean } = {}): Promise<Person> {
  const person = await createPerson({ role, password: "bench and scope" });
  if (cohortId) await db.insert(cohortMemberships).values({ cohortId, userId: person.id, role });
  if (role === "learner" && options.ready !== false) await readyForLab(person.id);
  const cookie = await createSession(person.id);
  return { id: person.id, cookie: `${cookie.name}=${cookie.value}` };
}

function request(path: string, init: { person?: Person; body?: unknown; rawBody?: string } = {}): Request {
  const headers: Record<string, string> = {};
  if (init.person) headers.cookie = init.person.cookie;
  const hasBody = init.body !== undefined || init.rawBody !== undefined;
  if (hasBody) headers["content-type"] = "application/json";
  return new Request(`http://127.0.0.1${path}`, {
    method: hasBody ? "POST" : "GET",
    headers,
    body: init.rawBody ?? (init.body === undefined ? undefined : JSON.stringify(init.body)),
  });
}

const labParams = (labSlug = LAB) => ({ params: Promise.resolve({ labSlug }) });

async function submit(person: Person | undefined, body: unknown, labSlug = LAB) {
  const response = await submitAttempt(request(`/api/labs/${labSlug}/attempts`, { person, body }), labParams(labSlug));
  return { status: response.status, json: await response.json() };
}

type Submitted = { attempt: AttemptView; score: number; passed: boolean; reasons: VerdictLine[]; replayed: boolean };

async function rowsOf(userId: string) {
  return db.select().from(labAttempts).where(and(eq(labAttempts.userId, userId), eq(labAttempts.labSlug, LAB)));
}

let cohortId: string;
beforeAll(async () => {
  cohortId = await findDemoCohortId();
});

describe("POST /api/labs/[labSlug]/attempts", () => {
  it("answers 401 in JSON without a session, and with a session that does not exist", async () => {
    const anonymous = await submit(undefined, { choices: passing, idempotencyKey: randomUUID() });
    expect(anonymous.status).toBe(401);
    expect(anonymous.json.error.code).toBe("unauthenticated");
    const forged = await submit({ id: "none", cookie: "edgewise_session=not-a-real-session" }, { choices: passing, idempotencyKey: randomUUID() });
    expect(forged.status).toBe(401);
  });

  it("answers 403 to an instructor and stores nothing", async () => {
    const instructor = await signedIn("instructor");
    const { status, json } = await submit(instructor, { choices: passing, idempotencyKey: randomUUID() });
    expect(status).toBe(403);
    expect(json.error.code).toBe("forbidden");
    expect(await db.select().from(labAttempts).where(eq(labAttempts.userId, instructor.id))).toHaveLength(0);
  });

  it("answers 403 for a lab whose lesson is still locked, naming the lesson to finish", async () => {
    const newcomer = await signedIn("learner", cohortId, { ready: false });
    const { status, json } = await submit(newcomer, { choices: passing, idempotencyKey: randomUUID() });
    expect(status).toBe(403);
    expect(json.error.message).toMatch(/opens when lesson 5, .+, is done/);
    expect(await rowsOf(newcomer.id)).toHaveLength(0);
  });

  it("answers 404 for a lab that does not exist", async () => {
    const learner = await signedIn("learner", cohortId);
    const { status, json } = await submit(learner, { choices: passing, idempotencyKey: randomUUID() }, "no-such-lab");
    expect(status).toBe(404);
    expect(json.error.code).toBe("not-found");
  });

  it("answers 422 naming the field for a bad body, 400 for a body that is not JSON, and stores nothing", async () => {
    const learner = await signedIn("learner", cohortId);
    const noKey = await submit(learner, { choices: passing });
    expect(noKey.status).toBe(422);
    expect(Object.keys(noKey.json.error.fieldErrors)).toEqual(["idempotencyKey"]);

    const offSeries = await submit(learner, { choices: { main: { seriesResistance: 151 } }, idempotencyKey: randomUUID() });
    expect(offSeries.status).toBe(422);
    expect(offSeries.json.error.fieldErrors["choices.main.seriesResistance"][0]).toMatch(/E24 values from 10 to 1000 ohm/);
    expect(offSeries.json.error.message).toMatch(/^choices\.main\.seriesResistance: /);

    const wrongRun = await submit(learner, { choices: { arch: { seriesResistance: 150 } }, idempotencyKey: randomUUID() });
    expect(wrongRun.status).toBe(422);
    expect(Object.keys(wrongRun.json.error.fieldErrors).sort()).toEqual(["choices.arch", "choices.main"]);

    const notJson = await submitAttempt(request(`/api/labs/${LAB}/attempts`, { person: learner, rawBody: "{choices:" }), labParams());
    expect(notJson.status).toBe(400);
    expect(await rowsOf(learner.id)).toHaveLength(0);
  });

  it("grades on the server and stores the attempt: a passing choice passes, a failing one fails with its reasons", async () => {
    const learner = await signedIn("learner", cohortId);
    const good = await submit(learner, { choices: passing, idempotencyKey: randomUUID() });
    expect(good.status).toBe(201);
    const goodBody = good.json as Submitted;
    expect(goodBody.passed).toBe(true);
    expect(goodBody.score).toBeGreaterThanOrEqual(lab.scoring.passBase);
    expect(goodBody.attempt).toMatchObject({ attemptNumber: 1, passed: true, choices: passing });
    expect(goodBody.reasons.filter((r) => r.severity === "fail")).toEqual([]);

    const bad = await submit(learner, { choices: failing, idempotencyKey: randomUUID() });
    expect(bad.status).toBe(201);
    const badBody = bad.json as Submitted;
    expect(badBody.passed).toBe(false);
    expect(badBody.score).toBeLessThanOrEqual(lab.scoring.failCreditMax);
    expect(badBody.attempt.attemptNumber).toBe(2);
    const failReasons = badBody.reasons.filter((r) => r.severity === "fail");
    expect(failReasons.map((r) => r.message).join(" ")).toMatch(/misread at some switching point/);
    expect(failReasons.map((r) => r.heading)).toContain("Fails");
    expect(failReasons.every((r) => r.runId === "main")).toBe(true);

    const rows = (await rowsOf(learner.id)).sort((a, b) => a.attemptNumber - b.attemptNumber);
    expect(rows.map((r) => [r.attemptNumber, r.passed, r.score])).toEqual([
      [1, true, goodBody.score],
      [2, false, badBody.score],
    ]);
    expect(rows.every((r) => r.cohortId === cohortId && r.variantSeed === `${learner.id}:${LAB}`)).toBe(true);
  });

  it("ignores a score or verdict the browser sends along", async () => {
    const learner = await signedIn("learner", cohortId);
    const { status, json } = await submit(learner, { choices: failing, idempotencyKey: randomUUID(), score: 100, passed: true });
    expect(status).toBe(422);
    expect(json.error.fieldErrors).toEqual({ passed: ["is not expected here"], score: ["is not expected here"] });
    expect(await rowsOf(learner.id)).toHaveLength(0);
  });

  it("stores a retried submission once, even when the retries arrive together", async () => {
    const learner = await signedIn("learner", cohortId);
    const body = { choices: passing, idempotencyKey: randomUUID() };
    const [first, second] = await Promise.all([submit(learner, body), submit(learner, body)]);
    expect([first.status, second.status].sort()).toEqual([200, 201]);
    expect(first.json.attempt.id).toBe(second.json.attempt.id);
    expect([first.json.replayed, second.json.replayed].sort()).toEqual([false, true]);
    const third = await submit(learner, body);
    expect(third.status).toBe(200);
    expect(third.json.attempt.id).toBe(first.json.attempt.id);
    expect(await rowsOf(learner.id)).toHaveLength(1);
  });

  it("stores one row for eight resends of one key arriving while their grading queues for a thread", async () => {
    const learner = await signedIn("learner", cohortId);
    const body = { choices: failing, idempotencyKey: randomUUID() };
    const results = await Promise.all(Array.from({ length: 8 }, () => submit(learner, body)));
    expect(results.map((r) => r.status).sort()).toEqual([200, 200, 200, 200, 200, 200, 200, 201]);
    expect(new Set(results.map((r) => r.json.attempt.id)).size).toBe(1);
    expect(results.filter((r) => r.json.replayed)).toHaveLength(7);
    const rows = await rowsOf(learner.id);
    expect(rows).toHaveLength(1);
    expect(rows[0].passed).toBe(false);
  });

  it("numbers simultaneous submissions 1, 2, 3 without a gap or a clash", async () => {
    const learner = await signedIn("learner", cohortId);
    const results = await Promise.all([passing, failing, passing].map((choices) => submit(learner, { choices, idempotencyKey: randomUUID() })));
    expect(results.map((r) => r.status)).toEqual([201, 201, 201]);
    expect(results.map((r) => r.json.attempt.attemptNumber).sort()).toEqual([1, 2, 3]);
  });
});

describe("GET /api/labs/[labSlug]/attempts and /[attemptId]", () => {
  it("lists only the learner's own attempts, newest first", async () => {
    const learner = await signedIn("learner", cohortId);
    const neighbour = await signedIn("learner", cohortId);
    await submit(learner, { choices: failing, idempotencyKey: randomUUID() });
    await submit(learner, { choices: passing, idempotencyKey: randomUUID() });
    await submit(neighbour, { choices: passing, idempotencyKey: randomUUID() });

    const response = await listAttempts(request(`/api/labs/${LAB}/attempts`, { person: learner }), labParams());
    expect(response.status).toBe(200);
    const { attempts } = (await response.json()) as { attempts: AttemptView[] };
    expect(attempts.map((a) => [a.attemptNumber, a.passed])).toEqual([
      [2, true],
      [1, false],
    ]);
    const anonymous = await listAttempts(request(`/api/labs/${LAB}/attempts`), labParams());
    expect(anonymous.status).toBe(401);
  });

  it("rebuilds the graded simulator input, which re-simulates and re-grades to the stored result", async () => {
    const learner = await signedIn("learner", cohortId);
    const submitted = (await submit(learner, { choices: failing, idempotencyKey: randomUUID() })).json as Submitted;
    const attemptId = submitted.attempt.id;

    const response = await getAttempt(request(`/api/labs/${LAB}/attempts/${attemptId}`, { person: learner }), {
      params: Promise.resolve({ labSlug: LAB, attemptId }),
    });
    expect(response.status).toBe(200);
    const body = (await response.json()) as { attempt: AttemptView; runs: { runId: string; input: SimInput }[] };
    expect(body.attempt.id).toBe(attemptId);
    expect(body.runs.map((r) => r.runId)).toEqual(["main"]);
    const { input } = body.runs[0];
    expect(input.seriesResistance).toBe(33);
    expect(input.cable).toEqual({ kind: "lone-lead", length: labVariant(lab, `${learner.id}:${LAB}`).runs[0].scenario.length });

    const redrawn = simulateRun(input);
    expect(judgeRun(lab.passRule, 5, redrawn).pass).toBe(false);
    expect(redrawn.metrics).toEqual(submitted.attempt.runs[0].metrics);

    const [row] = await rowsOf(learner.id);
    const regraded = gradeAttempt({ lab, seed: row.variantSeed, choices: row.choices, attemptNumber: row.attemptNumber });
    expect(regraded.score).toBe(row.score);
    expect(regraded.passed).toBe(row.passed);
  });

  it("does not show one learner's attempt to another, nor under another lab", async () => {
    const learner = await signedIn("learner", cohortId);
    const neighbour = await signedIn("learner", cohortId);
    const { attempt } = (await submit(learner, { choices: passing, idempotencyKey: randomUUID() })).json as Submitted;
    const asNeighbour = await getAttempt(request(`/api/labs/${LAB}/attempts/${attempt.id}`, { person: neighbour }), {
      params: Promise.resolve({ labSlug: LAB, attemptId: attempt.id }),
    });
    expect(asNeighbour.status).toBe(404);
    const otherLab = await getAttempt(request(`/api/labs/thresholds/attempts/${attempt.id}`, { person: learner }), {
      params: Promise.resolve({ labSlug: "thresholds", attemptId: attempt.id }),
    });
    expect(otherLab.status).toBe(404);
    const notAnId = await getAttempt(request(`/api/labs/${LAB}/attempts/42`, { person: learner }), {
      params: Promise.resolve({ labSlug: LAB, attemptId: "42" }),
    });
    expect(notAnId.status).toBe(404);
  });
});

describe("GET /api/labs/[labSlug]/attempts, a page at a time", () => {
  type Page = { attempts: AttemptView[]; nextCursor: string | null };

  async function page(person: Person, query = ""): Promise<{ status: number; json: Page & { error?: { fieldErrors: Record<string, string[]> } } }> {
    const response = await listAttempts(request(`/api/labs/${LAB}/attempts${query}`, { person }), labParams());
    return { status: response.status, json: await response.json() };
  }

  /** Follows nextCursor from the first page to the last, as the workbench does. */
  async function allPages(person: Person, limit?: number): Promise<Page[]> {
    const pages: Page[] = [];
    for (let cursor: string | null = null; pages.length === 0 || cursor !== null; ) {
      const query = new URLSearchParams({ ...(limit ? { limit: String(limit) } : {}), ...(cursor ? { cursor } : {}) }).toString();
      const { status, json } = await page(person, query ? `?${query}` : "");
      expect(status).toBe(200);
      pages.push(json);
      cursor = json.nextCursor;
    }
    return pages;
  }

  /** A learner with `count` graded attempts: one through the route, the rest copies of its stored row. */
  async function learnerWithAttempts(count: number): Promise<Person> {
    const learner = await signedIn("learner", cohortId);
    await submit(learner, { choices: failing, idempotencyKey: randomUUID() });
    const [first] = await rowsOf(learner.id);
    const { id: _id, createdAt, ...stored } = first!;
    const copies = Array.from({ length: count - 1 }, (_, i) => ({
      ...stored,
      idempotencyKey: randomUUID(),
      attemptNumber: i + 2,
      createdAt: new Date(createdAt.getTime() + (i + 1) * 1000),
    }));
    for (let i = 0; i < copies.length; i += 500) await db.insert(labAttempts).values(copies.slice(i, i + 500));
    return learner;
  }

  it("returns 1,563 attempts in bounded pages, newest first, each once, with no cursor after the last", async () => {
    const learner = await learnerWithAttempts(1563);
    const pages = await allPages(learner);
    expect(pages).toHaveLength(Math.ceil(1563 / attemptPageSizes.default));
    expect(pages.slice(0, -1).every((p) => p.attempts.length === attemptPageSizes.default)).toBe(true);
    const numbers = pages.flatMap((p) => p.attempts.map((attempt) => attempt.attemptNumber));
    expect(numbers).toEqual(Array.from({ length: 1563 }, (_, i) => 1563 - i));
    expect(pages.at(-1)!.nextCursor).toBeNull();

    const widest = await allPages(learner, attemptPageSizes.max);
    expect(widest.map((p) => p.attempts.length)).toEqual([100, 100, 100, 100, 100, 100, 100, 100, 100, 100, 100, 100, 100, 100, 100, 63]);
    expect(JSON.stringify(widest[0]).length).toBeLessThan(JSON.stringify(pages.flatMap((p) => p.attempts)).length / 10);
  });

  it("keeps its place when the learner submits between two pages", async () => {
    const learner = await learnerWithAttempts(30);
    const first = (await page(learner, "?limit=10")).json;
    expect(first.attempts.map((a) => a.attemptNumber)).toEqual([30, 29, 28, 27, 26, 25, 24, 23, 22, 21]);
    await submit(learner, { choices: passing, idempotencyKey: randomUUID() });
    const second = (await page(learner, `?limit=10&cursor=${first.nextCursor}`)).json;
    expect(second.attempts.map((a) => a.attemptNumber)).toEqual([20, 19, 18, 17, 16, 15, 14, 13, 12, 11]);
    expect((await page(learner, "?limit=1")).json.attempts[0]!.attemptNumber).toBe(31);
  });

  it("refuses a page size out of bounds or a cursor it did not give, naming the parameter", async () => {
    const learner = await signedIn("learner", cohortId);
    for (const [query, field] of [
      ["?limit=0", "limit"],
      [`?limit=${attemptPageSizes.max + 1}`, "limit"],
      ["?limit=2.5", "limit"],
      ["?limit=all", "limit"],
      ["?cursor=-3", "cursor"],
      ["?cursor=abc", "cursor"],
      ["?cursor=99999999999999", "cursor"],
    ] as const) {
      const { status, json } = await page(learner, query);
      expect(status, query).toBe(422);
      expect(Object.keys(json.error!.fieldErrors), query).toEqual([field]);
    }
  });
});
