import { randomBytes } from "node:crypto";
import { mkdtempSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { NextRequest } from "next/server";
import { genUploader } from "uploadthing/client";
import { createUploadRouteHandler } from "@/lib/uploads/route-handler";
import type { UploadRouter } from "@/lib/uploads/upload-router";
import { startUploadFake, type RunningUploadFake } from "../../support/uploads/upload-fake-process";
import { serveWebHandler } from "../../support/uploads/web-handler-server";
import { installXhrOverFetch } from "../../support/uploads/xhr-over-fetch";

// A private upload fake for one test file, the app's own upload route served over real HTTP in
// front of it, and the SDK's client uploader aimed at that route. The app reads its upload
// settings from the same UPLOADTHING_* variables the scripts export, set here for this fake.

const settingNames = ["UPLOADTHING_TOKEN", "UPLOADTHING_INGEST_URL", "UPLOADTHING_API_URL", "UPLOADTHING_IS_DEV", "UPLOADTHING_LOG_LEVEL", "UPLOADTHING_CALLBACK_URL"];

export type BenchUploadService = {
  apiKey: string;
  fakeUrl: string;
  routeUrl: string;
  /** Every entry in the fake's directory: stored files, their metadata and unfinished parts. */
  storedFiles: () => string[];
  storedKeys: () => string[];
  upload: (params: { files: File[]; submissionId: string; cookie?: string }) => ReturnType<ReturnType<typeof genUploader<UploadRouter>>["uploadFiles"]>;
  stop: () => Promise<void>;
};

export async function startBenchUploadService(): Promise<BenchUploadService> {
  const apiKey = `sk_local_${randomBytes(12).toString("hex")}`;
  const token = Buffer.from(JSON.stringify({ apiKey, appId: "edgewise-bench-tests", regions: ["local"] })).toString("base64");
  const dir = mkdtempSync(path.join(tmpdir(), "edgewise-bench-uploads-"));
  const fake: RunningUploadFake = await startUploadFake({ token, dir });

  const saved = Object.fromEntries(settingNames.map((name) => [name, process.env[name]]));
  Object.assign(process.env, {
    UPLOADTHING_TOKEN: token,
    UPLOADTHING_INGEST_URL: fake.url,
    UPLOADTHING_API_URL: fake.url,
    UPLOADTHING_IS_DEV: "false",
    UPLOADTHING_LOG_LEVEL: "Warning",
  });
  delete process.env.UPLOADTHING_CALLBACK_URL;

  const handler = createUploadRouteHandler();
  const server = await serveWebHandler((request) =>
    request.method === "GET" ? handler.GET(request as NextRequest) : handler.POST(request as NextRequest),
  );
  const routeUrl = `${server.origin}/api/uploadthing`;
  const restoreXhr = installXhrOverFetch();
  const { uploadFiles } = genUploader<UploadRouter>({ url: routeUrl, package: "edgewise-tests", fetch: globalThis.fetch });

  return {
    apiKey,
    fakeUrl: fake.url,
    routeUrl,
    storedFiles: () => readdirSync(dir).sort(),
    storedKeys: () => readdirSync(dir).filter((name) => !name.includes(".")),
    upload: ({ files, submissionId, cookie }) =>
      uploadFiles("benchPhoto", { files, input: { submissionId }, headers: cookie ? { cookie } : {} }),
    stop: async () => {
      restoreXhr();
      await Promise.all([server.close(), fake.stop()]);
      for (const [name, value] of Object.entries(saved)) {
        if (value === undefined) delete process.env[name];
        else process.env[name] = value;
      }
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
