/**
 * Bench photo uploads through the app's own upload route and the real uploadthing SDK, against a
 * local upload fake started for this file and the real database. Content is judged by the bytes
 * that reached storage, never by the name or declared type.
 */
import { createHash } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as getBenchPhoto } from "@/app/api/bench-photos/[photoId]/route";
import { db } from "@/db/client";
import { benchPhotos, benchSubmissions, lessonProgress } from "@/db/schema";
import { getCourse } from "@/lessons";
import { findBenchExercise } from "@/lib/bench/exercises";
import { openBenchDraft } from "@/lib/bench/submissions";
import { concatBytes, gifScript, htmlPayload, svgWithScript, zipArchive } from "../support/uploads/hidden-payloads";
import { noisyPhoto } from "../support/uploads/noisy-photo";
import { plainJpeg } from "../support/uploads/plain-jpeg";
import { createBenchSchool, type BenchSchool, type SignedIn } from "./support/bench-people";
import { startBenchUploadService, type BenchUploadService } from "./support/bench-upload-service";

let service: BenchUploadService;
let people: BenchSchool;

const photo = noisyPhoto(320, 240);
const pngFile = (name = "scope-edge.png", bytes: Uint8Array = photo, type = "image/png") => new File([new Uint8Array(bytes)], name, { type });

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

  it("is refused, like a new draft, while the exercise's lesson is still locked to the learner", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    // The learner's record taken back to before the lesson that opens the exercise.
    const lessonBefore = findBenchExercise("build-a-run")!.lesson.number - 1;
    const undone = getCourse().lessons.filter((lesson) => lesson.number >= lessonBefore).map((lesson) => lesson.slug);
    await db.delete(lessonProgress).where(and(eq(lessonProgress.userId, learner.user.id), inArray(lessonProgress.lessonSlug, undone)));
    await expect(service.upload({ files: [pngFile()], submissionId, cookie: learner.cookie })).rejects.toThrow(/opens with its lesson/);
    expect(await photosOf(submissionId)).toEqual([]);
    await expect(openBenchDraft({ learner: learner.user, exerciseSlug: "build-a-run" })).resolves.toEqual({ status: "lesson-locked" });
    await expect(openBenchDraft({ learner: learner.user, exerciseSlug: "document-a-run" })).resolves.toEqual({ status: "lesson-locked" });
  });
});

describe("a hostile bench photo upload", () => {
  /** Uploads expecting a refusal and checks that neither the database nor the fake's directory changed. */
  async function expectRefusedAndNothingKept(file: File, reason: RegExp): Promise<void> {
    const { learner, submissionId } = await learnerWithDraft();
    const before = service.storedFiles();
    const outcome = await service.upload({ files: [file], submissionId, cookie: learner.cookie }).then(
      ([result]) => result.serverData,
      (error: Error) => ({ thrown: error.message }),
    );
    expect(JSON.stringify(outcome)).toMatch(reason);
    expect(await photosOf(submissionId)).toEqual([]);
    expect(service.storedFiles()).toEqual(before);
  }

  it("refuses an empty file before anything is sent to storage", async () => {
    await expectRefusedAndNothingKept(pngFile("empty.png", new Uint8Array()), /“empty\.png” is empty \(0 bytes\)/);
  });

  const trailing = /carries other data after the end of the picture, so it was not kept/;
  const notAnImage = /is not a PNG, JPEG or WebP image/;
  it.each([
    ["a PNG with an HTML page after IEND", () => pngFile("edge.png", concatBytes(photo, htmlPayload)), trailing],
    ["a PNG with a ZIP archive after IEND", () => pngFile("edge.png", concatBytes(photo, zipArchive("run.html", htmlPayload))), trailing],
    ["a PNG with a single stray byte after IEND", () => pngFile("edge.png", concatBytes(photo, new Uint8Array([0]))), trailing],
    ["a JPEG with a script after EOI", () => pngFile("edge.jpg", concatBytes(plainJpeg(320, 240), htmlPayload), "image/jpeg"), trailing],
    ["a GIF that is also a script, named and declared as a PNG", () => pngFile("edge.png", gifScript), notAnImage],
    ["an SVG with a script, named and declared as a PNG", () => pngFile("edge.png", svgWithScript), notAnImage],
    ["a PNG whose chunks stop before IEND", () => pngFile("edge.png", photo.subarray(0, photo.length - 12)), notAnImage],
  ])("refuses %s and keeps nothing", async (_label, file, reason) => {
    await expectRefusedAndNothingKept(file(), reason);
  });

  it("stores the same JPEG without the appended script, so the refusal is about what follows EOI", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    const [result] = await service.upload({ files: [pngFile("edge.jpg", plainJpeg(320, 240), "image/jpeg")], submissionId, cookie: learner.cookie });
    expect(result.serverData).toEqual({ photoId: expect.any(String) });
    expect(await photosOf(submissionId)).toMatchObject([{ contentType: "image/jpeg", width: 320, height: 240 }]);
  });

  it.each([
    ["../../etc/passwd.png", "passwd.png", "passwd.png"],
    ["a/b.png", "b.png", "b.png"],
    ["a\\b.png", "b.png", "b.png"],
    ["C:\\Users\\bench\\scope.png", "scope.png", "scope.png"],
    ["scope\u0000edge.png", "scopeedge.png", "scopeedge.png"],
    ["scope\u001b[2J\u0007 \r\n edge.png", "scope[2J edge.png", "scope[2J edge.png"],
    ["scope\u202egnp.html", "scopegnp.html", "scopegnp.png"],
    ["../..", "photo", "photo.png"],
    [`${"long-".repeat(60)}edge.png`, `${"long-".repeat(60).slice(0, 116)}.png`, `${"long-".repeat(60).slice(0, 116)}.png`],
  ])("stores a photo named %j under the service's own key as %j, never as a path", async (uploadedName, displayName, savedName) => {
    const { learner, submissionId } = await learnerWithDraft();
    const before = new Set(service.storedFiles());
    const [result] = await service.upload({ files: [pngFile(uploadedName)], submissionId, cookie: learner.cookie });

    const rows = await photosOf(submissionId);
    expect(rows).toMatchObject([{ fileKey: result.key, name: displayName }]);
    expect(result.key).toMatch(/^[A-Za-z0-9_-]+$/);
    expect(service.storedFiles().filter((entry) => !before.has(entry))).toEqual([result.key, `${result.key}.json`].sort());

    const served = await photoRequest(rows[0]!.id, learner.cookie);
    expect(served.status).toBe(200);
    expect(served.headers.get("content-disposition")).toBe(`inline; filename="${savedName}"; filename*=UTF-8''${encodeURIComponent(savedName)}`);
  });

  it("serves a photo named .html as a fixed image type that the browser may not sniff, saved under an image name", async () => {
    const { learner, submissionId } = await learnerWithDraft();
    await service.upload({ files: [pngFile("mesures d’écho.html")], submissionId, cookie: learner.cookie });
    const [row] = await photosOf(submissionId);
    expect(row!.name).toBe("mesures d’écho.html");

    const served = await photoRequest(row!.id, learner.cookie);
    expect(served.status).toBe(200);
    expect(served.headers.get("content-type")).toBe("image/png");
    expect(served.headers.get("x-content-type-options")).toBe("nosniff");
    // RFC 6266 §4.3: an ASCII fallback and the exact name, each ending in the type's own extension.
    expect(served.headers.get("content-disposition")).toBe(`inline; filename="mesures d__cho.png"; filename*=UTF-8''mesures%20d%E2%80%99%C3%A9cho.png`);
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
