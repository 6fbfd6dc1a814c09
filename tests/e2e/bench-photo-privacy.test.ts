/**
 * A phone photo carries where it was taken. The learner's browser sends only the picture: the
 * stored photo holds no Exif block and no GPS position, and the camera's rotation has been applied
 * to the pixels, so it still stands upright.
 */
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readImageContent } from "@/lib/uploads/image-content";
import { createNamedLearner } from "../integration/support/bench-people";
import { findDemoCohortId } from "../integration/support/people";
import { holdsGpsLatitude, withExif } from "../support/exif-jpeg";
import { launchBrowser, openPage, signInThroughForm } from "./support/browser";

const password = "where the photo was taken";
// Exif orientation 6: the picture is stored lying on its side and shown turned 90° clockwise.
const ROTATE_CLOCKWISE = 6;

let browser: Browser;
let learner: { email: string };

beforeAll(async () => {
  learner = await createNamedLearner({ cohortId: await findDemoCohortId(), name: "Ines Quarrel-Basto", password });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

describe("a bench photo with a camera's location in it", () => {
  it("is stored without the location or any Exif block, turned upright", async () => {
    const { context, page } = await openPage(browser, "wide");
    try {
      await signInThroughForm(page, { email: learner.email, password });
      await page.goto("/bench/build-a-run");
      // A 96 × 48 JPEG as chromium encodes it, then the camera's block written in.
      const plain = await page.evaluate(async () => {
        const canvas = new OffscreenCanvas(96, 48);
        const context2d = canvas.getContext("2d")!;
        context2d.fillStyle = "#20303a";
        context2d.fillRect(0, 0, 96, 48);
        context2d.fillStyle = "#e8c547";
        context2d.fillRect(0, 20, 96, 8);
        const blob = await canvas.convertToBlob({ type: "image/jpeg", quality: 0.9 });
        return [...new Uint8Array(await blob.arrayBuffer())];
      });
      const photo = withExif(new Uint8Array(plain), { orientation: ROTATE_CLOCKWISE });
      expect(holdsGpsLatitude(photo)).toBe(true);
      expect(readImageContent(photo)).toMatchObject({ contentType: "image/jpeg", width: 96, height: 48 });

      await page.locator('input[type="file"]').setInputFiles({ name: "bench-phone.jpg", mimeType: "image/jpeg", buffer: photo });
      await page.getByText("“bench-phone.jpg” added.").waitFor({ timeout: 30_000 });
      const source = await page.getByRole("button", { name: "Open photo 1: bench-phone.jpg" }).locator("img").getAttribute("src");
      const stored = new Uint8Array(await (await context.request.get(source!)).body());

      expect(readImageContent(stored)).toMatchObject({ contentType: "image/jpeg", width: 48, height: 96 });
      expect(holdsGpsLatitude(stored)).toBe(false);
      expect(Buffer.from(stored).includes(Buffer.from("Exif\0\0", "latin1"))).toBe(false);
    } finally {
      await context.close();
    }
  });
});
