/**
 * The local upload fake (scripts/upload-fake.mjs) against the real uploadthing SDK: a file router
 * served by the SDK's own route handler, the SDK's client uploader, UTApi, and a real browser for
 * the cross-origin part. Nothing here imitates the SDK; the fake is the only stand-in.
 */
import { createHash, randomBytes, randomUUID } from "node:crypto";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import http from "node:http";
import { tmpdir } from "node:os";
import path from "node:path";
import { chromium } from "playwright-core";
import { genUploader, version } from "uploadthing/client";
import { createRouteHandler, createUploadthing, UTApi, UTFiles, type FileRouter } from "uploadthing/server";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { noisyPhoto } from "../support/uploads/noisy-photo";
import { runUploadFakeUntilExit, startUploadFake, type RunningUploadFake } from "../support/uploads/upload-fake-process";
import { serveWebHandler } from "../support/uploads/web-handler-server";
import { installXhrOverFetch } from "../support/uploads/xhr-over-fetch";

const apiKey = `sk_local_${randomBytes(12).toString("hex")}`;
const token = Buffer.from(JSON.stringify({ apiKey, appId: "edgewise-local", regions: ["local"] })).toString("base64");
const photo = noisyPhoto(300, 300);
const md5 = (bytes: Uint8Array) => createHash("md5").update(bytes).digest("hex");
const photoFile = (name = "scope-trace.png") => new File([new Uint8Array(photo)], name, { type: "image/png" });

type Completed = { key: string; name: string; size: number; type: string; fileHash: string; customId: string | null; metadata: unknown };
const completed: Completed[] = [];
const f = createUploadthing();
const router = {
  benchPhoto: f({ image: { maxFileSize: "8MB", maxFileCount: 4 } })
    .middleware(({ files }) => ({
      learnerId: "learner-7",
      [UTFiles]: files.map((file) => ({ ...file, customId: `bench-${randomUUID()}` })),
    }))
    .onUploadComplete(({ file, metadata }) => {
      const { key, name, size, type, fileHash, customId } = file;
      completed.push({ key, name, size, type, fileHash, customId, metadata });
      return { recordedFor: metadata.learnerId, key };
    }),
  shortLivedPhoto: f({ image: { maxFileSize: "8MB" } }, { presignedURLTTL: 1 }).onUploadComplete(() => {}),
} satisfies FileRouter;

type HandlerRequest = { url: string; hook: string | null };
type App = { origin: string; handlerRequests: HandlerRequest[]; close: () => Promise<void> };

let fake: RunningUploadFake;
let dir: string;
let productionApp: App;
let devApp: App;
let restoreXhr: () => void;

async function serveUploadRoute(isDev: boolean): Promise<App> {
  const handlerRequests: HandlerRequest[] = [];
  const recordingFetch = (input: RequestInfo | URL, init?: RequestInit) => {
    handlerRequests.push({ url: String(input instanceof Request ? input.url : input), hook: new Headers(init?.headers).get("uploadthing-hook") });
    return fetch(input, init);
  };
  let handler: (request: Request) => Promise<Response> = () => Promise.reject(new Error("route not mounted yet"));
  const server = await serveWebHandler((request) => handler(request));
  const callbackUrl = `${server.origin}/api/uploadthing`;
  const config = { token, ingestUrl: fake.url, callbackUrl, isDev, logLevel: "Warning", fetch: recordingFetch } as const;
  handler = createRouteHandler({ router, config });
  return { origin: server.origin, handlerRequests, close: server.close };
}

const uploader = (app: App) =>
  genUploader<typeof router>({ url: `${app.origin}/api/uploadthing`, package: "edgewise-tests", fetch: globalThis.fetch });

// What the client's first request does: ask the app's route for a presigned URL.
async function presign(app: App, slug: keyof typeof router, file: { name: string; size: number; type: string }) {
  const reply = await fetch(`${app.origin}/api/uploadthing?actionType=upload&slug=${slug}`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-uploadthing-package": "edgewise-tests", "x-uploadthing-version": version },
    body: JSON.stringify({ input: null, files: [{ ...file, lastModified: Date.now() }] }),
  });
  expect(reply.status).toBe(200);
  const [presigned] = (await reply.json()) as Array<{ url: string; key: string }>;
  return presigned;
}

function formWith(file: Blob) {
  const form = new FormData();
  form.append("file", file);
  return form;
}

// The client's PUT: multipart field `file`, resuming from `start` with the file's remaining bytes.
function putFile(url: string, file: Blob, start = 0) {
  const headers = { range: `bytes=${start}-`, "x-uploadthing-version": version };
  return fetch(url, { method: "PUT", body: formWith(file.slice(start)), headers });
}

async function rangeStart(url: string) {
  const reply = await fetch(url, { method: "HEAD" });
  expect(reply.status).toBe(200);
  return Number(reply.headers.get("x-ut-range-start"));
}

const storedPath = (key: string, suffix = "") => path.join(dir, key + suffix);
const getStored = (key: string, headers: Record<string, string> = {}) => fetch(`${fake.url}/f/${key}`, { headers });

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "edgewise-upload-fake-"));
  fake = await startUploadFake({ token, dir });
  productionApp = await serveUploadRoute(false);
  devApp = await serveUploadRoute(true);
  restoreXhr = installXhrOverFetch();
});

afterAll(async () => {
  restoreXhr?.();
  await Promise.all([productionApp?.close(), devApp?.close(), fake?.stop()]);
  rmSync(dir, { recursive: true, force: true });
});

beforeEach(() => {
  completed.length = 0;
});

describe("a bench photo uploaded through the SDK's client", () => {
  it("is stored, reported to onUploadComplete through a signed callback, and deleted again through UTApi", async () => {
    const [result] = await uploader(productionApp).uploadFiles("benchPhoto", { files: [photoFile()] });

    expect(completed).toHaveLength(1);
    const [done] = completed;
    expect(done).toMatchObject({ key: result.key, name: "scope-trace.png", size: photo.length, type: "image/png", fileHash: md5(photo) });
    expect(done.metadata).toEqual({ learnerId: "learner-7" });
    expect(done.customId).toMatch(/^bench-/);
    expect(result.serverData).toEqual({ recordedFor: "learner-7", key: result.key });
    expect(result.fileHash).toBe(md5(photo));

    expect(readFileSync(storedPath(result.key)).equals(photo)).toBe(true);
    const sidecar = JSON.parse(readFileSync(storedPath(result.key, ".json"), "utf8"));
    expect(sidecar).toMatchObject({ key: result.key, name: "scope-trace.png", size: photo.length, type: "image/png", customId: done.customId });

    // Production path: the fake itself calls the app; the handler never calls its own route.
    expect(productionApp.handlerRequests.filter((r) => r.hook === "callback")).toEqual([]);

    const utapi = new UTApi({ token, apiUrl: fake.url, logLevel: "Warning" });
    const listed = await utapi.listFiles();
    expect(listed.files).toContainEqual(expect.objectContaining({ key: result.key, customId: done.customId, size: photo.length, status: "Uploaded" }));
    expect((await utapi.getFileUrls(result.key)).data).toEqual([{ key: result.key, url: `${fake.url}/f/${result.key}` }]);
    await expect(utapi.deleteFiles(result.key)).resolves.toMatchObject({ success: true, deletedCount: 1 });
    expect(existsSync(storedPath(result.key))).toBe(false);
    expect(existsSync(storedPath(result.key, ".json"))).toBe(false);
    expect((await getStored(result.key, { "x-uploadthing-api-key": apiKey })).status).toBe(404);
  });

  it("completes in dev mode, where the callback travels on the metadata stream and the handler forwards it to itself", async () => {
    const [result] = await uploader(devApp).uploadFiles("benchPhoto", { files: [photoFile("set-up.png")] });

    expect(completed.map((c) => c.key)).toEqual([result.key]);
    expect(result.serverData).toEqual({ recordedFor: "learner-7", key: result.key });
    expect(devApp.handlerRequests).toContainEqual({ url: expect.stringContaining(`${devApp.origin}/api/uploadthing`), hook: "callback" });

    const utapi = new UTApi({ token, apiUrl: fake.url, logLevel: "Warning" });
    const { customId } = completed[0];
    await expect(utapi.deleteFiles(customId!, { keyType: "customId" })).resolves.toMatchObject({ deletedCount: 1 });
    expect(existsSync(storedPath(result.key))).toBe(false);
  });

  it("works with nothing but the UPLOADTHING_* variables that scripts/local-services.sh exports", async () => {
    const exported = {
      UPLOADTHING_TOKEN: token,
      UPLOADTHING_INGEST_URL: fake.url,
      UPLOADTHING_API_URL: fake.url,
      UPLOADTHING_IS_DEV: "false",
      UPLOADTHING_LOG_LEVEL: "Warning",
    };
    const saved = Object.fromEntries(Object.keys(exported).map((name) => [name, process.env[name]]));
    Object.assign(process.env, exported);
    delete process.env.UPLOADTHING_CALLBACK_URL;
    const handler = createRouteHandler({ router });
    const server = await serveWebHandler((request) => handler(request));
    try {
      const app = { origin: server.origin, handlerRequests: [], close: server.close };
      const [result] = await uploader(app).uploadFiles("benchPhoto", { files: [photoFile()] });
      expect(completed.map((c) => c.key)).toEqual([result.key]);
      await expect(new UTApi().deleteFiles(result.key)).resolves.toMatchObject({ deletedCount: 1 });
      expect(existsSync(storedPath(result.key))).toBe(false);
    } finally {
      await server.close();
      for (const [name, value] of Object.entries(saved)) {
        if (value === undefined) delete process.env[name];
        else process.env[name] = value;
      }
    }
  });

  it("is served back only to a caller presenting the API key", async () => {
    const [result] = await uploader(productionApp).uploadFiles("benchPhoto", { files: [photoFile()] });

    expect((await getStored(result.key)).status).toBe(401);
    expect((await getStored(result.key, { "x-uploadthing-api-key": `${apiKey}x` })).status).toBe(401);
    const reply = await getStored(result.key, { "x-uploadthing-api-key": apiKey });
    expect(reply.status).toBe(200);
    expect(reply.headers.get("content-type")).toBe("image/png");
    expect(Buffer.from(await reply.arrayBuffer()).equals(photo)).toBe(true);
  });
});

describe("presigned URLs", () => {
  const declared = { name: "scope-trace.png", size: photo.length, type: "image/png" };

  it("refuses a PUT or HEAD whose signature does not match", async () => {
    const { url, key } = await presign(productionApp, "benchPhoto", declared);
    const wrongSignature = url.replace(/.$/, (last) => (last === "0" ? "1" : "0"));
    const resizedAfterSigning = url.replace(`x-ut-file-size=${photo.length}`, `x-ut-file-size=${photo.length * 2}`);
    expect(resizedAfterSigning).not.toBe(url);

    for (const forged of [wrongSignature, resizedAfterSigning]) {
      const reply = await putFile(forged, photoFile());
      expect(reply.status).toBe(403);
      expect(await reply.json()).toEqual({ error: "invalid signature" });
      expect((await fetch(forged, { method: "HEAD" })).status).toBe(403);
    }
    expect(existsSync(storedPath(key))).toBe(false);
    expect(existsSync(storedPath(key, ".part"))).toBe(false);
    expect(completed).toEqual([]);
  });

  it("refuses a URL past its expiry", async () => {
    const { url, key } = await presign(productionApp, "shortLivedPhoto", declared);
    const expires = Number(new URL(url).searchParams.get("expires"));
    await new Promise((resolve) => setTimeout(resolve, Math.max(0, expires - Date.now()) + 50));

    const reply = await putFile(url, photoFile());
    expect(reply.status).toBe(403);
    expect(await reply.json()).toEqual({ error: "presigned URL has expired" });
    expect(existsSync(storedPath(key))).toBe(false);
  });

  it("refuses a file larger than the size it was signed for, keeping nothing", async () => {
    const { url, key } = await presign(productionApp, "benchPhoto", { ...declared, size: 1000 });
    const reply = await putFile(url, photoFile());
    expect(reply.status).toBe(413);
    expect(existsSync(storedPath(key))).toBe(false);
    expect(existsSync(storedPath(key, ".part"))).toBe(false);
    expect(completed).toEqual([]);
  });

  it("resumes an interrupted upload from the offset HEAD reports", async () => {
    const { url, key } = await presign(productionApp, "benchPhoto", declared);
    const form = new Response(formWith(photoFile()));
    const body = Buffer.from(await form.arrayBuffer());
    const cutOff = http.request(url, {
      method: "PUT",
      headers: { "content-type": form.headers.get("content-type")!, "content-length": body.length, range: "bytes=0-" },
    });
    cutOff.on("error", () => {});
    cutOff.write(body.subarray(0, body.length / 2));
    for (let tries = 0; (await rangeStart(url)) === 0; tries++) {
      expect(tries).toBeLessThan(200);
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
    cutOff.destroy();
    await fake.waitForLog(new RegExp(`PUT /${key} 499`));

    const start = await rangeStart(url);
    expect(start).toBeGreaterThan(0);
    expect(start).toBeLessThan(photo.length);
    expect(readFileSync(storedPath(key, ".part")).equals(photo.subarray(0, start))).toBe(true);

    const skipping = await putFile(url, photoFile(), start + 1);
    expect(skipping.status).toBe(416);
    expect(skipping.headers.get("x-ut-range-start")).toBe(String(start));

    const resumed = await putFile(url, photoFile(), start);
    expect(resumed.status).toBe(200);
    expect(await resumed.json()).toMatchObject({ fileHash: md5(photo), serverData: { recordedFor: "learner-7", key } });
    expect(readFileSync(storedPath(key)).equals(photo)).toBe(true);
    expect(completed.map((c) => c.key)).toEqual([key]);
  });
});

describe("the callback into the app", () => {
  it("is refused by the SDK's handler when the signature is not made with the API key", async () => {
    const payload = JSON.stringify({
      status: "uploaded",
      metadata: { learnerId: "learner-7" },
      file: { name: "x.png", size: 1, type: "image/png", customId: null, key: "forged", url: "u", appUrl: "u", ufsUrl: "u", fileHash: "h" },
      origin: fake.url,
    });
    const signedWithOtherKey = `hmac-sha256=${createHash("sha256").update(payload).digest("hex")}`;
    const reply = await fetch(`${productionApp.origin}/api/uploadthing?slug=benchPhoto`, {
      method: "POST",
      body: payload,
      headers: { "content-type": "application/json", "uploadthing-hook": "callback", "x-uploadthing-signature": signedWithOtherKey },
    });
    expect(reply.status).toBe(400);
    expect(await reply.json()).toEqual({ message: "Invalid signature" });
    expect(completed).toEqual([]);
  });
});

describe("the fake's own surface", () => {
  it("answers a browser's cross-origin preflight, HEAD and multipart PUT from the app's origin", async () => {
    const { url, key } = await presign(productionApp, "benchPhoto", { name: "scope-trace.png", size: photo.length, type: "image/png" });
    const browser = await chromium.launch({ executablePath: "/usr/bin/chromium" });
    try {
      const page = await browser.newPage();
      await page.goto(`${productionApp.origin}/api/uploadthing`);
      const outcome = await page.evaluate(
        async ({ url, bytes, version }) => {
          const head = await fetch(url, { method: "HEAD", headers: { traceparent: "00-0af7651916cd43dd8448eb211c80319c-b7ad6b7169203331-01" } });
          const start = head.headers.get("x-ut-range-start");
          const file = new File([new Uint8Array(bytes)], "scope-trace.png", { type: "image/png" });
          return new Promise<{ start: string | null; status: number; body: unknown }>((resolve) => {
            const xhr = new XMLHttpRequest();
            xhr.open("PUT", url, true);
            xhr.setRequestHeader("Range", `bytes=${start}-`);
            xhr.setRequestHeader("x-uploadthing-version", version);
            xhr.setRequestHeader("traceparent", "00-0af7651916cd43dd8448eb211c80319c-b7ad6b7169203331-01");
            xhr.responseType = "json";
            xhr.addEventListener("load", () => resolve({ start, status: xhr.status, body: xhr.response }));
            xhr.addEventListener("error", () => resolve({ start, status: 0, body: null }));
            const form = new FormData();
            form.append("file", file);
            xhr.send(form);
          });
        },
        { url, bytes: [...photo], version },
      );
      expect(outcome).toMatchObject({ start: "0", status: 200, body: { fileHash: md5(photo), ufsUrl: `${fake.url}/f/${key}` } });
      expect(fake.log()).toContain(`OPTIONS /${key} 204`);
      expect(readFileSync(storedPath(key)).equals(photo)).toBe(true);
    } finally {
      await browser.close();
    }
  });

  it("exits with a clear message when its port is taken", () => {
    const outcome = runUploadFakeUntilExit({ token, dir, port: Number(new URL(fake.url).port) });
    expect(outcome.status).toBe(1);
    expect(outcome.stderr).toContain(`cannot listen on 127.0.0.1:${new URL(fake.url).port}: port ${new URL(fake.url).port} is already taken`);
  });
});
