/**
 * The workbench remembers and takes values as the trade writes them, in a real browser against the
 * built app: choices kept over a reload (lab 6, the capstone's three runs, lab 1's timing and typed
 * answers), one click back to the scenario, a save that fails saying so, a redrawn attempt brought
 * into view, resistor values typed and snapped, sliders stepped from the keyboard, and at phone
 * width the scope on screen beside the control being changed.
 */
import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, openPage, saveScreenshot, signInThroughForm } from "./support/browser";
import { createLearnerAtLab } from "./support/learner-at-lab";

const LAB6 = "lone-lead-termination";
const CAPSTONE = "capstone-installation";
const LAB1 = "timing-budget";
const LAB7 = "beside-ground-termination";
const password = "the workbench remembers";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

async function signedInAt(labSlug: string, viewport: "wide" | "narrow" = "wide") {
  const learner = await createLearnerAtLab({ labSlug, password, label: `memory-${labSlug}` });
  const opened = await openPage(browser, viewport);
  const errors: string[] = [];
  opened.page.on("pageerror", (error) => errors.push(error.message));
  await signInThroughForm(opened.page, learner);
  await opened.page.goto(`/labs/${labSlug}`);
  await settled(opened.page);
  return { ...opened, errors };
}

/** Waits until the preview shows the full run for the controls as they are now. */
async function settled(page: Page): Promise<void> {
  await page.locator('[data-testid="workbench-preview"][data-pending="false"]').waitFor({ timeout: 60_000 });
  await page.locator('[data-testid="scope-chart"] path.recharts-line-curve').first().waitFor({ timeout: 60_000 });
}

const resistor = (page: Page): Locator => page.getByRole("slider", { name: /^Series resistor/ });
const shown = async (slider: Locator) => slider.getAttribute("aria-valuetext");

/** Resolves once the server has stored a save of the workbench whose body contains `fragment`. */
function savedWith(page: Page, labSlug: string, fragment: string) {
  return page.waitForResponse(
    (response) => response.url().endsWith(`/api/labs/${labSlug}/draft`) && response.ok() && (response.request().postData() ?? "").includes(fragment),
    { timeout: 30_000 },
  );
}

async function typeResistor(page: Page, entry: string): Promise<void> {
  const field = page.getByLabel("Or type a value");
  await field.fill(entry);
  await field.press("Enter");
}

async function reload(page: Page): Promise<void> {
  await page.reload();
  await settled(page);
}

describe("the workbench remembers", () => {
  it("lab 6: a passing resistor is there after a reload, with the rule met; one click goes back to the scenario", async () => {
    const { context, page, errors } = await signedInAt(LAB6);
    try {
      expect(await shown(resistor(page))).toBe("33 Ω");
      const saved = savedWith(page, LAB6, '"seriesResistance":240');
      await typeResistor(page, "240R");
      await page.getByText("Set to 240 Ω, an E24 value.").waitFor();
      await settled(page);
      await saved;
      expect(await page.getByTestId("rule-preview").innerText()).toMatch(/meets the lab's rule/);
      await page.getByRole("button", { name: "Submit for grading" }).click();
      await page.getByTestId("grading-result").getByText(/Attempt 1: \d+ \/ 100 — passed/).waitFor({ timeout: 60_000 });

      await reload(page);
      expect(await shown(resistor(page))).toBe("240 Ω");
      expect(await page.getByTestId("rule-preview").innerText()).toMatch(/✓ On the workbench this run meets the lab's rule/);
      await page.locator('[data-testid="draft-status"][data-status="saved"]').waitFor();

      const reset = savedWith(page, LAB6, '"seriesResistance":33');
      await page.getByRole("button", { name: "Reset to the scenario" }).click();
      expect(await shown(resistor(page))).toBe("33 Ω");
      expect(await page.getByRole("button", { name: "Reset to the scenario" }).isDisabled()).toBe(true);
      await reset;
      await reload(page);
      expect(await shown(resistor(page))).toBe("33 Ω");
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it("keeps a change made just before the page is left, and says so when a save fails", async () => {
    const { context, page } = await signedInAt(LAB6);
    try {
      // Reloaded at once, well within the wait before a save: the page saves as it goes.
      await resistor(page).focus();
      await page.keyboard.press("End");
      expect(await shown(resistor(page))).toBe("1 kΩ");
      await reload(page);
      expect(await shown(resistor(page))).toBe("1 kΩ");

      await page.route(`**/api/labs/${LAB6}/draft`, (route) => route.abort("failed"));
      await typeResistor(page, "150 ohm");
      const alert = page.locator('[data-testid="draft-status"][data-status="failed"]');
      await alert.waitFor({ timeout: 30_000 });
      expect(await alert.innerText()).toMatch(/Your latest choices are not saved yet: The workbench could not reach the server/);
      await alert.scrollIntoViewIfNeeded();
      await saveScreenshot(page, "workbench-save-failed", { fullPage: false });
      await page.unroute(`**/api/labs/${LAB6}/draft`);
      const saved = savedWith(page, LAB6, '"seriesResistance":150');
      await alert.getByRole("button", { name: "Save again" }).click();
      await saved;
      await page.locator('[data-testid="draft-status"][data-status="saved"]').waitFor();
      await reload(page);
      expect(await shown(resistor(page))).toBe("150 Ω");
    } finally {
      await context.close();
    }
  });

  it("the capstone: each of the three runs keeps its own resistor after a reload, and all go back to the scenario at once", async () => {
    const { context, page, errors } = await signedInAt(CAPSTONE);
    const runs = [
      { tab: "Arch: lone data lead", entry: "240R", value: "240 Ω" },
      { tab: "Facade: data beside ground", entry: "43 Ω", value: "43 Ω" },
      { tab: "Canopy: twisted pair or coax", entry: "47 ohm", value: "47 Ω" },
    ];
    try {
      const saved = savedWith(page, CAPSTONE, '"canopy":{"seriesResistance":47}');
      for (const run of runs) {
        await page.getByRole("tab", { name: run.tab }).click();
        await typeResistor(page, run.entry);
        await expect.poll(() => shown(resistor(page)), { timeout: 10_000 }).toBe(run.value);
      }
      const body = (await saved).request().postData() ?? "";
      expect(JSON.parse(body).choices).toEqual({ arch: { seriesResistance: 240 }, facade: { seriesResistance: 43 }, canopy: { seriesResistance: 47 } });

      await reload(page);
      for (const run of runs) {
        await page.getByRole("tab", { name: run.tab }).click();
        expect(await shown(resistor(page)), run.tab).toBe(run.value);
      }
      await saveScreenshot(page, "workbench-capstone-reopened");

      const reset = savedWith(page, CAPSTONE, '"arch":{"seriesResistance":33}');
      await page.getByRole("button", { name: "Reset every run to the scenario" }).click();
      await reset;
      await reload(page);
      for (const run of runs) {
        await page.getByRole("tab", { name: run.tab }).click();
        expect(await shown(resistor(page)), run.tab).toBe("33 Ω");
      }
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it("lab 1: the chosen high times and the typed answers are there after a reload", async () => {
    const { context, page } = await signedInAt(LAB1);
    try {
      const zero = page.getByRole("slider", { name: "High time of a 0 bit" });
      expect(await shown(zero)).toBe("550 ns");
      await zero.focus();
      for (let i = 0; i < 3; i += 1) await page.keyboard.press("ArrowLeft");
      expect(await shown(zero)).toBe("400 ns");
      await page.locator("#answer-frame-time").fill("11.1 ms");
      const saved = savedWith(page, LAB1, '"refresh-rate":"90 Hz"');
      await page.locator("#answer-refresh-rate").fill("90 Hz");
      await saved;
      await reload(page);
      expect(await shown(page.getByRole("slider", { name: "High time of a 0 bit" }))).toBe("400 ns");
      expect(await page.locator("#answer-frame-time").inputValue()).toBe("11.1 ms");
      expect(await page.locator("#answer-refresh-rate").inputValue()).toBe("90 Hz");
    } finally {
      await context.close();
    }
  });

  it("brings the scope into view when a past attempt is redrawn", async () => {
    const { context, page } = await signedInAt(LAB6);
    try {
      await page.getByRole("button", { name: "Submit for grading" }).click();
      await page.getByTestId("grading-result").getByText(/Attempt 1:/).waitFor({ timeout: 60_000 });
      const redraw = page.getByRole("button", { name: "Redraw attempt 1" });
      await redraw.scrollIntoViewIfNeeded();
      expect(await page.getByTestId("scope-card").evaluate((card) => card.getBoundingClientRect().top)).toBeLessThan(0);
      await redraw.click();
      await page.getByRole("heading", { name: "Attempt 1 on the scope" }).waitFor({ timeout: 30_000 });
      await page.waitForFunction(
        () => {
          const box = document.querySelector('[data-testid="scope-card"]')!.getBoundingClientRect();
          return box.top >= 0 && box.top < 40;
        },
        undefined,
        { timeout: 10_000 },
      );
      await saveScreenshot(page, "workbench-redrawn-in-view", { fullPage: false });
    } finally {
      await context.close();
    }
  });
});

describe("values as the trade writes them", () => {
  it("takes typed resistor values, snaps them to the control's series with a note, and refuses what is not a resistance", async () => {
    const { context, page } = await signedInAt(LAB6);
    try {
      const cases = [
        { entry: "47R", value: "47 Ω", note: "Set to 47 Ω, an E24 value." },
        { entry: "1K", value: "1 kΩ", note: "Set to 1 kΩ, an E24 value." },
        { entry: "50R", value: "51 Ω", note: "50 Ω is not an E24 value; snapped to the nearest, 51 Ω." },
        { entry: "4k7", value: "1 kΩ", note: "4.7 kΩ is above this control's range; set to its highest value, 1 kΩ." },
        { entry: "47 Ω", value: "47 Ω", note: "Set to 47 Ω, an E24 value." },
        { entry: "47 ohm", value: "47 Ω", note: "Set to 47 Ω, an E24 value." },
      ];
      for (const { entry, value, note } of cases) {
        await typeResistor(page, entry);
        await page.getByText(note, { exact: true }).waitFor({ timeout: 10_000 });
        expect(await shown(resistor(page)), entry).toBe(value);
      }
      await typeResistor(page, "47 V");
      await page.getByText("'47 V' is a voltage; this asks for a resistance.").waitFor({ timeout: 10_000 });
      expect(await page.getByLabel("Or type a value").getAttribute("aria-invalid")).toBe("true");
      expect(await shown(resistor(page))).toBe("47 Ω");
      await page.getByLabel("Or type a value").scrollIntoViewIfNeeded();
      await saveScreenshot(page, "workbench-typed-value", { fullPage: false });
    } finally {
      await context.close();
    }
  });

  it("an E96 control takes 321R in one entry instead of a hundred clicks", async () => {
    const { context, page } = await signedInAt(LAB7);
    try {
      await typeResistor(page, "321R");
      await page.getByText("321 Ω is not an E96 value; snapped to the nearest, 324 Ω.").waitFor({ timeout: 10_000 });
      expect(await shown(page.getByRole("slider", { name: "Series resistor (E96)" }))).toBe("324 Ω");
    } finally {
      await context.close();
    }
  });

  it("steps every slider from the keyboard: arrows, Page Up/Down, Home and End, with the value read out", async () => {
    const { context, page } = await signedInAt(LAB6);
    try {
      const slider = resistor(page);
      expect(await slider.getAttribute("aria-describedby")).toBeTruthy();
      await slider.focus();
      await page.keyboard.press("Home");
      expect(await shown(slider)).toBe("10 Ω");
      await page.keyboard.press("ArrowRight");
      expect(await shown(slider)).toBe("11 Ω");
      await page.keyboard.press("ArrowUp");
      expect(await shown(slider)).toBe("12 Ω");
      await page.keyboard.press("PageUp");
      const afterPageUp = await shown(slider);
      expect(Number.parseFloat(afterPageUp!)).toBeGreaterThan(15);
      await page.keyboard.press("PageDown");
      expect(await shown(slider)).toBe("12 Ω");
      await page.keyboard.press("End");
      expect(await shown(slider)).toBe("1 kΩ");
      await page.keyboard.press("ArrowLeft");
      expect(await shown(slider)).toBe("910 Ω");
      expect(await page.locator("output").first().innerText()).toBe("910 Ω");

      // The lessons' figures step the same way.
      await page.goto("/lessons/series-termination");
      const figureSlider = page.getByRole("slider").first();
      await figureSlider.focus();
      await page.keyboard.press("Home");
      const lowest = await shown(figureSlider);
      await page.keyboard.press("End");
      const highest = await shown(figureSlider);
      expect(highest).not.toBe(lowest);
      await page.keyboard.press("ArrowLeft");
      expect(await shown(figureSlider)).not.toBe(highest);
      await page.keyboard.press("PageDown");
      expect(await shown(figureSlider)).not.toBe(highest);

      const { page: timingPage, context: timingContext } = await signedInAt(LAB1);
      try {
        const one = timingPage.getByRole("slider", { name: "High time of a 1 bit" });
        await one.focus();
        await timingPage.keyboard.press("End");
        expect(await shown(one)).toBe("1200 ns");
        await timingPage.keyboard.press("Home");
        expect(await shown(one)).toBe("100 ns");
        await timingPage.keyboard.press("ArrowRight");
        expect(await shown(one)).toBe("150 ns");
      } finally {
        await timingContext.close();
      }
    } finally {
      await context.close();
    }
  });
});

/** Whether the element's box lies inside the viewport and nothing covers its centre. */
async function onScreen(locator: Locator): Promise<{ inside: boolean; uncovered: boolean; box: { top: number; bottom: number } }> {
  return locator.evaluate((element) => {
    const box = element.getBoundingClientRect();
    const inside = box.top >= 0 && box.left >= 0 && box.bottom <= window.innerHeight && box.right <= window.innerWidth && box.height > 0;
    const hit = document.elementFromPoint(box.left + box.width / 2, box.top + box.height / 2);
    return { inside, uncovered: hit !== null && (hit === element || element.contains(hit)), box: { top: box.top, bottom: box.bottom } };
  });
}

describe("the workbench on a phone (390 px)", () => {
  it("keeps the scope on screen beside the control being changed", async () => {
    const { context, page, errors } = await signedInAt(LAB6, "narrow");
    try {
      const slider = resistor(page);
      const chart = page.getByTestId("scope-chart");
      // Scroll down as a learner's thumb would, until the resistor's slider shows under the scope.
      for (let i = 0; i < 40 && !(await onScreen(slider)).uncovered; i += 1) await page.mouse.wheel(0, 120);
      await saveScreenshot(page, "workbench-phone-scrolled", { fullPage: false });
      expect(await onScreen(slider)).toMatchObject({ inside: true, uncovered: true });
      expect(await onScreen(chart)).toMatchObject({ inside: true });

      // Held and dragged: both stay in view while the control moves.
      const box = (await slider.boundingBox())!;
      const y = box.y + box.height / 2;
      await page.mouse.move(box.x + box.width * 0.25, y);
      await page.mouse.down();
      await page.mouse.move(box.x + box.width * 0.5, y, { steps: 8 });
      await page.getByTestId("drag-preview-traces").waitFor({ timeout: 30_000 });
      expect(await onScreen(slider)).toMatchObject({ inside: true });
      expect(await onScreen(chart)).toMatchObject({ inside: true });
      expect(await onScreen(page.getByTestId("drag-preview-traces"))).toMatchObject({ inside: true });
      await saveScreenshot(page, "workbench-phone-dragging", { fullPage: false });
      await page.mouse.up();
      await settled(page);

      // Stepped with the buttons beside it: the same.
      await page.getByRole("button", { name: "Series resistor (E24): one step up" }).click();
      await settled(page);
      expect(await onScreen(slider)).toMatchObject({ inside: true, uncovered: true });
      expect(await onScreen(chart)).toMatchObject({ inside: true });
      await saveScreenshot(page, "workbench-phone-stepped", { fullPage: false });

      const pageWidth = await page.evaluate(() => document.documentElement.scrollWidth);
      expect(pageWidth).toBeLessThanOrEqual(390);
      await saveScreenshot(page, "workbench-phone-full");
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
