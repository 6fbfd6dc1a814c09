/**
 * The workbench in a real browser against the built app: a learner moves the resistor and watches
 * the live preview change, submits a failing and then a passing choice, finds both in the
 * history, and redraws the first from what was stored; a learner with a long history sees the
 * newest page of it and asks for older attempts.
 */
import { randomUUID } from "node:crypto";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createSession } from "@/lib/auth/session-store";
import { attemptPageSizes } from "@/lib/grading/attempt-pages";
import { baseUrl, launchBrowser, openPage, saveScreenshot, signInThroughForm } from "./support/browser";
import { createLearnerAtLab } from "./support/learner-at-lab";

const LAB = "lone-lead-termination";
const password = "scope on the far end";
const farEndTrace = 'path.recharts-line-curve[stroke="#b05f26"]';

let browser: Browser;
let learner: { email: string; password: string };

beforeAll(async () => {
  browser = await launchBrowser();
  learner = await createLearnerAtLab({ labSlug: LAB, password, label: "workbench" });
});

afterAll(async () => {
  await browser?.close();
});

/** Waits until the preview shows the run for the controls as they are now. */
async function settled(page: Page): Promise<void> {
  await page.locator('[data-testid="workbench-preview"][data-pending="false"]').waitFor({ timeout: 60_000 });
  await page.locator(farEndTrace).first().waitFor({ timeout: 60_000 });
}

async function resistorShown(page: Page): Promise<string> {
  return (await page.locator("output").first().innerText()).trim();
}

/** Steps the resistor with the keyboard until it reads `target` ("240 Ω"). */
async function setResistor(page: Page, target: string, ohms: number): Promise<void> {
  const slider = page.getByRole("slider", { name: "Series resistor (E24)" });
  await slider.focus();
  for (let step = 0; step < 60 && (await resistorShown(page)) !== target; step += 1) {
    const current = Number.parseFloat(await resistorShown(page)) * ((await resistorShown(page)).includes("k") ? 1000 : 1);
    await page.keyboard.press(current < ohms ? "ArrowRight" : "ArrowLeft");
  }
  expect(await resistorShown(page)).toBe(target);
  await settled(page);
}

async function submitAndRead(page: Page, expectedAttempt: number): Promise<string> {
  await page.getByRole("button", { name: "Submit for grading" }).click();
  const result = page.getByTestId("grading-result");
  await result.getByText(`Attempt ${expectedAttempt}:`).waitFor({ timeout: 60_000 });
  return result.innerText();
}

describe("the workbench", () => {
  it("previews live, grades a failing then a passing resistor, keeps both, and redraws a stored attempt", async () => {
    const { context, page } = await openPage(browser, "wide");
    const pageErrors: string[] = [];
    page.on("pageerror", (error) => pageErrors.push(error.message));
    try {
      await signInThroughForm(page, learner);
      await page.goto(`/labs/${LAB}`);
      expect(await page.getByRole("heading", { level: 1 }).innerText()).toBe("A long run on a lone lead");
      await settled(page);
      expect(await resistorShown(page)).toBe("33 Ω");
      expect(await page.getByTestId("rule-preview").innerText()).toMatch(/does not yet meet the lab's rule/);
      const traceAt33 = await page.locator(farEndTrace).first().getAttribute("d");
      await saveScreenshot(page, "workbench-wide-start");

      // Drag the slider's thumb with the mouse: 33 Ω sits a quarter of the way along the E24 values.
      const slider = page.getByRole("slider", { name: "Series resistor (E24)" });
      await slider.scrollIntoViewIfNeeded();
      const box = (await slider.boundingBox())!;
      const y = box.y + box.height / 2;
      await page.mouse.move(box.x + box.width * 0.25, y);
      await page.mouse.down();
      await page.mouse.move(box.x + box.width * 0.45, y, { steps: 8 });
      await page.mouse.move(box.x + box.width * 0.6, y, { steps: 8 });
      // While the thumb is held, the preview's traces are drawn over the chart, the chart's own hidden.
      const overlayFarEnd = page.locator('[data-testid="drag-preview-traces"] path[data-trace="far"]');
      await overlayFarEnd.waitFor({ timeout: 30_000 });
      expect(await overlayFarEnd.getAttribute("d")).toMatch(/^M[\d.-]+,[\d.-]+(L[\d.]+,[\d.-]+){100,}$/);
      expect(await page.locator(farEndTrace).count()).toBe(0);
      await page.mouse.up();
      const dragged = await resistorShown(page);
      expect(dragged).not.toBe("33 Ω");
      await settled(page);
      expect(await page.getByTestId("drag-preview-traces").count()).toBe(0);
      expect(await page.locator(farEndTrace).first().getAttribute("d")).not.toBe(traceAt33);
      expect(await page.locator('svg[role="img"]').filter({ visible: true }).getAttribute("aria-label")).toContain(`a ${dragged} series resistor`);
      expect(await page.getByTestId("resimulation-time").innerText()).toMatch(/\d+ ms/);

      await setResistor(page, "33 Ω", 33);
      expect(await page.locator(farEndTrace).first().getAttribute("d")).toBe(traceAt33);
      const failing = await submitAndRead(page, 1);
      expect(failing).toMatch(/Attempt 1: \d+ \/ 100 — not passed yet/);
      expect(failing).toMatch(/misread at some switching point/);
      expect(failing).toMatch(/Simulator verdict: fails: typical pixels misread it/);

      await setResistor(page, "240 Ω", 240);
      expect(await page.getByTestId("rule-preview").innerText()).toMatch(/meets the lab's rule/);
      const passing = await submitAndRead(page, 2);
      expect(passing).toMatch(/Attempt 2: \d+ \/ 100 — passed/);

      const history = page.getByTestId("attempt-history");
      await history.locator('[data-attempt="2"]').waitFor({ timeout: 30_000 });
      expect(await history.locator("[data-attempt]").evaluateAll((items) => items.map((item) => item.getAttribute("data-attempt")))).toEqual(["2", "1"]);
      expect(await history.locator('[data-attempt="1"]').innerText()).toMatch(/33 Ω[\s\S]*✗ not passed/);
      expect(await history.locator('[data-attempt="2"]').innerText()).toMatch(/240 Ω[\s\S]*✓ passed/);
      await saveScreenshot(page, "workbench-wide-graded");

      await page.getByRole("button", { name: "Redraw attempt 1" }).click();
      await page.getByRole("heading", { name: "Attempt 1 on the scope" }).waitFor({ timeout: 30_000 });
      await settled(page);
      expect(await page.getByText(/Redrawn from attempt 1 as it was graded \(33 Ω;/).count()).toBe(1);
      expect(await page.locator(farEndTrace).first().getAttribute("d")).toBe(traceAt33);
      expect(await resistorShown(page)).toBe("240 Ω");
      await saveScreenshot(page, "workbench-wide-reopened");
      expect(pageErrors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it("shows the newest attempts of a long history first and the older ones on request", async () => {
    const person = await createLearnerAtLab({ labSlug: LAB, password, label: "workbench-history" });
    const cookie = await createSession(person.id);
    const count = attemptPageSizes.default + 3;
    for (let i = 0; i < count; i += 1) {
      const response = await fetch(`${baseUrl}/api/labs/${LAB}/attempts`, {
        method: "POST",
        headers: { "content-type": "application/json", cookie: `${cookie.name}=${cookie.value}` },
        body: JSON.stringify({ choices: { main: { seriesResistance: i % 2 === 0 ? 33 : 150 } }, idempotencyKey: randomUUID() }),
      });
      expect(response.status).toBe(201);
    }
    const { context, page } = await openPage(browser, "wide");
    try {
      await signInThroughForm(page, person);
      await page.goto(`/labs/${LAB}`);
      const history = page.getByTestId("attempt-history");
      await history.locator(`[data-attempt="${count}"]`).waitFor({ timeout: 30_000 });
      const shown = () => history.locator("[data-attempt]").evaluateAll((items) => items.map((item) => Number(item.getAttribute("data-attempt"))));
      expect(await shown()).toEqual(Array.from({ length: attemptPageSizes.default }, (_, i) => count - i));
      // The next attempt is numbered from the newest, whatever the page holds.
      expect(await page.getByText(`This will be attempt ${count + 1}:`).count()).toBe(1);
      const older = page.getByRole("button", { name: "Show older attempts" });
      await older.scrollIntoViewIfNeeded();
      await saveScreenshot(page, "workbench-history-first-page");
      await older.click();
      await history.locator('[data-attempt="1"]').waitFor({ timeout: 30_000 });
      expect(await shown()).toEqual(Array.from({ length: count }, (_, i) => count - i));
      expect(await older.count()).toBe(0);
      await saveScreenshot(page, "workbench-history-all");
    } finally {
      await context.close();
    }
  });

  it("works at phone width: the run drawn upright, the controls and zoom reachable", async () => {
    const { context, page } = await openPage(browser, "narrow");
    try {
      await signInThroughForm(page, learner);
      await page.goto(`/labs/${LAB}`);
      await settled(page);
      expect(await page.locator('svg[role="img"]').filter({ visible: true }).count()).toBe(1);
      await page.getByRole("button", { name: "Series resistor (E24): one step up" }).click();
      await settled(page);
      await page.getByRole("button", { name: "Rising edge" }).click();
      expect(await page.getByText(/^bit \d+ of 16$/).innerText()).toMatch(/^bit \d+ of 16$/);
      const viewport = page.viewportSize()!;
      const pageWidth = await page.evaluate(() => document.documentElement.scrollWidth);
      expect(pageWidth).toBeLessThanOrEqual(viewport.width);
      await saveScreenshot(page, "workbench-narrow");
    } finally {
      await context.close();
    }
  });
});
