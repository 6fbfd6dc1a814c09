/**
 * Hostile input against every route handler under app/api, called directly with a Request that
 * carries a real session cookie: random and malformed bodies (wrong types, huge strings, deep
 * nesting, prototype-pollution keys, invalid JSON, wrong content types), every malformed kind of
 * body sent with a length and chunked, bodies over their limit or that never end, and hostile route
 * parameters, and Cookie headers whose session value is mangled. Never a 500, never a stack trace,
 * a 4xx with a readable message, and no row written.
 */
import { readdirSync } from "node:fs";
import path from "node:path";
import { count, eq, inArray } from "drizzle-orm";
import fc from "fast-check";
import type { NextRequest } from "next/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { markLessonsCompleted } from "@/db/queries/progress";
import { benchPhotos, benchSubmissions, cohortMemberships, labAttempts, labDrafts, rateLimits } from "@/db/schema";
import { getCourse, getLessonOfLab } from "@/lessons";
import { createSession } from "@/lib/auth/session-store";
import { openBenchDraft } from "@/lib/bench/submissions";
import { bodyLimits, type BodyLimit } from "@/lib/http/body-limits";
import { errorReplyLimits } from "@/lib/http/errors";
import { expectNoInternals, hostileBodies, hostileText, hugeString, pollutingKey } from "../support/hostile-input";
import { startBenchUploadService, type BenchUploadService } from "./support/bench-upload-service";
import { createBenchSchool } from "./support/bench-people";
import { createPerson, findDemoCohortId } from "./support/people";

const LAB = "lone-lead-termination";
const apiDir = path.resolve("app/api");
const runs = Number(process.env.HOSTILE_RUNS ?? 150);

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Every route.ts under app/api, as the path of its folder ("labs/[labSlug]/attempts"). */
function discoverRoutes(dir = apiDir): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return discoverRoutes(full);
    return entry.name === "route.ts" ? [path.relative(apiDir, dir).split(path.sep).join("/")] : [];
  });
}

/** What the test sends each route: who asks, and the route parameters it fuzzes. */
const routeTable: Record<string, { who: "learner" | "instructor" | "anonymous"; params: string[]; bodies?: "attempt" | "draft" | "upload" }> = {
  "bench-photos/[photoId]": { who: "learner", params: ["photoId"] },
  "certificates/[certificateId]/pdf": { who: "learner", params: ["certificateId"] },
  "certificates/verify/[code]": { who: "anonymous", params: ["code"] },
  "cohorts/[cohortId]/gradebook.csv": { who: "instructor", params: ["cohortId"] },
  health: { who: "anonymous", params: [] },
  "labs/[labSlug]/attempts": { who: "learner", params: ["labSlug"], bodies: "attempt" },
  "labs/[labSlug]/attempts/[attemptId]": { who: "learner", params: ["labSlug", "attemptId"] },
  "labs/[labSlug]/draft": { who: "learner", params: ["labSlug"], bodies: "draft" },
  uploadthing: { who: "learner", params: [], bodies: "upload" },
};

const cookies: Record<"learner" | "instructor", string> = { learner: "", instructor: "" };
let learnerId = "";
let submissionId = "";
let uploadCookie = "";
let uploaderId = "";
let uploads: BenchUploadService;

async function cookieFor(userId: string): Promise<string> {
  const cookie = await createSession(userId);
  return `${cookie.name}=${cookie.value}`;
}

async function loadRoute(route: string): Promise<Record<string, Handler>> {
  return (await import(/* @vite-ignore */ path.join(apiDir, route, "route.ts"))) as Record<string, Handler>;
}

/** Rows the two people under attack own; other tests may write elsewhere meanwhile. */
async function rowsWritten(): Promise<number[]> {
  const tallies = await Promise.all([
    db.select({ n: count() }).from(labAttempts).where(eq(labAttempts.userId, learnerId)),
    db.select({ n: count() }).from(labDrafts).where(eq(labDrafts.userId, learnerId)),
    db.select({ n: count() }).from(benchSubmissions).where(eq(benchSubmissions.learnerId, uploaderId)),
    db.select({ n: count() }).from(benchPhotos).where(eq(benchPhotos.submissionId, submissionId)),
  ]);
  return tallies.map(([row]) => row!.n);
}

/**
 * Every case starts with nothing counted against the people under attack (and the unstamped
 * address all in-process requests share), so each reaches the checks it is about rather than the
 * rate limit, which has tests of its own.
 */
async function forgetRateLimits(): Promise<void> {
  const keys = [
    `grading:person:${learnerId}`,
    "grading:address:unverified",
    `workbench-save:person:${learnerId}`,
    "workbench-save:address:unverified",
    `upload:person:${uploaderId}`,
    "upload:address:unverified",
  ];
  await db.delete(rateLimits).where(inArray(rateLimits.key, keys));
}

/** A refusal: 4xx, JSON, a plain sentence, nothing internal. */
async function expectClearRefusal(response: Response, input: string, options: { message: boolean } = { message: true }): Promise<void> {
  const text = await response.text();
  expect(response.status, `${input} → ${response.status} ${text.slice(0, 300)}`).toBeGreaterThanOrEqual(400);
  expect(response.status, `${input} → ${response.status} ${text.slice(0, 300)}`).toBeLessThan(500);
  expectNoInternals(text);
  if (!options.message) return;
  let body: { error?: { message?: unknown }; message?: unknown } = {};
  try {
    body = JSON.parse(text) as typeof body;
  } catch {
    expect.fail(`${input} → ${response.status} with a body that is not JSON: ${JSON.stringify(text.slice(0, 200))}`);
  }
  const message = body.error?.message ?? body.message;
  expect(typeof message === "string" && message.length > 3, `${input}: no message in ${text.slice(0, 200)}`).toBe(true);
}

// Hostile JSON values: anything JSON can hold, objects keyed by the prototype's own names, deep
// nesting, and very long strings.
// Deep nesting stays text: the test's own JSON.stringify would overflow on it before the route did.
const nestedText = (maxDepth: number) => fc.integer({ min: 500, max: maxDepth }).map((depth) => "[".repeat(depth) + "]".repeat(depth));
const deeplyNested = nestedText(50_000);
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.jsonValue(),
  fc.dictionary(pollutingKey, fc.jsonValue()),
  hugeString,
  fc.constantFrom(null, true, 0, -1, 1e308, -0, "", [], {}),
);

// Values that can never be a resistance in ohms or a set of typed answers, so a body built around
// a valid part stays invalid: a random number could be a fine resistor, and {} fine answers.
const notAResistance = fc.oneof(
  hostileValue.filter((value) => typeof value !== "number"),
  fc.constantFrom(-1, -47, 1e308),
);
const notAnswers = hostileValue.filter(
  (value) =>
    value === null ||
    typeof value !== "object" ||
    Array.isArray(value) ||
    Object.values(value).some((answer) => typeof answer !== "string" || answer.length > 200),
);

// Bodies shaped like a submission with one part wrong, so the checks behind the first one are reached too.
const attemptBody: fc.Arbitrary<unknown> = fc.oneof(
  hostileValue,
  fc.record({ choices: hostileValue, idempotencyKey: fc.oneof(fc.uuid(), hostileValue) }),
  fc.record({ choices: fc.dictionary(fc.oneof(fc.string(), pollutingKey), hostileValue), idempotencyKey: fc.uuid() }),
  fc.record({ choices: fc.record({ main: fc.record({ seriesResistance: notAResistance }) }), idempotencyKey: fc.uuid() }),
  fc.record({ choices: fc.record({ main: fc.record({ seriesResistance: fc.constant(150) }) }), idempotencyKey: fc.uuid(), answers: notAnswers }),
  fc.record({ choices: fc.constant({ main: { seriesResistance: 150 } }), idempotencyKey: fc.uuid(), [`extra`]: hostileValue }),
);

/** JSON text: a hostile value, or a submission whose choices are nested thousands of levels deep. */
const attemptText = fc.oneof(
  attemptBody.map((value) => JSON.stringify(value) ?? "null"),
  deeplyNested,
  fc.tuple(deeplyNested, fc.uuid()).map(([deep, key]) => `{"choices":{"main":${deep}},"idempotencyKey":"${key}"}`),
);

const notJson = fc.oneof(
  fc.string().filter((text) => {
    try {
      JSON.parse(text);
      return false;
    } catch {
      return true;
    }
  }),
  fc.constantFrom("{", '{"choices":', "[1,2", "\u0000", "{'single':'quotes'}", "NaN", '{"a":1}garbage', "\uFEFF{}"),
);

const contentType = fc.constantFrom("application/json", "text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x", undefined);

function bodyRequest(url: string, body: string, type: string | undefined, cookie: string, headers: Record<string, string> = {}): Request {
  return new Request(url, { method: "POST", body, headers: { ...(type ? { "content-type": type } : {}), cookie, ...headers } });
}

// A session cookie as a browser extension, a proxy or an attacker might mangle it.
const hostileCookie = fc.oneof(
  fc.constantFrom("%", "%E0%A4%A", "%zz", "%00", "", "=", "a=b=c", "x".repeat(8_000), "' or '1'='1", '"quoted"', "\\u0000"),
  fc.string({ maxLength: 200 }).map(encodeURIComponent),
  fc.string({ maxLength: 200 }).filter((value) => !/[;\r\n\0]/.test(value)),
).map((value) => `edgewise_session=${value}`);

beforeAll(async () => {
  const learner = await createPerson({ role: "learner", password: "hostile bodies", label: "hostile" });
  learnerId = learner.id;
  await db.insert(cohortMemberships).values({ cohortId: await findDemoCohortId(), userId: learner.id, role: "learner" });
  const number = getLessonOfLab(LAB)!.number;
  const earlier = getCourse().lessons.filter((lesson) => lesson.number < number);
  await markLessonsCompleted({ userId: learner.id, completions: earlier.map((lesson) => ({ lessonSlug: lesson.slug, completedAt: new Date() })) });
  cookies.learner = await cookieFor(learner.id);
  const instructor = await createPerson({ role: "instructor", password: "hostile bodies", label: "hostile" });
  await db.insert(cohortMemberships).values({ cohortId: await findDemoCohortId(), userId: instructor.id, role: "instructor" });
  cookies.instructor = await cookieFor(instructor.id);

  uploads = await startBenchUploadService();
  const school = await createBenchSchool();
  const uploader = await school.createMember(school.homeCohortId, "learner", "hostile-uploader");
  const draft = await openBenchDraft({ learner: uploader.user, exerciseSlug: "build-a-run" });
  if (draft.status !== "ready") throw new Error(`no bench draft: ${draft.status}`);
  submissionId = draft.submissionId;
  uploadCookie = uploader.cookie;
  uploaderId = uploader.user.id;
});

afterAll(async () => {
  await uploads?.stop();
});

describe("hostile input on every route handler", () => {
  it("covers every route file under app/api", () => {
    expect(discoverRoutes().sort()).toEqual(Object.keys(routeTable).sort());
  });

  it("refuses random, malformed and oversized submission bodies with a clear 4xx and stores nothing", async () => {
    const { POST } = await loadRoute("labs/[labSlug]/attempts");
    const context = () => ({ params: Promise.resolve({ labSlug: LAB }) });
    const url = `http://app.test/api/labs/${LAB}/attempts`;
    const before = await rowsWritten();
    await fc.assert(
      fc.asyncProperty(fc.oneof(attemptText, notJson), contentType, async (body, type) => {
        await forgetRateLimits();
        const response = await POST!(bodyRequest(url, body, type, cookies.learner), context());
        await expectClearRefusal(response, `${type} ${body.slice(0, 120)}`);
      }),
      { numRuns: runs },
    );
    expect(await rowsWritten()).toEqual(before);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it("refuses random and malformed workbench saves with a clear 4xx and stores nothing", async () => {
    const { POST } = await loadRoute("labs/[labSlug]/draft");
    const before = await rowsWritten();
    const draftBody = fc.oneof(
      hostileValue,
      fc.record({ choices: hostileValue, answers: fc.constant({}) }),
      fc.record({ choices: fc.record({ main: fc.record({ seriesResistance: notAResistance }) }), answers: fc.constant({}) }),
      fc.record({ choices: fc.constant({ main: { seriesResistance: 150 } }), answers: notAnswers }),
    );
    await fc.assert(
      fc.asyncProperty(fc.oneof(draftBody.map((value) => JSON.stringify(value) ?? "null"), deeplyNested, notJson), contentType, async (body, type) => {
        const response = await POST!(bodyRequest(draftUrl, body, type, cookies.learner), { params: Promise.resolve({ labSlug: LAB }) });
        await expectClearRefusal(response, `${type} ${body.slice(0, 120)}`);
      }),
      { numRuns: runs },
    );
    expect(await rowsWritten()).toEqual(before);
  });

  it("refuses random and malformed bodies on the upload route, as the browser and as a forged service callback", async () => {
    const { POST } = await loadRoute("uploadthing");
    const before = await rowsWritten();
    const keysBefore = uploads.storedKeys().length;
    // Our guard refuses empty, malformed and deeply nested bodies with a message; well-formed JSON of
    // the wrong shape is refused by the upload SDK itself, with a bare 400.
    const uploadBody = fc.oneof(
      hostileValue.map((value) => JSON.stringify(value) ?? "null"),
      nestedText(10_000),
      notJson,
      fc.record({ files: hostileValue, input: fc.oneof(hostileValue, fc.constant({ submissionId })) }).map((value) => JSON.stringify(value)),
    );
    await fc.assert(
      fc.asyncProperty(uploadBody, contentType, fc.boolean(), async (body, type, asCallback) => {
        await forgetRateLimits();
        // The service's callbacks name no action; the browser's upload request does.
        const url = `http://app.test/api/uploadthing?slug=benchPhoto${asCallback ? "" : "&actionType=upload"}`;
        const headers: Record<string, string> = asCallback ? { "uploadthing-hook": "callback", "x-uploadthing-signature": "hmac-sha256=00" } : {};
        const response = await POST!(bodyRequest(url, body, type, uploadCookie, headers) as NextRequest, { params: Promise.resolve({}) });
        await expectClearRefusal(response, `${asCallback ? "callback" : "upload"} ${type} ${body.slice(0, 120)}`, { message: false });
      }),
      { numRuns: runs },
    );
    expect(await rowsWritten()).toEqual(before);
    expect(uploads.storedKeys()).toHaveLength(keysBefore);
  });

  it("answers a mangled session cookie on every route handler as no session: never a 500", async () => {
    for (const [route, { params }] of Object.entries(routeTable)) {
      const handlers = await loadRoute(route);
      const routeParams = Object.fromEntries(params.map((name) => [name, name === "labSlug" ? LAB : "3f2b8c1e-9a4d-4e6b-8c7a-1d2e3f4a5b6c"]));
      await fc.assert(
        fc.asyncProperty(hostileCookie, fc.constantFrom(...(["GET", "POST"] as const).filter((method) => handlers[method])), async (cookie, method) => {
          const request = new Request(`http://app.test/api/${route}`, {
            method,
            headers: { cookie, "content-type": "application/json" },
            ...(method === "POST" ? { body: "{}" } : {}),
          });
          const response = await handlers[method]!(request, { params: Promise.resolve(routeParams) });
          const text = await response.text();
          expect(response.status, `${method} ${route} with ${cookie.slice(0, 80)} → ${text.slice(0, 200)}`).toBeLessThan(500);
          expectNoInternals(text);
        }),
        { numRuns: Math.ceil(runs / 5) },
      );
    }
  });

  it("answers hostile route parameters on every GET handler without a 500 or a stack trace", async () => {
    for (const [route, { who, params }] of Object.entries(routeTable)) {
      const { GET } = await loadRoute(route);
      if (!GET) continue;
      const cookie = who === "anonymous" ? "" : cookies[who];
      await fc.assert(
        fc.asyncProperty(fc.tuple(...params.map(() => hostileText)), fc.string({ maxLength: 40 }), async (values, query) => {
          const routeParams = Object.fromEntries(params.map((name, i) => [name, values[i]!]));
          const request = new Request(`http://app.test/api/${route}?q=${encodeURIComponent(query)}`, { headers: cookie ? { cookie } : {} });
          const response = await GET(request, { params: Promise.resolve(routeParams) });
          const text = await response.text();
          expect(response.status, `${route} ${JSON.stringify(routeParams).slice(0, 200)} → ${text.slice(0, 200)}`).toBeLessThan(500);
          expectNoInternals(text);
        }),
        { numRuns: params.length === 0 ? 3 : Math.ceil(runs / 3) },
      );
    }
  });
});

/** A body as it may arrive: all at once with its length declared, or in chunks of 16 kB without one. */
function sentAs(url: string, options: { body: Uint8Array<ArrayBuffer>; contentType: string | undefined; chunked: boolean; headers?: Record<string, string> }): Request {
  const { body, contentType, chunked } = options;
  const headers: Record<string, string> = { ...(contentType ? { "content-type": contentType } : {}), ...options.headers };
  if (!chunked) return new Request(url, { method: "POST", body, headers: { ...headers, "content-length": String(body.byteLength) } });
  let at = 0;
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (at >= body.byteLength) return controller.close();
      controller.enqueue(body.slice(at, (at += 16 * 1024)));
    },
  });
  return new Request(url, { method: "POST", body: stream, headers, duplex: "half" } as RequestInit);
}

/** A body that never ends (or never starts), and how much of it the handler took. */
function endlessBody(options: { stalls?: boolean } = {}): { stream: ReadableStream<Uint8Array>; taken: () => number } {
  let taken = 0;
  const stream = new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        if (options.stalls) return new Promise<void>(() => {});
        taken += 16 * 1024;
        controller.enqueue(new Uint8Array(16 * 1024).fill(0x5b));
      },
    },
    // Nothing is produced before a reader asks.
    { highWaterMark: 0 },
  );
  return { stream, taken: () => taken };
}

const attemptUrl = `http://app.test/api/labs/${LAB}/attempts`;
const draftUrl = `http://app.test/api/labs/${LAB}/draft`;
const uploadUrl = "http://app.test/api/uploadthing?slug=benchPhoto&actionType=upload";
const reportUrl = "http://app.test/api/uploadthing?slug=benchPhoto";
const reportHeaders = { "uploadthing-hook": "callback", "x-uploadthing-signature": "hmac-sha256=00" };

type BodyRoute = { name: string; route: string; url: string; limit: BodyLimit; cookie: () => string; headers?: Record<string, string> };
const bodyRoutes: BodyRoute[] = [
  { name: "a lab submission", route: "labs/[labSlug]/attempts", url: attemptUrl, limit: bodyLimits.labSubmission, cookie: () => cookies.learner },
  { name: "a saved workbench", route: "labs/[labSlug]/draft", url: draftUrl, limit: bodyLimits.labDraft, cookie: () => cookies.learner },
  { name: "a photo upload request", route: "uploadthing", url: uploadUrl, limit: bodyLimits.uploadRequest, cookie: () => uploadCookie },
  { name: "an upload service report", route: "uploadthing", url: reportUrl, limit: bodyLimits.uploadCallback, cookie: () => "", headers: reportHeaders },
];

async function post(route: BodyRoute, request: Request): Promise<Response> {
  const handlers = await loadRoute(route.route);
  await forgetRateLimits();
  return handlers.POST!(request, { params: Promise.resolve({ labSlug: LAB }) });
}

describe("malformed and oversized bodies on every route that reads one", () => {
  for (const route of bodyRoutes) {
    it(`${route.name}: every malformed kind, with a length and chunked, is a clear 4xx and writes nothing`, async () => {
      const before = await rowsWritten();
      const keysBefore = uploads.storedKeys().length;
      for (const { kind, contentType, body } of hostileBodies(route.limit.bytes)) {
        for (const chunked of [false, true]) {
          const request = sentAs(route.url, { body, contentType, chunked, headers: { cookie: route.cookie(), ...route.headers } });
          await expectClearRefusal(await post(route, request), `${route.name}, ${kind}${chunked ? ", chunked" : ""}`);
        }
      }
      expect(await rowsWritten()).toEqual(before);
      expect(uploads.storedKeys()).toHaveLength(keysBefore);
    });

    it(`${route.name}: a declared length over ${route.limit.bytes} bytes is refused with 413 before a byte is read`, async () => {
      const { stream, taken } = endlessBody();
      const request = new Request(route.url, {
        method: "POST",
        body: stream,
        duplex: "half",
        headers: { "content-type": "application/json", "content-length": String(50 * 1024 * 1024), cookie: route.cookie(), ...route.headers },
      } as RequestInit);
      const response = await post(route, request);
      expect(response.status).toBe(413);
      expect(((await response.json()) as { error: { message: string } }).error.message).toMatch(/may be at most \d+ KB/);
      expect(taken()).toBe(0);
    });

    it(`${route.name}: a chunked body that never ends is read only to its limit, then answered 413`, async () => {
      const { stream, taken } = endlessBody();
      const request = new Request(route.url, {
        method: "POST",
        body: stream,
        duplex: "half",
        headers: { "content-type": "application/json", cookie: route.cookie(), ...route.headers },
      } as RequestInit);
      const response = await post(route, request);
      expect(response.status).toBe(413);
      expect(((await response.json()) as { error: { code: string } }).error.code).toBe("payload-too-large");
      // The chunk that crossed the limit and the one the stream readied next, no more.
      expect(taken()).toBeLessThanOrEqual(route.limit.bytes + 2 * 16 * 1024);
    });
  }

  it("refuses an upload request before reading its body: 401 signed out, 403 for an instructor", async () => {
    const { POST } = await loadRoute("uploadthing");
    await forgetRateLimits();
    for (const [cookie, status] of [["", 401], [cookies.instructor, 403]] as const) {
      const { stream, taken } = endlessBody({ stalls: true });
      const request = new Request(uploadUrl, { method: "POST", body: stream, duplex: "half", headers: { "content-type": "application/json", cookie } } as RequestInit);
      const response = await POST!(request, { params: Promise.resolve({}) });
      expect(response.status).toBe(status);
      const body = (await response.json()) as { error: { message: string }; message: string };
      expect(body.message).toBe(body.error.message);
      expect(taken()).toBe(0);
    }
    const unsigned = endlessBody({ stalls: true });
    const report = new Request(reportUrl, { method: "POST", body: unsigned.stream, duplex: "half", headers: { "uploadthing-hook": "callback" } } as RequestInit);
    expect((await POST!(report, { params: Promise.resolve({}) })).status).toBe(401);
  });

  it("refuses a lab submission before reading its body when signed out", async () => {
    const { POST } = await loadRoute("labs/[labSlug]/attempts");
    await forgetRateLimits();
    const { stream, taken } = endlessBody({ stalls: true });
    const request = new Request(attemptUrl, { method: "POST", body: stream, duplex: "half", headers: { "content-type": "application/json" } } as RequestInit);
    expect((await POST!(request, { params: Promise.resolve({ labSlug: LAB }) })).status).toBe(401);
    expect(taken()).toBe(0);
  });

  it("answers a submission of thousands of unknown keys naming five of them, in a reply far smaller than the body", async () => {
    const { POST } = await loadRoute("labs/[labSlug]/attempts");
    await forgetRateLimits();
    // Each `"k000123":1,` takes 12 bytes: as many as fit under the limit beside the valid fields.
    const keys = Array.from({ length: Math.floor((bodyLimits.labSubmission.bytes - 200) / 12) }, (_, i) => `k${String(i).padStart(6, "0")}`);
    const json = JSON.stringify({ choices: { main: { seriesResistance: 150 } }, idempotencyKey: "3f2b8c1e-9a4d-4e6b-8c7a-1d2e3f4a5b6c", ...Object.fromEntries(keys.map((key) => [key, 1])) });
    expect(json.length).toBeLessThan(bodyLimits.labSubmission.bytes);
    const response = await POST!(bodyRequest(attemptUrl, json, "application/json", cookies.learner), { params: Promise.resolve({ labSlug: LAB }) });
    const reply = await response.text();
    expect(response.status).toBe(422);
    const { error } = JSON.parse(reply) as { error: { message: string; fieldErrors: Record<string, string[]>; moreFieldErrors: number } };
    expect(Object.keys(error.fieldErrors)).toHaveLength(errorReplyLimits.fields);
    expect(error.moreFieldErrors).toBe(keys.length - errorReplyLimits.fields);
    expect(error.message).toContain(`and ${keys.length - errorReplyLimits.fields} more fields`);
    expect(reply.length).toBeLessThan(1_000);
    expect(json.length).toBeGreaterThan(30 * reply.length);
  });
});
