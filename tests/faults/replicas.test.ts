/**
 * Two `next start` servers share one PostgreSQL behind a local load balancer (haproxy, round
 * robin), as replicas of a deployment do, and real traffic goes through the balancer or straight
 * to one server: a session made on one server works on the other and ends on both; rate limits
 * count requests to both against one counter, also when they arrive at once; with both servers'
 * invitation outbox timers racing, each e-mail goes out once; the same submission sent to both at
 * once is stored once; and when one server is killed under load the other serves on, every
 * acknowledged submission stored.
 */
import { randomUUID } from "node:crypto";
import { inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { insertEnrolments } from "@/db/queries/enrolment";
import { deferInvitationMail } from "@/db/queries/invitation-mail";
import { invitations, labAttempts } from "@/db/schema";
import { previewInvitation } from "@/lib/auth/invitations";
import { sessionCookieName } from "@/lib/auth/session-store";
import { invitationExpiry, issueToken } from "@/lib/enrolment/invitation-tokens";
import { listCaughtMessages } from "@/lib/mail/sink";
import { ruleOf } from "@/lib/rate-limit/limits";
import type { AppInstance } from "@/scripts/app-instance";
import { builtActionId } from "../e2e/support/app-surface";
import { callAction, type ActionReply } from "../e2e/support/server-actions";
import { tokenFromLink } from "../integration/support/mail-sink";
import { createPerson, findDemoAdmin, findDemoCohortId, findDemoSchoolId } from "../integration/support/people";
import { startFaultInstance } from "./support/instance";
import { readyLearnerAtLab, type FaultLearner } from "./support/learners";

const labSlug = "lone-lead-termination";
const choices = { main: { seriesResistance: 150 } };
const password = "two servers one database";
// Both servers look for due invitation e-mails every 50 ms, so their rounds overlap.
const outboxRetrySeconds = 0.05;
// More than one round takes (200), so the second server always finds some left to claim.
const outboxLetters = 300;

type Exchange = { path: string; status: number | "no answer"; server: string | null; retryAfter: string | null; body: string; startedAt: number; answeredAt: number };

let instance: AppInstance;
let cohortId: string;

beforeAll(async () => {
  // As in a deployment, the servers take the client's address from the balancer's X-Forwarded-For.
  const appEnv = { TRUSTED_PROXIES: "127.0.0.1", INVITATION_MAIL_RETRY_SECONDS: String(outboxRetrySeconds) };
  instance = await startFaultInstance({ servers: 2, appEnv });
  cohortId = await findDemoCohortId();
});

afterAll(async () => {
  await instance?.stop();
});

/** One request to `baseUrl`; `server` is the balancer's word on which server answered. */
async function exchange(baseUrl: string, path: string, init: RequestInit & { cookie?: string } = {}): Promise<Exchange> {
  const headers = new Headers(init.headers);
  if (init.cookie) headers.set("cookie", init.cookie);
  const startedAt = Date.now();
  try {
    const response = await fetch(`${baseUrl}${path}`, { ...init, headers, redirect: "manual", signal: AbortSignal.timeout(30_000) });
    const body = await response.text();
    const server = response.headers.get("x-app-server");
    return { path, status: response.status, server, retryAfter: response.headers.get("retry-after"), body, startedAt, answeredAt: Date.now() };
  } catch (error) {
    const cause = error instanceof Error && error.cause instanceof Error ? `: ${error.cause.message}` : "";
    return { path, status: "no answer", server: null, retryAfter: null, body: `${String(error)}${cause}`, startedAt, answeredAt: Date.now() };
  }
}

function signIn(baseUrl: string, email: string, secret: string): Promise<ActionReply> {
  const form = new FormData();
  form.set("email", email);
  form.set("password", secret);
  return callAction({ baseUrl, path: "/sign-in", actionId: builtActionId("app/(auth)/sign-in/actions.ts#signIn"), args: [{ status: "idle" }, form] });
}

/** The session the answer opened, as `name=value`; undefined when it opened none. */
function sessionCookieOf(reply: ActionReply): string | undefined {
  return reply.cookies.find((cookie) => cookie.startsWith(`${sessionCookieName}=`) && cookie.length > sessionCookieName.length + 1);
}

function submit(baseUrl: string, learner: FaultLearner, key: string): Promise<Exchange> {
  return exchange(baseUrl, `/api/labs/${labSlug}/attempts`, {
    method: "POST",
    cookie: learner.cookie,
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ choices, idempotencyKey: key }),
  });
}

const isSuccess = (answer: Exchange) => typeof answer.status === "number" && answer.status >= 200 && answer.status < 300;
const attemptIdOf = (answer: Exchange) => (JSON.parse(answer.body) as { attempt: { id: string } }).attempt.id;

async function attemptsOf(learners: FaultLearner[]) {
  return db.select().from(labAttempts).where(inArray(labAttempts.userId, learners.map((learner) => learner.id)));
}

/** Each learner's attempts are numbered 1…n with no gap and no repeat. */
function expectGaplessNumbers(rows: { userId: string; attemptNumber: number }[], learners: FaultLearner[]): void {
  for (const learner of learners) {
    const numbers = rows.filter((row) => row.userId === learner.id).map((row) => row.attemptNumber).sort((a, b) => a - b);
    expect(numbers).toEqual(numbers.map((_, index) => index + 1));
  }
}

describe("two app servers on one database behind a load balancer", () => {
  it("shares sessions: one made on one server works on the other and through the balancer, and signing out on one ends it on both", async () => {
    const [one, two] = instance.servers;
    const person = await createPerson({ role: "learner", password, label: "replicas" });
    const signedIn = await signIn(one!.url, person.email, password);
    expect(signedIn.redirect).toBe("/learn");
    const cookie = sessionCookieOf(signedIn)!;
    expect(cookie).toBeDefined();

    const onTheOther = await exchange(two!.url, "/learn", { cookie });
    expect(onTheOther.status).toBe(200);
    expect(onTheOther.body).toContain(person.name);

    const throughBalancer = [];
    for (let i = 0; i < 4; i++) throughBalancer.push(await exchange(instance.baseUrl, "/learn", { cookie }));
    expect(throughBalancer.map((answer) => answer.status)).toEqual([200, 200, 200, 200]);
    expect(new Set(throughBalancer.map((answer) => answer.server))).toEqual(new Set(["app-1", "app-2"]));

    const signedOut = await callAction({ baseUrl: two!.url, path: "/sign-out", actionId: builtActionId("app/(auth)/sign-out/actions.ts#signOut"), args: [], cookie });
    expect(signedOut.redirect).toBe("/sign-in?notice=signed-out");
    const afterSignOut = await exchange(one!.url, "/learn", { cookie });
    expect(afterSignOut.status).toBe(307);
    expect(afterSignOut.body).not.toContain(person.name);
  });

  it("checks no more wrong passwords than the account's limit when they arrive at both servers at once", async () => {
    const limit = ruleOf("sign-in-failure", "person").points;
    const person = await createPerson({ role: "learner", password, label: "replicas-throttle" });
    const replies = await Promise.all(Array.from({ length: 30 }, (_, i) => signIn(instance.baseUrl, person.email, `not the password ${i}`)));
    const messages = replies.map((reply) => (reply.result as { message?: string } | undefined)?.message ?? "");
    expect(new Set(replies.map((reply) => reply.headers.get("x-app-server")))).toEqual(new Set(["app-1", "app-2"]));
    expect(messages.filter((message) => /do not match an account/.test(message))).toHaveLength(limit);
    expect(messages.filter((message) => /^Too many attempts/.test(message))).toHaveLength(30 - limit);

    for (const server of instance.servers) {
      const reply = await signIn(server.url, person.email, password);
      expect({ server: server.part, result: reply.result }).toMatchObject({ server: server.part, result: { status: "error", message: expect.stringMatching(/^Too many attempts/) } });
      expect(sessionCookieOf(reply)).toBeUndefined();
    }
  });

  it("grades no more of a learner's submissions than the limit when they arrive at both servers at once, and refuses the rest on both", async () => {
    const limit = ruleOf("grading", "person").points;
    const learner = await readyLearnerAtLab({ cohortId, labSlug, label: "replicas-limit" });
    const answers = await Promise.all(Array.from({ length: limit + 10 }, () => submit(instance.baseUrl, learner, randomUUID())));
    const graded = answers.filter(isSuccess);
    expect(graded).toHaveLength(limit);
    expect(new Set(graded.map((answer) => answer.server))).toEqual(new Set(["app-1", "app-2"]));
    const refused = answers.filter((answer) => !isSuccess(answer));
    expect(refused.map((answer) => answer.status)).toEqual(Array(10).fill(429));
    expect(refused.every((answer) => Number(answer.retryAfter) > 0 && JSON.parse(answer.body).error.code === "rate-limited")).toBe(true);

    for (const server of instance.servers) expect((await submit(server.url, learner, randomUUID())).status).toBe(429);
    expect(await attemptsOf([learner])).toHaveLength(limit);
  });

  it("sends each waiting invitation e-mail once while both servers' outbox timers race for it", async () => {
    // Enrolments whose first e-mail failed (a mail server that was down), all due again now.
    const run = randomUUID().slice(0, 8);
    const people = Array.from({ length: outboxLetters }, (_, i) => ({ name: `Outbox learner ${i}`, email: `outbox-${i}.${run}@faults.example`, ...issueToken() }));
    const admin = await findDemoAdmin();
    const { invitationIds } = await insertEnrolments({ schoolId: await findDemoSchoolId(), cohortId, invitedById: admin.id, expiresAt: invitationExpiry(new Date()), people });
    const ids = [...invitationIds.values()];
    await deferInvitationMail({ invitationIds: ids, now: new Date(), baseDelayMs: 0, maxDelayMs: 0 });

    await expect
      .poll(async () => (await db.select({ pending: invitations.mailPendingSince }).from(invitations).where(inArray(invitations.id, ids))).filter((row) => row.pending).length, {
        timeout: 90_000,
        interval: 250,
      })
      .toBe(0);
    // A few more rounds of both timers add nothing.
    await new Promise((resolve) => setTimeout(resolve, 20 * outboxRetrySeconds * 1_000));

    const caught = await listCaughtMessages();
    const sentTo = (email: string) => caught.filter((message) => message.to.includes(email));
    expect(people.map((person) => ({ email: person.email, sent: sentTo(person.email).length })).filter((letter) => letter.sent !== 1)).toEqual([]);
    // The one e-mail carries the link that works: no later round replaced it with another.
    const states = await Promise.all(people.map(async (person) => (await previewInvitation({ token: tokenFromLink(sentTo(person.email)[0]!, "/invitations/") })).state));
    expect(states.filter((state) => state !== "usable")).toEqual([]);
  });

  it("stores a submission sent to both servers at once under one key once, and answers both with it", async () => {
    const learner = await readyLearnerAtLab({ cohortId, labSlug, label: "replicas-key" });
    const [one, two] = instance.servers;
    const keys = Array.from({ length: 12 }, () => randomUUID());
    const pairs = await Promise.all(keys.map((key) => Promise.all([submit(one!.url, learner, key), submit(two!.url, learner, key)])));

    for (const pair of pairs) {
      expect(pair.map((answer) => answer.status).sort()).toEqual([200, 201]);
      expect(attemptIdOf(pair[0]!)).toBe(attemptIdOf(pair[1]!));
    }
    const rows = await attemptsOf([learner]);
    expect(rows.map((row) => row.idempotencyKey).sort()).toEqual([...keys].sort());
    expect(new Set(rows.map((row) => row.id))).toEqual(new Set(pairs.map((pair) => attemptIdOf(pair[0]!))));
    expectGaplessNumbers(rows, [learner]);
  });

  it("serves on when one server is killed under load, keeping every acknowledged submission, and shares the load again once it is back", async () => {
    const learners = await Promise.all(Array.from({ length: 12 }, () => readyLearnerAtLab({ cohortId, labSlug, label: "replicas-kill" })));
    const submissions: { learner: FaultLearner; key: string; answer: Exchange }[] = [];
    const pages: Exchange[] = [];
    let stopped = false;
    const learnerLoop = async (learner: FaultLearner) => {
      while (!stopped) {
        const started = Date.now();
        const key = randomUUID();
        submissions.push({ learner, key, answer: await submit(instance.baseUrl, learner, key) });
        pages.push(await exchange(instance.baseUrl, `/labs/${labSlug}`, { cookie: learner.cookie }));
        // One submission a second at most, well within the grading limit a learner has.
        await new Promise((resolve) => setTimeout(resolve, Math.max(0, 1_000 - (Date.now() - started))));
      }
    };
    const traffic = Promise.all(learners.map(learnerLoop));
    // Until both servers have answered both kinds of request a few times (a fresh server loads each route's code on first use).
    const answeredBy = (server: string) => [...submissions.map((s) => s.answer), ...pages].filter((answer) => answer.server === server && isSuccess(answer));
    await expect.poll(() => Math.min(answeredBy("app-1").length, answeredBy("app-2").length), { timeout: 60_000, interval: 100 }).toBeGreaterThanOrEqual(6);
    const killSent = Date.now();
    await instance.killPart("app-1");
    // The moment its process is known to have exited: a request sent between the signal and then
    // may still have gone to it.
    const killedAt = Date.now();
    await new Promise((resolve) => setTimeout(resolve, 6_000));
    stopped = true;
    await traffic;

    const all = [...submissions.map((s) => s.answer), ...pages];
    const before = all.filter((answer) => answer.answeredAt < killSent);
    const failed = all.filter((answer) => !isSuccess(answer));
    console.log(
      `${all.length} requests through the balancer (${before.length} before the kill); ${failed.length} failed: ` +
        `${JSON.stringify(failed.map((answer) => ({ status: answer.status, path: answer.path, startedMsBeforeKill: killedAt - answer.startedAt, answeredMsAfterKill: answer.answeredAt - killedAt })))}`,
    );
    expect(new Set(before.map((answer) => answer.server))).toEqual(new Set(["app-1", "app-2"]));
    // Only requests already inside the killed server fail: the balancer answers 502, or closes the
    // connection without an answer when the request went over a kept-alive connection to the
    // server (as a server closing an idle connection would, which clients may resend on), or the
    // page was cut off mid-stream. The balancer sends everything after to the other server.
    for (const answer of failed) {
      expect([502, "no answer"]).toContain(answer.status);
      expect(answer.startedAt).toBeLessThanOrEqual(killedAt);
    }
    const after = all.filter((answer) => answer.startedAt > killedAt);
    expect(after.length).toBeGreaterThan(30);
    expect(after.filter((answer) => !isSuccess(answer) || answer.server !== "app-2")).toEqual([]);

    const acknowledged = submissions.filter((s) => isSuccess(s.answer));
    const stored = await attemptsOf(learners);
    for (const submission of acknowledged) expect(stored.filter((row) => row.id === attemptIdOf(submission.answer))).toHaveLength(1);
    // What was cut off may or may not have been stored; sent again with its key it is stored once.
    const retried = await Promise.all(submissions.filter((s) => !isSuccess(s.answer)).map((s) => submit(instance.baseUrl, s.learner, s.key)));
    expect(retried.filter((answer) => !isSuccess(answer))).toEqual([]);
    const afterRetry = await attemptsOf(learners);
    expect(afterRetry.map((row) => row.idempotencyKey).sort()).toEqual(submissions.map((s) => s.key).sort());
    expectGaplessNumbers(afterRetry, learners);

    await instance.startPart("app-1");
    const deadline = Date.now() + 30_000;
    const served = new Set<string | null>();
    while (!served.has("app-1") && Date.now() < deadline) {
      const answer = await exchange(instance.baseUrl, "/api/health");
      if (answer.status === 200) served.add(answer.server);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    expect(served.has("app-1")).toBe(true);
  });
});
