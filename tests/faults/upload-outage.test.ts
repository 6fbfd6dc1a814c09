/**
 * A learner on the bench page adds a photo while a service behind the upload is down: first the
 * upload service (the fake stands in for it), then the database. Each time the page must say
 * plainly that nothing was added, stop showing progress, and take the same photo once the service
 * is back. A photo row exists only for a file the service holds. Screenshots of the messages and of
 * the 503 page go to test-results/screenshots.
 */
import { readdir } from "node:fs/promises";
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { PNG } from "pngjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { benchPhotos, benchSubmissions } from "@/db/schema";
import type { AppInstance } from "@/scripts/app-instance";
import { launchBrowser, openPage, saveScreenshot, signInThroughForm } from "../e2e/support/browser";
import { createNamedLearner } from "../integration/support/bench-people";
import { findDemoCohortId } from "../integration/support/people";
import { stackTracePattern, startFaultInstance, waitUntilHealthy } from "./support/instance";

const password = "faults bench password";
let instance: AppInstance;
let browser: Browser;
let learner: { id: string; email: string };

function smallPhoto(): Buffer {
  const png = new PNG({ width: 64, height: 48 });
  png.data.fill(90);
  return PNG.sync.write(png);
}

async function choosePhoto(page: Page, name: string): Promise<void> {
  await page.locator('input[type="file"]').setInputFiles({ name, mimeType: "image/png", buffer: smallPhoto() });
}

/** The learner's stored photos, and whether the upload service holds each one's file. */
async function storedPhotos(): Promise<{ name: string; fileKey: string; fileStored: boolean }[]> {
  const files = new Set(await readdir(instance.env.UPLOAD_FAKE_DIR!));
  const rows = await db
    .select({ name: benchPhotos.name, fileKey: benchPhotos.fileKey })
    .from(benchPhotos)
    .innerJoin(benchSubmissions, eq(benchSubmissions.id, benchPhotos.submissionId))
    .where(eq(benchSubmissions.learnerId, learner.id));
  return rows.map((row) => ({ ...row, fileStored: files.has(row.fileKey) }));
}

/** The upload control is back to its resting label: no progress left spinning. */
async function expectIdleUploader(page: Page): Promise<void> {
  await page.getByText("Choose photos", { exact: true }).waitFor();
  expect(await page.getByText(/Uploading…/).count()).toBe(0);
}

beforeAll(async () => {
  instance = await startFaultInstance();
  learner = await createNamedLearner({ cohortId: await findDemoCohortId(), name: `Ilse Brandt-${randomUUID().slice(0, 4)}`, password });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await instance?.stop();
});

describe("adding a bench photo while a service behind it is down", () => {
  it("says so when the upload service is down, and takes the photo once it is back", async () => {
    const { context, page } = await openPage(browser, "wide", instance.baseUrl);
    const pageErrors: string[] = [];
    page.on("pageerror", (error) => pageErrors.push(error.message));
    try {
      await signInThroughForm(page, { email: learner.email, password });
      await page.goto("/bench/build-a-run");
      await instance.stopPart("uploads");

      await choosePhoto(page, "scope-while-down.png");
      const message = page.getByText("The photo service is not answering", { exact: false });
      await message.waitFor({ timeout: 60_000 });
      await expectIdleUploader(page);
      expect(await page.getByRole("region", { name: /^Photos/ }).getByRole("status").innerText()).not.toMatch(stackTracePattern);
      await saveScreenshot(page, "faults-upload-service-down-wide");
      expect(await storedPhotos()).toEqual([]);

      await instance.startPart("uploads");
      await choosePhoto(page, "scope-retry.png");
      await page.getByText("“scope-retry.png” added.").waitFor({ timeout: 60_000 });
      expect(await storedPhotos()).toEqual([expect.objectContaining({ name: "scope-retry.png", fileStored: true })]);
      expect(pageErrors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it("says so when the database is down, shows the 503 page on navigation, and takes the photo once it is back", async () => {
    const { context, page } = await openPage(browser, "wide", instance.baseUrl);
    try {
      await signInThroughForm(page, { email: learner.email, password });
      await page.goto("/bench/build-a-run");
      await instance.stopDatabase();

      await choosePhoto(page, "scope-db-down.png");
      await page.getByText("Edgewise is not answering right now, so no photo was added.", { exact: false }).waitFor({ timeout: 60_000 });
      await expectIdleUploader(page);
      await saveScreenshot(page, "faults-upload-database-down-wide");

      const response = await page.goto("/learn");
      expect(response?.status()).toBe(503);
      await page.getByRole("heading", { name: "Edgewise is briefly unavailable" }).waitFor();
      expect(await page.locator("body").innerText()).not.toMatch(stackTracePattern);
      await saveScreenshot(page, "faults-database-503-wide");

      await instance.startDatabase();
      await waitUntilHealthy(instance.baseUrl);
      await expect.poll(async () => (await page.goto("/bench/build-a-run"))?.status(), { timeout: 15_000 }).toBe(200);
      await choosePhoto(page, "scope-db-back.png");
      await page.getByText("“scope-db-back.png” added.").waitFor({ timeout: 60_000 });
      const photos = await storedPhotos();
      expect(photos.map((photo) => photo.name).sort()).toEqual(["scope-db-back.png", "scope-retry.png"]);
      expect(photos.every((photo) => photo.fileStored)).toBe(true);
    } finally {
      await context.close();
    }
  });
});
