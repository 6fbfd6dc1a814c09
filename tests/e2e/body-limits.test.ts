/**
 * Request bodies against the built app over plain sockets: every kind of route that reads a body
 * (a form's server action, the roster import's larger form, the grading route, the upload route as
 * the browser and as the upload service) answers a body over its limit with 413 and a sentence in
 * the app's JSON error format, whether the length was declared or the body came chunked; a request
 * that needs a session is refused before its body arrives; nothing is written.
 */
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { bodyLimits, formatByteSize, type BodyLimit } from "@/lib/http/body-limits";
import { expectNoInternals } from "../support/hostile-input";
import { actionForms, planActionCall } from "./support/action-forms";
import { gradedLab, setUpAccessWorld, type AccessWorld } from "./support/access-world";
import { builtActionId } from "./support/app-surface";
import { changedTables, readDatabaseState } from "./support/database-state";
import { rawPost, type RawReply } from "./support/raw-post";
import { callAction } from "./support/server-actions";

let world: AccessWorld;
setUpAccessWorld((built) => (world = built));

const signInAction = "app/(auth)/sign-in/actions.ts#signIn";
const rosterAction = "app/(admin)/admin/cohorts/[cohortId]/import/actions.ts#rosterImportAction";

type BodyRoute = { name: string; limit: BodyLimit; path: () => string; headers: () => Record<string, string> };

const routes: BodyRoute[] = [
  {
    name: "a form's server action",
    limit: bodyLimits.form,
    path: () => "/sign-in",
    headers: () => ({ "next-action": builtActionId(signInAction), "content-type": "text/plain;charset=UTF-8" }),
  },
  {
    name: "the roster import form",
    limit: bodyLimits.rosterImportForm,
    path: () => `/admin/cohorts/${world.spareCohort}/import`,
    headers: () => ({ "next-action": builtActionId(rosterAction), "content-type": "text/plain;charset=UTF-8", cookie: world.people.admin.cookie }),
  },
  {
    name: "the grading route",
    limit: bodyLimits.labSubmission,
    path: () => `/api/labs/${gradedLab.slug}/attempts`,
    headers: () => ({ "content-type": "application/json", cookie: world.people.learnerA.cookie }),
  },
  {
    name: "the workbench's save",
    limit: bodyLimits.labDraft,
    path: () => `/api/labs/${gradedLab.slug}/draft`,
    headers: () => ({ "content-type": "application/json", cookie: world.people.learnerA.cookie }),
  },
  {
    name: "the upload route, asked by the browser",
    limit: bodyLimits.uploadRequest,
    path: () => "/api/uploadthing?actionType=upload&slug=benchPhoto",
    headers: () => ({ "content-type": "application/json", cookie: world.people.learnerA.cookie }),
  },
  {
    name: "the upload route, reported to by the service",
    limit: bodyLimits.uploadCallback,
    path: () => "/api/uploadthing?slug=benchPhoto",
    headers: () => ({ "content-type": "application/json", "uploadthing-hook": "callback", "x-uploadthing-signature": "hmac-sha256=00" }),
  },
];

/** The reporter's body: 10 MB of JSON with a hundred thousand keys the route does not know. */
function unknownKeys(): Uint8Array {
  const keys = Array.from({ length: 100_000 }, (_, i) => `"unknown-${i}-${"k".repeat(80)}":1`).join(",");
  return new TextEncoder().encode(`[{${keys}}]`);
}

function expectRefusal(reply: RawReply, status: number, context: string): { code: string; message: string } {
  expect(reply.status, `${context} → ${reply.text.slice(0, 200)}`).toBe(status);
  expect(reply.headers["content-type"], context).toMatch(/^application\/json/);
  expectNoInternals(reply.text, context);
  const { error } = JSON.parse(reply.text) as { error: { code: string; message: string } };
  expect(error.message.length, context).toBeGreaterThan(10);
  return error;
}

describe("a body over its route's limit", () => {
  for (const route of routes) {
    for (const chunked of [false, true]) {
      it(`${route.name}: 413 with the limit named, ${chunked ? "sent chunked" : "with its length declared"}`, async () => {
        // The rate limits count a request before its body is read, so their table may change.
        const before = await readDatabaseState(["sessions", "rate_limits"]);
        const body = unknownKeys();
        expect(body.byteLength).toBeGreaterThan(route.limit.bytes);
        const reply = await rawPost({ path: route.path(), headers: route.headers(), body, chunked });
        const error = expectRefusal(reply, 413, `${route.name}${chunked ? ", chunked" : ""}`);
        expect(error.code).toBe("payload-too-large");
        expect(error.message).toContain(`may be at most ${formatByteSize(route.limit.bytes)}`);
        expect(reply.text.length).toBeLessThan(400);
        expect(changedTables(before, await readDatabaseState(["sessions", "rate_limits"]))).toEqual([]);
      });
    }
  }

  it("is one page's limit, not every page's: a 900 kB roster reaches the import action, the same body is refused at sign-in", async () => {
    const pdf = new Uint8Array(880_000).fill(0x20);
    pdf.set(new TextEncoder().encode("%PDF-1.7\n"));
    const fields = { ...(await actionForms[rosterAction]!.fields!(world, "admin")), intent: "preview", file: new File([pdf], "roster.csv", { type: "text/csv" }) };
    const plan = await planActionCall(actionForms[rosterAction]!, world, "admin", world.people.admin.cookie, fields);
    const imported = await callAction({ ...plan, actionId: builtActionId(rosterAction) });
    expect(imported.status).toBe(200);
    expect(imported.result).toMatchObject({ status: "problem", message: "This is a PDF, not a CSV file." });

    const elsewhere = await callAction({ ...plan, path: "/sign-in", actionId: builtActionId(rosterAction) });
    expect(elsewhere.status).toBe(413);
    expect(JSON.parse(elsewhere.body)).toMatchObject({ error: { code: "payload-too-large" } });
  });
});

describe("a request that needs a session", () => {
  // Each declares 5 MB, sends 1 kB and waits: the answer must come without the rest.
  const stalled = (path: string, headers: Record<string, string>) =>
    rawPost({ path, headers: { "content-type": "application/json", ...headers }, body: new Uint8Array(1024).fill(0x20), declaredLength: 5 * 1024 * 1024 });

  it("is refused before its body arrives on the upload route: 401 signed out, 403 for an instructor, 401 for an unsigned service report", async () => {
    const upload = "/api/uploadthing?actionType=upload&slug=benchPhoto";
    const signedOut = await stalled(upload, {});
    expect(expectRefusal(signedOut, 401, "signed out").message).toBe("Sign in again to upload photos.");
    expect(signedOut.bodyFinished).toBe(false);
    const instructor = await stalled(upload, { cookie: world.people.instructorA.cookie });
    expect(expectRefusal(instructor, 403, "instructor").message).toBe("Only learners upload bench photos.");
    const unsigned = await stalled("/api/uploadthing?slug=benchPhoto", { "uploadthing-hook": "callback" });
    expectRefusal(unsigned, 401, "unsigned report");
  });

  it("is refused before its body arrives on the grading route", async () => {
    const reply = await stalled(`/api/labs/${gradedLab.slug}/attempts`, {});
    expectRefusal(reply, 401, "signed out");
    expect(reply.bodyFinished).toBe(false);
  });

  it("still gets its normal answer when the body is whole and within the limit", async () => {
    const body = new TextEncoder().encode(JSON.stringify({ choices: gradedLab.choices, idempotencyKey: randomUUID() }));
    for (const chunked of [false, true]) {
      const reply = await rawPost({ path: `/api/labs/${gradedLab.slug}/attempts`, headers: { "content-type": "application/json", cookie: world.people.learnerA.cookie }, body, chunked });
      expect(reply.status, reply.text.slice(0, 200)).toBe(chunked ? 200 : 201);
    }
  });
});

describe("a prefetch header on a post", () => {
  it("does not take a malformed server action past the body checks", async () => {
    for (const header of [{ "next-router-prefetch": "1" }, { purpose: "prefetch" }] as Record<string, string>[]) {
      const reply = await rawPost({
        path: "/sign-in",
        headers: { ...header, "next-action": builtActionId(signInAction), "content-type": "text/plain;charset=UTF-8" },
        body: new TextEncoder().encode('["$1"'),
        chunked: true,
      });
      expect(expectRefusal(reply, 400, JSON.stringify(header)).code).toBe("bad-request");
    }
  });
});
