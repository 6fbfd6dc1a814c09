/**
 * Bench photo uploads through the app's own upload route and the real uploadthing SDK, against a
 * local upload fake started for this file and the real database. Content is judged by the bytes
 * that reached storage, never by the name or declared type.
 */
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as getBenchPhoto } from "@/app/api/bench-photos/[photoId]/route";
import { db } from "@/db/client";
import { benchPhotos, benchSubmissions } from "@/db/schema";
import { openBenchDraft } from "@/lib/bench/submissions";
import { noisyPhoto } from "../support/uploads/noisy-photo";
import { createBenchSchool, type BenchSchool, type SignedIn } from "./support/bench-people";
import { startBenchUploadService, type BenchUploadService } from "./support/bench-upload-service";

let service: BenchUploadService;
let people: BenchSchool;

const photo = noisyPhoto(320, 240);
const pngFile = (name = "scope-edge.png", bytes: Uint8Array = photo) => new File([new Uint8Array(bytes)], name, { type: "image/png" });

async function learnerWithDraft(): Promise<{ learner: SignedIn; submissionId: string }> {
  const learner = await people.createMember(people.homeCohortId, "learner", "bench-uploader");
  const draft = await openBenchDraft({ learner: learner.user, exerciseSlug: "build-a-run" });
  if (draft.status !== "ready") throw new Error(`no draft: ${draft.status}`);
  return { learner, submissionId: draft.submissionId };
}

const photosOf = (submissionId: string) => db.select().from(benchPhotos).where(eq(benchPhotos.submissionId, submissionId));

const photoRequest = (photoId: string, cookie?: string) =>
  getBenchPhoto(new Request(`http://app.test/api/bench-photos/${photoId}`, { headers: cookie ? { cookie } : {} }), {
    params: Promise.resolve({ photoId }),
  });

beforeAll(async () => {
  service = await startBenchUploadService();
  people = await createBenchSchool();
});

afterAll(async () => {
  await service?.stop();
});

describe("a bench photo upload", () => {
  it("stores a real image with its pixel size and serves it back to its owner", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const [result] = await service.upload({ files: [pngFile()], submissionId, cookie: learner.cookie });

    const rows = await photosOf(submissionId);
    expect(rows).toHaveLength(1);
    expect(result.serverData).toEqual({ photoId: rows[0]!.id });
    expect(rows[0]).toMatchObject({ fileKey: result.key, name: "scope-edge.png", size: photo.length, contentType: "image/png", width: 320, height: 240 });
    expect(service.storedKeys()).toContain(result.key);

    const served = await photoRequest(rows[0]!.id, learner.cookie);
    expect(served.status).toBe(200);
    expect(served.headers.get("content-type")).toBe("image/png");
    expect(served.headers.get("cache-control")).toBe("private, max-age=3600");
    const bytes = Buffer.from(await served.arrayBuffer());
    expect(createHash("sha256").update(bytes).digest("hex")).toBe(createHash("sha256").update(photo).digest("hex"));
  });

  it("refuses a file that is not an image though it is named and declared as a PNG, and keeps nothing", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const text = new TextEncoder().encode("Rise time 14 ns, overshoot 0.4 V. This is a note, not a photo.\n".repeat(40));
    const [result] = await service.upload({ files: [pngFile("scope-edge.png", text)], submissionId, cookie: learner.cookie });

    expect(result.serverData).toEqual({ rejected: expect.stringMatching(/“scope-edge\.png” is not a PNG, JPEG or WebP image/) });
    expect(await photosOf(submissionId)).toEqual([]);
    expect(service.storedKeys()).not.toContain(result.key);
  });

  it("refuses a truncated PNG whose header ends before its size", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const [result] = await service.upload({ files: [pngFile("cut.png", photo.subarray(0, 20))], submissionId, cookie: learner.cookie });
    expect(result.serverData).toMatchObject({ rejected: expect.stringContaining("not a PNG, JPEG or WebP image") });
    expect(await photosOf(submissionId)).toEqual([]);
  });

  it("refuses a file over 8 MB before anything is sent to storage", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const before = service.storedKeys();
    const big = new Uint8Array(8 * 1024 * 1024 + 1);
    big.set(photo.subarray(0, 64));
    await expect(service.upload({ files: [pngFile("huge.png", big)], submissionId, cookie: learner.cookie })).rejects.toThrow(
      /“huge\.png” is larger than 8 MB, the most a photo may be/,
    );
    expect(service.storedKeys()).toEqual(before);
    expect(await photosOf(submissionId)).toEqual([]);
  });

  it("refuses a declared type that is not PNG, JPEG or WebP", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const svg = new File(["<svg xmlns='http://www.w3.org/2000/svg'/>"], "trace.svg", { type: "image/svg+xml" });
    await expect(service.upload({ files: [svg], submissionId, cookie: learner.cookie })).rejects.toThrow(/not a PNG, JPEG or WebP image/);
    expect(await photosOf(submissionId)).toEqual([]);
  });

  it("holds at most four photos per submission", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const four = ["a", "b", "c", "d"].map((n) => pngFile(`${n}.png`));
    const results = await service.upload({ files: four, submissionId, cookie: learner.cookie });
    expect(results.map((r) => r.serverData)).toEqual(results.map(() => ({ photoId: expect.any(String) })));
    await expect(service.upload({ files: [pngFile("e.png")], submissionId, cookie: learner.cookie })).rejects.toThrow(
      /already holds 4 photos/,
    );
    expect(await photosOf(submissionId)).toHaveLength(4);
  });

  it("is refused to anyone but the learner who owns an editable submission", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const attempt = (cookie?: string) => service.upload({ files: [pngFile()], submissionId, cookie });
    await expect(attempt()).rejects.toThrow(/Sign in again/);
    await expect(attempt(people.homeInstructor.cookie)).rejects.toThrow(/Only learners upload bench photos/);
    await expect(attempt(people.otherLearner.cookie)).rejects.toThrow(/submission was not found/);

    await db.update(benchSubmissions).set({ status: "submitted" }).where(eq(benchSubmissions.id, submissionId));
    await expect(attempt(learner.cookie)).rejects.toThrow(/with your instructor/);
    expect(await photosOf(submissionId)).toEqual([]);
  });
});

describe("the upload route's completion callback", () => {
  it("is refused with 400 when its signature was not made with the API key, and records nothing", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const payload = JSON.stringify({
      status: "uploaded",
      metadata: { learnerId: learner.user.id, submissionId },
      file: { name: "x.png", size: photo.length, type: "image/png", customId: null, key: "forged-key", url: "u", appUrl: "u", ufsUrl: "u", fileHash: "h" },
      origin: service.fakeUrl,
    });
    const wrongKey = `hmac-sha256=${createHash("sha256").update(`not-the-key${payload}`).digest("hex")}`;
    const reply = await fetch(`${service.routeUrl}?slug=benchPhoto`, {
      method: "POST",
      body: payload,
      headers: { "content-type": "application/json", "uploadthing-hook": "callback", "x-uploadthing-signature": wrongKey },
    });
    expect(reply.status).toBe(400);
    expect(await reply.json()).toEqual({ message: "Invalid signature" });
    expect(await photosOf(submissionId)).toEqual([]);
  });

  it("leaves no row for an upload that was presigned but never finished", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const presign = await fetch(`${service.routeUrl}?actionType=upload&slug=benchPhoto`, {
      method: "POST",
      headers: { "content-type": "application/json", cookie: learner.cookie, "x-uploadthing-package": "edgewise-tests" },
      body: JSON.stringify({ input: { submissionId }, files: [{ name: "half.png", size: photo.length, type: "image/png", lastModified: Date.now() }] }),
    });
    expect(presign.status).toBe(200);
    const [{ url, key }] = (await presign.json()) as Array<{ url: string; key: string }>;
    const form = new FormData();
    form.append("file", new Blob([new Uint8Array(photo.subarray(0, photo.length / 2))]), "half.png");
    const cut = await fetch(url, { method: "PUT", body: form, headers: { range: "bytes=0-" } });
    expect(cut.status).toBe(400);

    expect(await photosOf(submissionId)).toEqual([]);
    expect(service.storedKeys()).not.toContain(key);
  });
});
