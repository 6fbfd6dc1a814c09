/**
 * Rate limits against the real database: every limited route handler answers 429 with Retry-After
 * and a message in the app's error format once its limit is spent, per person and per address;
 * the counts hold across two processes with their own connection pools, also when both spend at
 * once. The handlers are called with the peer-address stamp the server writes (lib/client-address).
 */
import { spawn } from "node:child_process";
import { randomUUID } from "node:crypto";
import { once } from "node:events";
import type { NextRequest } from "next/server";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as submitAttempt } from "@/app/api/labs/[labSlug]/attempts/route";
import { POST as saveDraft } from "@/app/api/labs/[labSlug]/draft/route";
import { POST as upload } from "@/app/api/uploadthing/route";
import { db } from "@/db/client";
import { markLessonsCompleted } from "@/db/queries/progress";
import { cohortMemberships, rateLimits } from "@/db/schema";
import { getCourse, getLessonOfLab } from "@/lessons";
import { createSession } from "@/lib/auth/session-store";
import { compileTrustedProxies, resolveClientAddress } from "@/lib/client-address/client-address";
import { ruleOf, type LimitedAction, type LimitSubject } from "@/lib/rate-limit/limits";
import { spendRateLimits } from "@/lib/rate-limit/rate-limiter";
import { createPerson, findDemoCohortId, fromAddress, uniqueAddress } from "./support/people";

const LAB = "lone-lead-termination";

/** The other process, connected and waiting; `go` makes it spend and resolves to how many it was allowed. */
async function spenderInAnotherProcess(action: LimitedAction, per: LimitSubject, key: string, count: number) {
  const child = spawn(process.execPath, ["node_modules/tsx/dist/cli.mjs", "--conditions=react-server", "tests/integration/support/spend-in-another-process.ts", action, per, key, String(count)], {
    env: process.env,
    stdio: ["pipe", "pipe", "inherit"],
  });
  let output = "";
  child.stdout.setEncoding("utf8").on("data", (chunk: string) => (output += chunk));
  const exited = once(child, "exit");
  while (!output.includes("ready\n")) {
    if (child.exitCode !== null) throw new Error(`the other process ended: ${output}`);
    await once(child.stdout, "data");
  }
  return {
    go: async () => {
      child.stdin.write("go\n");
      const [code] = (await exited) as [number | null];
      if (code !== 0) throw new Error(`the other process failed (${code}): ${output}`);
      return (JSON.parse(output.split("\n").filter(Boolean).at(-1)!) as { allowed: number }).allowed;
    },
  };
}

async function learner(): Promise<{ id: string; cookie: string }> {
  const person = await createPerson({ role: "learner", password: "limits on the bench", label: "limited" });
  await db.insert(cohortMemberships).values({ cohortId: await findDemoCohortId(), userId: person.id, role: "learner" });
  const number = getLessonOfLab(LAB)!.number;
  const earlier = getCourse().lessons.filter((lesson) => lesson.number < number);
  await markLessonsCompleted({ userId: person.id, completions: earlier.map((lesson) => ({ lessonSlug: lesson.slug, completedAt: new Date() })) });
  const cookie = await createSession(person.id);
  return { id: person.id, cookie: `${cookie.name}=${cookie.value}` };
}

/** A submission whose body is never read when the limit refuses it; otherwise refused for its body (422). */
const grade = (who: { cookie: string }, address: string) =>
  submitAttempt(
    new Request(`http://app.test/api/labs/${LAB}/attempts`, {
      method: "POST",
      headers: fromAddress(address, { cookie: who.cookie, "content-type": "application/json" }),
      body: JSON.stringify({ choices: {}, idempotencyKey: "not a key" }),
    }),
    { params: Promise.resolve({ labSlug: LAB }) },
  );

/** A workbench save whose body is no draft: refused for it (422) once the limits let it through. */
const save = (who: { cookie: string }, address: string) =>
  saveDraft(
    new Request(`http://app.test/api/labs/${LAB}/draft`, {
      method: "POST",
      headers: fromAddress(address, { cookie: who.cookie, "content-type": "application/json" }),
      body: "[]",
    }),
    { params: Promise.resolve({ labSlug: LAB }) },
  );

/** The browser's upload request; an empty body is refused (400) once the limit lets it through. */
const askToUpload = (who: { cookie: string } | null, address: string) =>
  upload(
    new Request("http://app.test/api/uploadthing?slug=benchPhoto&actionType=upload", {
      method: "POST",
      headers: fromAddress(address, { "content-type": "application/json", ...(who ? { cookie: who.cookie } : {}) }),
      body: "",
    }) as NextRequest,
  );

/**
 * Fills the count of a client address to its limit directly, where spending it request by request
 * would only take time; under the key the server counts that address by (an IPv6 address's /64).
 */
async function spendAll(action: LimitedAction, address: string) {
  const rule = ruleOf(action, "address");
  const counted = resolveClientAddress({ peer: address, forwardedFor: null, trusted: compileTrustedProxies([]) });
  await db.insert(rateLimits).values({ key: `${action}:address:${counted}`, points: rule.points, expire: Date.now() + rule.windowSeconds * 1000 });
}

/** `uploadRoute`: the upload route repeats the sentence at the top level, where the upload library's client reads it. */
async function expectRefusal(response: Response, windowSeconds: number, message: RegExp, uploadRoute = false) {
  expect(response.status).toBe(429);
  const retryAfter = Number(response.headers.get("retry-after"));
  expect(retryAfter).toBeGreaterThan(windowSeconds - 30);
  expect(retryAfter).toBeLessThanOrEqual(windowSeconds);
  const error = { code: "rate-limited", message: expect.stringMatching(message) };
  expect(await response.json()).toEqual(uploadRoute ? { error, message: expect.stringMatching(message) } : { error });
}

let classroom: string;
beforeAll(() => {
  classroom = uniqueAddress();
});

describe("grading", () => {
  const perPerson = ruleOf("grading", "person");

  it(`answers 429 with Retry-After after ${perPerson.points} submissions a ${perPerson.windowSeconds} s, per learner and before reading the body`, async () => {
    const hasty = await learner();
    for (let i = 0; i < perPerson.points; i += 1) expect((await grade(hasty, classroom)).status, `submission ${i + 1}`).toBe(422);
    await expectRefusal(await grade(hasty, classroom), perPerson.windowSeconds, /^That is a lot of submissions in a short time\. Wait (\d+ seconds|1 minute), then submit again\.$/);
    // Per learner: another address does not help, and the classmate at the same address goes on.
    expect((await grade(hasty, uniqueAddress())).status).toBe(429);
    expect((await grade(await learner(), classroom)).status).toBe(422);
  });

  it("answers 429 to every learner at an address once the address's limit is spent, and only there", async () => {
    const crowded = uniqueAddress();
    await spendAll("grading", crowded);
    const someone = await learner();
    await expectRefusal(await grade(someone, crowded), ruleOf("grading", "address").windowSeconds, /^That is a lot of submissions/);
    expect((await grade(someone, uniqueAddress())).status).toBe(422);
  });
});

describe("workbench saves", () => {
  const perPerson = ruleOf("workbench-save", "person");

  it(`answers 429 with Retry-After after ${perPerson.points} saves a ${perPerson.windowSeconds} s, per learner`, async () => {
    const dragging = await learner();
    for (let i = 0; i < perPerson.points; i += 1) expect((await save(dragging, classroom)).status, `save ${i + 1}`).toBe(422);
    await expectRefusal(await save(dragging, classroom), perPerson.windowSeconds, /^Your choices are changing faster than they can be saved\. Wait (\d+ seconds|1 minute); they are kept in this browser until then\.$/);
    expect((await save(await learner(), classroom)).status).toBe(422);
  });
});

describe("bench photo uploads", () => {
  const perPerson = ruleOf("upload", "person");

  it(`answers 429 with Retry-After after ${perPerson.points} upload requests, per user`, async () => {
    const uploader = await learner();
    for (let i = 0; i < perPerson.points; i += 1) expect((await askToUpload(uploader, classroom)).status, `request ${i + 1}`).toBe(400);
    await expectRefusal(await askToUpload(uploader, classroom), perPerson.windowSeconds, /^That is a lot of uploads in a short time\. Wait \d+ minutes?, then try again\.$/, true);
    expect((await askToUpload(uploader, uniqueAddress())).status).toBe(429);
    expect((await askToUpload(await learner(), classroom)).status).toBe(400);
  });

  it("answers 429 per address, signed in or not, and never counts the service's signed callbacks", async () => {
    const crowded = uniqueAddress();
    await spendAll("upload", crowded);
    await expectRefusal(await askToUpload(null, crowded), ruleOf("upload", "address").windowSeconds, /^That is a lot of uploads/, true);
    const callback = await upload(
      new Request("http://app.test/api/uploadthing?slug=benchPhoto", {
        method: "POST",
        headers: fromAddress(crowded, { "content-type": "application/json", "uploadthing-hook": "callback", "x-uploadthing-signature": "hmac-sha256=00" }),
        body: "{}",
      }) as NextRequest,
    );
    expect(callback.status).not.toBe(429);
  });
});

describe("counts shared by every app server on the database", () => {
  const perPerson = ruleOf("grading", "person");

  it(`allows ${perPerson.points} in all when two processes spend ${perPerson.points - 10} each at the same moment`, async () => {
    const key = randomUUID();
    const each = perPerson.points - 10;
    const other = await spenderInAnotherProcess("grading", "person", key, each);
    const [allowedThere, here] = await Promise.all([other.go(), Promise.all(Array.from({ length: each }, () => spendRateLimits("grading", { person: key })))]);
    const allowedHere = here.filter((decision) => decision.allowed).length;
    expect(allowedThere).toBeGreaterThan(0);
    expect(allowedThere + allowedHere).toBe(perPerson.points);
  });
});
