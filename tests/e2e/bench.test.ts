/**
 * The bench exercise end to end in a real browser against the running app: a learner uploads a
 * scope photo through the page and hands the work in, an instructor reviews it with the photo
 * zoomed, panned and fitted again beside the prediction, and the learner reads the feedback.
 * Screenshots of each screen, narrow and wide, go to test-results/screenshots.
 */
import { randomUUID } from "node:crypto";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { PNG } from "pngjs";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { findDemoCohortId } from "../integration/support/people";
import { createNamedLearner } from "../integration/support/bench-people";
import { waitForMessage } from "../integration/support/mail-sink";
import { findBenchExercise } from "@/lib/bench/exercises";
import { findLinks } from "@/lib/mail/sink";
import {
  baseUrl,
  demoAccounts,
  launchBrowser,
  openPage,
  saveScreenshot,
  screenshotDir,
  signInAs,
  signInThroughForm,
  viewports,
} from "./support/browser";

const password = "bench e2e password";
const learnerName = `Rowan Tessier-${randomUUID().slice(0, 4)}`;
let learner: { email: string };
let photoPath: string;
let browser: Browser;

/** A picture like a scope screen: dark graticule and one rising edge that rings and settles. */
function scopeScreenPhoto(width = 1600, height = 1000): Buffer {
  const png = new PNG({ width, height });
  const set = (x: number, y: number, [r, g, b]: [number, number, number]) => {
    if (x < 0 || y < 0 || x >= width || y >= height) return;
    const i = (y * width + x) * 4;
    png.data[i] = r;
    png.data[i + 1] = g;
    png.data[i + 2] = b;
    png.data[i + 3] = 255;
  };
  const grid = width / 10;
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) set(x, y, x % grid < 2 || y % grid < 2 ? [52, 62, 66] : [18, 24, 27]);
  let previous = Math.round(height * 0.8);
  for (let x = 0; x < width; x++) {
    const t = (x - width / 4) / (width / 12);
    const level = t < 0 ? 0 : 1 - Math.exp(-t) * Math.cos(2.4 * t);
    const y = Math.round(height * 0.8 - level * height * 0.6);
    for (let yy = Math.min(previous, y); yy <= Math.max(previous, y); yy++) for (let w = -2; w <= 2; w++) set(x, yy + w, [232, 197, 71]);
    previous = y;
  }
  return PNG.sync.write(png);
}

/** Screenshots only once every photo on the page has been fetched through the app. */
async function saveLoadedScreenshot(page: Page, name: string): Promise<void> {
  const allLoaded = () => [...document.images].every((image) => image.complete && image.naturalWidth > 0);
  await page.waitForFunction(allLoaded, undefined, { timeout: 30_000 });
  await saveScreenshot(page, name);
}

async function openAs(viewport: keyof typeof viewports, who: "learner" | "instructor"): Promise<{ page: Page; close: () => Promise<void> }> {
  const { context, page } = await openPage(browser, viewport);
  if (who === "learner") await signInThroughForm(page, { email: learner.email, password });
  else await signInAs(page, "instructor");
  return { page, close: () => context.close() };
}

beforeAll(async () => {
  learner = await createNamedLearner({ cohortId: await findDemoCohortId(), name: learnerName, password });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

describe("a bench exercise from upload to feedback", () => {
  it("lets the learner upload a scope photo, refuses a renamed non-image, and hands the work in", async () => {
    const { page, close } = await openAs("wide", "learner");
    const errors: string[] = [];
    page.on("pageerror", (error) => errors.push(error.message));
    try {
      await page.goto("/bench/build-a-run");
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Build and measure a run of your design");
      expect(await page.getByText("Not started", { exact: true }).isVisible()).toBe(true);
      await saveScreenshot(page, "bench-learner-start-wide");

      const fileInput = page.locator('input[type="file"]');
      await fileInput.setInputFiles({ name: "not-a-photo.png", mimeType: "image/png", buffer: Buffer.from("rise time 14 ns\n".repeat(50)) });
      await page.getByText("“not-a-photo.png” is not a PNG, JPEG or WebP image", { exact: false }).waitFor({ timeout: 30_000 });

      await fileInput.setInputFiles({ name: "scope-edge.png", mimeType: "image/png", buffer: scopeScreenPhoto() });
      await page.getByText("“scope-edge.png” added.").waitFor({ timeout: 30_000 });
      const opener = page.getByRole("button", { name: "Open photo 1: scope-edge.png" });
      const thumbnail = opener.locator("img");
      await thumbnail.waitFor();
      await expect.poll(() => thumbnail.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth), { timeout: 30_000 }).toBe(1600);
      expect(await page.getByRole("button", { name: /not-a-photo\.png/ }).count()).toBe(0);
      photoPath = (await thumbnail.getAttribute("src"))!;
      expect(photoPath).toMatch(/^\/api\/bench-photos\/[0-9a-f-]{36}$/);
      await opener.click();
      const viewer = page.getByRole("dialog", { name: "Photo 1 of 1: scope-edge.png" });
      await viewer.getByRole("button", { name: "Zoom in" }).click();
      await expect.poll(() => viewer.getByRole("status").textContent()).toBe("Zoom: 100 %");
      await viewer.getByRole("button", { name: "Close" }).click();
      await viewer.waitFor({ state: "hidden" });

      await page.getByLabel("Cable used (kind and conductor size)").selectOption("beside-ground");
      await page.getByLabel("Driver output high level (V)").fill("3.3 V");
      await page.getByLabel("Cable length (m)").fill("12 m");
      await page.getByLabel("Series resistor fitted (Ω)").fill("22 ohm");
      await page.getByLabel("Rise time (10–90 %) measured at the first pixel (ns)").fill("14");
      await page.getByLabel("Overshoot above the settled high level at the first pixel (V)").fill("0.35 V");
      await page.getByLabel("Your predicted first arrival and window, with the working").fill("Z0 about 94 Ω; the 3.3 V first arrival clears 3.5 V below about 40 Ω, so 22 Ω.");
      await page.getByLabel("Your note: what you measured, and what you conclude").fill("Spring ground at the first pixel; one small overshoot, no re-crossing of the threshold.");
      await page.getByRole("button", { name: "Hand in for review" }).click();
      await page.getByText("has no unit", { exact: false }).waitFor();
      await saveLoadedScreenshot(page, "bench-learner-form-error-wide");

      await page.getByLabel("Rise time (10–90 %) measured at the first pixel (ns)").fill("14 ns");
      await page.getByRole("button", { name: "Hand in for review" }).click();
      await page.getByText("Waiting for review", { exact: true }).waitFor();
      expect(await page.getByText("14 ns", { exact: true }).isVisible()).toBe(true);
      await saveLoadedScreenshot(page, "bench-learner-handed-in-wide");
      await page.setViewportSize(viewports.narrow);
      await saveLoadedScreenshot(page, "bench-learner-handed-in-narrow");
      expect(errors).toEqual([]);
    } finally {
      await close();
    }
  });

  it("lets the cohort's instructor review it beside the simulator's prediction", async () => {
    const { page, close } = await openAs("wide", "instructor");
    const errors: string[] = [];
    page.on("pageerror", (error) => errors.push(error.message));
    try {
      await page.goto("/reviews");
      await saveScreenshot(page, "bench-review-queue-wide");
      await page.setViewportSize(viewports.narrow);
      await saveScreenshot(page, "bench-review-queue-narrow");
      await page.setViewportSize(viewports.wide);
      await page.getByRole("link", { name: new RegExp(learnerName) }).click();
      await page.waitForURL(/\/reviews\/[0-9a-f-]{36}$/);
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(`${learnerName}: Build and measure a run of your design`);
      expect(await page.getByRole("cell", { name: "14 ns" }).isVisible()).toBe(true);
      expect(await page.getByText(/^Simulator verdict: /).isVisible()).toBe(true);
      expect(await page.locator(".recharts-line").count()).toBe(2);
      await saveLoadedScreenshot(page, "bench-review-page-wide");

      await page.getByRole("button", { name: "Open photo 1: scope-edge.png" }).click();
      const dialog = page.getByRole("dialog");
      await dialog.waitFor();
      const zoomed = dialog.getByRole("img", { name: "Bench photo scope-edge.png" });
      const shownWidth = () => zoomed.evaluate((img: HTMLImageElement) => (img.complete ? img.getBoundingClientRect().width : 0));
      const shownLeft = async () => (await zoomed.boundingBox())!.x;
      const readout = () => dialog.getByRole("status").textContent();
      const frame = dialog.getByRole("group", { name: /^scope-edge\.png at / });
      const scrolled = () => frame.evaluate((box) => ({ left: box.scrollLeft, top: box.scrollTop }));
      await expect.poll(shownWidth, { timeout: 30_000 }).toBeGreaterThan(0);
      const fitWidth = await shownWidth();
      expect(fitWidth).toBeLessThanOrEqual(viewports.wide.width);
      expect(await readout()).toMatch(/^Zoom: Fit · \d+ %$/);
      // Viewport-sized: a full-page capture would stretch the window, and the fitted photo with it.
      await page.screenshot({ path: path.join(screenshotDir, "bench-review-lightbox-fit-wide.png") });

      await page.keyboard.press("+");
      await expect.poll(readout).toBe("Zoom: 100 %");
      await dialog.getByRole("button", { name: "Zoom in" }).click();
      await expect.poll(readout).toBe("Zoom: 200 %");
      expect(await shownWidth()).toBe(3200);
      expect(await shownWidth()).toBeGreaterThanOrEqual(1.9 * fitWidth);

      const before = await scrolled();
      const leftBefore = await shownLeft();
      await page.keyboard.press("ArrowRight");
      await page.keyboard.press("ArrowDown");
      const after = await scrolled();
      expect(after.left).toBeGreaterThan(before.left);
      expect(after.top).toBeGreaterThan(before.top);
      expect(await shownLeft()).toBeLessThan(leftBefore);

      const box = (await frame.boundingBox())!;
      await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
      await page.mouse.down();
      await page.mouse.move(box.x + box.width / 2 - 150, box.y + box.height / 2 - 60, { steps: 5 });
      await page.mouse.up();
      expect(await scrolled()).toEqual({ left: after.left + 150, top: after.top + 60 });
      await page.screenshot({ path: path.join(screenshotDir, "bench-review-lightbox-200-wide.png") });

      await page.mouse.wheel(0, 380);
      await expect.poll(shownWidth).toBeLessThan(3200);
      expect(await readout()).not.toBe("Zoom: 200 %");
      await page.keyboard.press("0");
      await expect.poll(readout).toMatch(/^Zoom: Fit/);
      expect(await shownWidth()).toBeCloseTo(fitWidth, 0);

      await page.setViewportSize(viewports.narrow);
      await expect.poll(shownWidth).toBeLessThanOrEqual(viewports.narrow.width);
      for (const name of ["Zoom out", "Zoom in", "Fit", "Close"]) {
        const control = (await dialog.getByRole("button", { name }).boundingBox())!;
        expect(control.x).toBeGreaterThanOrEqual(0);
        expect(control.x + control.width).toBeLessThanOrEqual(viewports.narrow.width);
        expect(control.y + control.height).toBeLessThanOrEqual(viewports.narrow.height);
      }
      await page.screenshot({ path: path.join(screenshotDir, "bench-review-lightbox-fit-narrow.png") });
      await dialog.getByRole("button", { name: "Zoom in" }).click();
      await dialog.getByRole("button", { name: "Zoom in" }).click();
      await page.screenshot({ path: path.join(screenshotDir, "bench-review-lightbox-zoomed-narrow.png") });
      await page.keyboard.press("Escape");
      await dialog.waitFor({ state: "hidden" });
      await page.setViewportSize(viewports.wide);

      const given: Record<string, number> = { "measurement-correct": 3, "trace-readable": 2, "conclusion-sound": 1, "design-worked": 3 };
      for (const { id, criterion } of findBenchExercise("build-a-run")!.exercise.rubric) {
        await page.getByRole("radio", { name: `${criterion}: ${given[id]}` }).check({ force: true });
      }
      expect(await page.getByText("Total: 9 of 10 points").isVisible()).toBe(true);
      await page.getByLabel("Feedback for the learner").fill("Clean measurement. Explain why your rise time beats the prediction.");
      await page.setViewportSize(viewports.narrow);
      await saveLoadedScreenshot(page, "bench-review-page-narrow");
      await page.getByRole("button", { name: "Accept" }).click();
      await page.waitForURL(/\/reviews\?reviewed=sent$/);
      expect(await page.getByText("Review saved, and the learner has been e-mailed a link to it.").isVisible()).toBe(true);
      expect(await page.getByRole("link", { name: new RegExp(learnerName) }).count()).toBe(0);
      expect(errors).toEqual([]);
    } finally {
      await close();
    }
  });

  it("shows the learner the points and feedback, reached from the e-mailed link", async () => {
    const message = await waitForMessage({ to: learner.email, subject: /accepted/ });
    const [link] = findLinks(message.text);
    expect(link).toBe(`${process.env.APP_URL ?? baseUrl}/bench/build-a-run`);

    for (const viewport of ["narrow", "wide"] as const) {
      const { page, close } = await openAs(viewport, "learner");
      try {
        await page.goto(new URL(link!).pathname);
        await page.getByRole("heading", { name: "Accepted · 9 of 10 points" }).waitFor();
        expect(await page.getByText("Clean measurement. Explain why your rise time beats the prediction.").isVisible()).toBe(true);
        expect(await page.getByText("1 / 2", { exact: true }).isVisible()).toBe(true);
        expect(await page.getByRole("button", { name: /Hand in/ }).count()).toBe(0);
        await saveLoadedScreenshot(page, `bench-learner-feedback-${viewport}`);
      } finally {
        await close();
      }
    }
  });

  it("tells a learner whose session ended on the page to sign in again, not that the photo service is down", async () => {
    const other = await createNamedLearner({ cohortId: await findDemoCohortId(), name: `Ines Varga-${randomUUID().slice(0, 4)}`, password });
    const [{ id }] = await db.select({ id: users.id }).from(users).where(eq(users.email, other.email));
    const { context, page } = await openPage(browser, "wide");
    try {
      await signInThroughForm(page, { email: other.email, password });
      await page.goto("/bench/build-a-run");
      // The session ends while the page is open: the draft is opened, then the upload route is asked.
      let asked = false;
      await page.route("**/api/uploadthing?**", async (route) => {
        if (route.request().method() === "POST" && !asked) {
          asked = true;
          await db.delete(sessions).where(eq(sessions.userId, id!));
        }
        await route.continue();
      });
      await page.locator('input[type="file"]').setInputFiles({ name: "scope-edge.png", mimeType: "image/png", buffer: scopeScreenPhoto(320, 200) });
      await page.getByText("Sign in again to upload photos.").waitFor({ timeout: 30_000 });
      expect(asked).toBe(true);
      expect(await page.getByText("The photo service is not answering", { exact: false }).count()).toBe(0);
      await saveScreenshot(page, "bench-learner-signed-out-upload-wide");
    } finally {
      await context.close();
    }
  });

  it("keeps another learner away from the review queue and the photo", async () => {
    const { context, page } = await openPage(browser, "wide");
    try {
      await signInAs(page, "learner");
      expect(demoAccounts.learner.email).not.toBe(learner.email);
      expect((await page.goto("/reviews"))?.status()).toBe(403);
      expect((await page.request.get(photoPath)).status()).toBe(404);
    } finally {
      await context.close();
    }
  });
});
