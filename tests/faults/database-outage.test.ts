/**
 * PostgreSQL is stopped in the middle of a run of learners submitting lab attempts and loading
 * pages, then started again. While it is down every request must get an answer (503: a plain page
 * for pages, JSON for the API), never a hang, a crash or a stack trace; once it is back the same
 * server process serves normally; every attempt that was acknowledged is stored exactly once and
 * complete, and retrying the unacknowledged ones with their keys stores each exactly once.
 */
import { randomUUID } from "node:crypto";
import { inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { labAttempts } from "@/db/schema";
import { formatCertificateCode, generateCertificateCode } from "@/lib/certificates/code";
import type { AppInstance } from "@/scripts/app-instance";
import { findDemoCohortId } from "../integration/support/people";
import { stackTracePattern, startFaultInstance, waitUntilHealthy } from "./support/instance";
import { readyLearnerAtLab, type FaultLearner } from "./support/learners";

const labSlug = "lone-lead-termination";
const choices = { main: { seriesResistance: 240 } };
const learnerCount = 6;
// A request with no answer after this long counts as hung; a healthy or refusing server answers in
// well under a second, so this only catches requests that wait on a dead connection.
const hangLimitMs = 20_000;

type Phase = "up" | "stopping" | "down" | "starting" | "back";
type Exchange = { status: number | "no answer"; contentType: string; body: string; retryAfter: string | null; startedIn: Phase };
type Submission = { learner: FaultLearner; key: string; exchange: Exchange; attemptId: string | null };

let instance: AppInstance;
let learners: FaultLearner[];
let phase: Phase = "up";

async function exchange(path: string, init: RequestInit & { cookie?: string } = {}): Promise<Exchange> {
  const startedIn = phase;
  const headers = new Headers(init.headers);
  if (init.cookie) headers.set("cookie", init.cookie);
  try {
    const response = await fetch(`${instance.baseUrl}${path}`, { ...init, headers, redirect: "manual", signal: AbortSignal.timeout(hangLimitMs) });
    const answer = { status: response.status, contentType: response.headers.get("content-type") ?? "", retryAfter: response.headers.get("retry-after") };
    return { ...answer, body: await response.text(), startedIn };
  } catch (error) {
    return { status: "no answer", contentType: "", body: String(error), retryAfter: null, startedIn };
  }
}

/** Sends a submission again with its key; told to wait by the grading limit (429), it waits as long and sends it again. */
async function resubmit(submission: Submission): Promise<Submission> {
  const answer = await submit(submission.learner, submission.key);
  if (answer.exchange.status !== 429) return answer;
  await new Promise((resolve) => setTimeout(resolve, Number(answer.exchange.retryAfter) * 1000));
  return resubmit(submission);
}

async function submit(learner: FaultLearner, key: string): Promise<Submission> {
  const answer = await exchange(`/api/labs/${labSlug}/attempts`, {
    method: "POST",
    cookie: learner.cookie,
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ choices, idempotencyKey: key }),
  });
  const acknowledged = typeof answer.status === "number" && answer.status >= 200 && answer.status < 300;
  const attemptId = acknowledged ? (JSON.parse(answer.body) as { attempt: { id: string } }).attempt.id : null;
  return { learner, key, exchange: answer, attemptId };
}

/** Each learner submits new attempts and loads pages back to back until told to stop. */
function driveTraffic(shouldStop: () => boolean) {
  const submissions: Submission[] = [];
  const pageLoads: Exchange[] = [];
  const learnerLoop = async (learner: FaultLearner) => {
    while (!shouldStop()) {
      submissions.push(await submit(learner, randomUUID()));
      pageLoads.push(await exchange(`/labs/${labSlug}`, { cookie: learner.cookie }));
    }
  };
  const done = Promise.all(learners.map(learnerLoop));
  return { submissions, pageLoads, done };
}

const isAcknowledged = (submission: Submission) => submission.attemptId !== null;

/** Loads the page until it renders again (the proxy re-checks the database at most once a second). */
async function waitForPage(path: string, cookie: string, timeoutMs = 15_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const answer = await exchange(path, { cookie });
    if (answer.status === 200) return;
    if (Date.now() > deadline) throw new Error(`${path} still answers ${answer.status} after the database came back.`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

beforeAll(async () => {
  instance = await startFaultInstance();
  const cohortId = await findDemoCohortId();
  learners = await Promise.all(Array.from({ length: learnerCount }, () => readyLearnerAtLab({ cohortId, labSlug, label: "faults" })));
});

afterAll(async () => {
  await instance?.stop();
});

describe("the database stops during a run of lab submissions and page loads", () => {
  let run: ReturnType<typeof driveTraffic>;
  let stopped = false;

  it("answers 503 while it is down: a plain page for pages and JSON for the API, with no stack trace", async () => {
    run = driveTraffic(() => stopped);
    await new Promise((resolve) => setTimeout(resolve, 2_000));
    phase = "stopping";
    await instance.stopDatabase();
    phase = "down";

    const learner = learners[0]!;
    const page = await exchange("/learn", { cookie: learner.cookie });
    expect(page.status).toBe(503);
    expect(page.contentType).toMatch(/^text\/html/);
    expect(page.body).toContain("Edgewise is briefly unavailable");
    expect(page.body).not.toMatch(stackTracePattern);
    expect((await exchange("/sign-in")).status).toBe(503);

    for (const path of [
      `/api/labs/${labSlug}/attempts`,
      `/api/labs/${labSlug}/attempts/${randomUUID()}`,
      `/api/bench-photos/${randomUUID()}`,
      `/api/certificates/verify/${formatCertificateCode(generateCertificateCode())}`,
      "/api/health",
    ]) {
      const answer = await exchange(path, { cookie: learner.cookie });
      expect({ path, status: answer.status, contentType: answer.contentType }).toEqual({ path, status: 503, contentType: "application/json" });
      expect((JSON.parse(answer.body) as { error: { code: string } }).error.code).toBe("unavailable");
      expect(answer.body).not.toMatch(stackTracePattern);
    }
    const refused = await submit(learner, randomUUID());
    expect(refused.exchange.status).toBe(503);

    // Stay down for a while under traffic, as an outage would.
    await new Promise((resolve) => setTimeout(resolve, 3_000));
  });

  it("recovers without a restart once the database is back", async () => {
    phase = "starting";
    await instance.startDatabase();
    phase = "back";
    await waitUntilHealthy(instance.baseUrl);
    await waitForPage(`/labs/${labSlug}`, learners[0]!.cookie);
    const after = await submit(learners[0]!, randomUUID());
    expect(after.exchange.status).toBe(201);

    await new Promise((resolve) => setTimeout(resolve, 2_000));
    stopped = true;
    await run.done;

    const all = [...run.submissions.map((s) => s.exchange), ...run.pageLoads];
    // The same server process answered every request: a crash would have left some unanswered.
    expect(all.filter((answer) => answer.status === "no answer").map((answer) => answer.body)).toEqual([]);
    // API calls answer 201 or 503 and nothing else; pages answer 200 or 503, except a page whose
    // render was already under way when the database went: 500 and the error screen.
    expect(new Set(run.submissions.map((s) => s.exchange.status))).toEqual(new Set([201, 503]));
    const renderCutShort = (answer: Exchange) => answer.status === 500 && (answer.startedIn === "up" || answer.startedIn === "stopping");
    expect(new Set(run.pageLoads.filter((answer) => !renderCutShort(answer)).map((answer) => answer.status))).toEqual(new Set([200, 503]));
    // That is Next's error document, which the browser turns into the error screen (retry, reference).
    for (const answer of run.pageLoads.filter(renderCutShort)) expect(answer.body).toContain('<html id="__next_error__">');
    for (const answer of all.filter((a) => a.status !== 200 && a.status !== 201)) expect(answer.body).not.toMatch(stackTracePattern);
    // Every request that started while the database was down was refused, and some were.
    const duringOutage = all.filter((answer) => answer.startedIn === "down");
    expect(duringOutage.length).toBeGreaterThan(0);
    expect(duringOutage.filter((answer) => answer.status !== 503)).toEqual([]);
  });

  it("keeps every acknowledged attempt exactly once and complete, and stores each retried one exactly once", async () => {
    const acknowledged = run.submissions.filter(isAcknowledged);
    expect(acknowledged.length).toBeGreaterThan(0);
    const stored = await db.select().from(labAttempts).where(inArray(labAttempts.userId, learners.map((l) => l.id)));
    const storedIds = stored.map((row) => row.id);
    for (const submission of acknowledged) expect(storedIds.filter((id) => id === submission.attemptId)).toHaveLength(1);

    const unacknowledged = run.submissions.filter((s) => !isAcknowledged(s));
    const retried = await Promise.all(unacknowledged.map(resubmit));
    expect(retried.map((r) => r.exchange.status).filter((status) => status !== 200 && status !== 201)).toEqual([]);

    const count = (status: number) => retried.filter((r) => r.exchange.status === status).length;
    console.log(
      `${run.pageLoads.length} page loads, ${run.pageLoads.filter((p) => p.status === 500).length} cut short by the stop; ` +
        `${run.submissions.length} submissions, ${acknowledged.length} acknowledged; of ${retried.length} retried, ` +
        `${count(200)} had been stored already (replayed) and ${count(201)} were stored now.`,
    );

    const after = await db.select().from(labAttempts).where(inArray(labAttempts.userId, learners.map((l) => l.id)));
    const keys = after.map((row) => row.idempotencyKey);
    for (const submission of run.submissions) expect(keys.filter((key) => key === submission.key)).toHaveLength(1);
    // Every row is whole: graded, numbered, and the numbers of each learner run 1…n with no gap.
    for (const row of after) {
      expect(row.outcome).not.toBeNull();
      expect(typeof row.score).toBe("number");
      expect(typeof row.passed).toBe("boolean");
      expect(row.choices).toEqual(choices);
    }
    for (const learner of learners) {
      const numbers = after.filter((row) => row.userId === learner.id).map((row) => row.attemptNumber).sort((a, b) => a - b);
      expect(numbers).toEqual(numbers.map((_, index) => index + 1));
    }
  });
});
