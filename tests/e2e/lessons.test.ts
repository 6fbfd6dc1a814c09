import { and, asc, eq } from "drizzle-orm";
import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { cohortMemberships, lessonProgress, quickCheckAnswers } from "@/db/schema";
import { getLesson, type CheckBlock } from "@/lessons";
import { formatQuantity } from "@/lessons/numbers/format-quantity";
import { formatInUnit } from "@/lib/answers";
import { numericCheckFor, quickCheckSeed } from "@/lib/quick-checks";
import { createPerson, findDemoCohortId } from "../integration/support/people";
import { launchBrowser, openPage, saveScreenshot, screenshotDir, signInThroughForm, type viewports } from "./support/browser";

// A learner new to the course reads lesson 1, answers a quick check wrongly and then rightly,
// finds the answer kept after a reload, and meets lesson 2 locked. Each run uses a fresh learner so
// no other test's progress (or an earlier run's) decides what is open.

const password = "reading lesson one";
const lessonPath = "/lessons/pixel-data-stream";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function newLearner() {
  const learner = await createPerson({ role: "learner", password, label: "lessons-e2e" });
  await db.insert(cohortMemberships).values({ cohortId: await findDemoCohortId(), userId: learner.id, role: "learner" });
  return learner;
}

async function startSession(viewport: keyof typeof viewports) {
  const learner = await newLearner();
  const { context, page } = await openPage(browser, viewport);
  const errors: string[] = [];
  page.on("pageerror", (error) => errors.push(error.message));
  await signInThroughForm(page, { email: learner.email, password });
  return { learner, context, page, errors };
}

async function answer(check: Locator, entry: string, expected: string): Promise<void> {
  await check.getByLabel("Your answer").fill(entry);
  await check.getByRole("button", { name: "Check answer" }).click();
  await check.getByRole("status").getByText(expected, { exact: true }).waitFor({ timeout: 15_000 });
}

const lessonOne = getLesson("pixel-data-stream")!;
const bitRate = lessonOne.blocks.find((b): b is CheckBlock => b.kind === "check" && b.id === "bit-rate")!;
const checkCount = lessonOne.blocks.filter((b) => b.kind === "check" || b.kind === "choice").length;

/** The bit rate a learner's own copy of the first check asks for, as the page prints it. */
function bitRateFor(learnerId: string): { period: string; rate: number; shown: string } {
  const given = numericCheckFor(bitRate, quickCheckSeed(learnerId, lessonOne.slug, bitRate.id));
  return { period: formatQuantity(given.given.period!.value, given.given.period!), rate: given.answer.value, shown: formatInUnit(given.answer.value, "kHz") };
}

function firstCheck(page: Page): Locator {
  return page.getByRole("region", { name: `Quick check 1 of ${checkCount}` });
}

describe("lessons and the course map", () => {
  it("answers a quick check wrongly, then rightly, keeps it after a reload, and finds lesson 2 locked", async () => {
    const { learner, context, page, errors } = await startSession("wide");
    try {
      expect(new URL(page.url()).pathname).toBe("/learn");
      const lessonTwo = page.getByRole("listitem").filter({ hasText: "2. Logic levels and noise margin" });
      expect(await lessonTwo.getByText("Opens when lesson 1 is done.").isVisible()).toBe(true);
      expect(await lessonTwo.getByRole("link").count()).toBe(0);

      await page.getByRole("link", { name: "Start lesson 1" }).click();
      await page.waitForURL(`**${lessonPath}`);
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("The pixel data stream");
      // The lesson's numbers are printed from the simulator's defaults where it is loaded.
      const article = page.locator("article");
      expect(await article.getByText("f = 1 / 1.25 µs = 800,000 bits per second = 800 kHz.", { exact: true }).isVisible()).toBe(true);
      expect(await article.textContent()).not.toMatch(/\{\{|\}\}/);
      const frameTable = article.getByRole("table").filter({ hasText: "refresh rate" });
      expect(await frameTable.getByRole("row").filter({ hasText: "1,000" }).textContent()).toBe("1,00030.00 ms30.28 ms33.0 Hz");
      await frameTable.screenshot({ path: `${screenshotDir}/lesson-1-frame-table-wide.png` });

      const check = firstCheck(page);
      await answer(check, "3 V", "'3 V' is a voltage; this asks for a frequency.");
      expect(await check.getByText("Hint").count()).toBe(0);
      await answer(check, "500 kHz", "Not yet: 500 kHz is not the answer (answers within 1 % count).");
      expect(await check.getByText("The bit rate is one bit per period").isVisible()).toBe(true);
      const mine = bitRateFor(learner.id);
      await answer(check, mine.shown, `Correct: ${mine.shown}.`);
      await check.getByText("Why", { exact: true }).waitFor();
      expect(await check.getByText("Answered correctly").isVisible()).toBe(true);
      await check.screenshot({ path: `${screenshotDir}/lesson-1-check-answered-wide.png` });

      await page.reload();
      const reloaded = firstCheck(page);
      await reloaded.getByRole("status").getByText(`You answered this correctly: ${mine.shown}.`).waitFor();
      expect(await reloaded.getByLabel("Your answer").inputValue()).toBe(mine.shown);
      expect(await reloaded.getByText(`f = 1 / ${mine.period}`, { exact: false }).isVisible()).toBe(true);
      const rail = page.getByRole("complementary", { name: "In this lesson" });
      expect(await rail.getByText(`Quick checks: 1 of ${checkCount} answered correctly`).isVisible()).toBe(true);
      await saveScreenshot(page, "lesson-1-wide");

      const rows = await db
        .select({ entry: quickCheckAnswers.entry, value: quickCheckAnswers.value, correct: quickCheckAnswers.correct, checkId: quickCheckAnswers.checkId })
        .from(quickCheckAnswers)
        .where(eq(quickCheckAnswers.userId, learner.id))
        .orderBy(asc(quickCheckAnswers.createdAt));
      expect(rows).toEqual([
        { entry: "3 V", value: null, correct: false, checkId: "bit-rate" },
        { entry: "500 kHz", value: 500e3, correct: false, checkId: "bit-rate" },
        { entry: mine.shown, value: expect.closeTo(Number(mine.shown.replace(" kHz", "")) * 1e3, 6), correct: true, checkId: "bit-rate" },
      ]);
      const [opened] = await db
        .select()
        .from(lessonProgress)
        .where(and(eq(lessonProgress.userId, learner.id), eq(lessonProgress.lessonSlug, "pixel-data-stream")));
      expect(opened).toMatchObject({ completedAt: null });

      await page.getByRole("link", { name: "Course map" }).first().click();
      await page.waitForURL("**/learn");
      const lessonOneItem = page.getByRole("listitem").filter({ hasText: "1. The pixel data stream" });
      expect(await lessonOneItem.getByText(`Quick checks 1 of ${checkCount} right`).isVisible()).toBe(true);
      expect(await page.getByRole("link", { name: "Continue lesson 1" }).isVisible()).toBe(true);
      expect(await page.getByRole("listitem").filter({ hasText: "2. Logic levels and noise margin" }).getByText("Locked").isVisible()).toBe(true);
      await saveScreenshot(page, "course-map-wide");

      await page.goto("/lessons/logic-levels");
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("Finish lesson 1 first");
      expect(await page.getByRole("link", { name: "Go to lesson 1" }).isVisible()).toBe(true);
      await saveScreenshot(page, "lesson-locked-wide");
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it("redraws the pulse-train figure from the keyboard and reads a check on a phone", async () => {
    const { learner, context, page, errors } = await startSession("narrow");
    try {
      await page.goto(lessonPath);
      const figure = page.getByRole("figure", { name: "Pulse train" });
      await figure.getByText("the pixel reads 01101000: every bit as sent.", { exact: false }).waitFor();
      const slider = figure.getByRole("slider", { name: "High time of a 1 bit" });
      await slider.focus();
      for (let i = 0; i < 5; i += 1) await page.keyboard.press("ArrowLeft");
      expect(await slider.getAttribute("aria-valuetext")).toBe("550 ns");
      await figure.getByText("the pixel reads 00000000: 3 of 8 bits wrong.", { exact: false }).waitFor();
      await figure.getByRole("button", { name: "Bit 1: 0" }).click();
      await figure.getByText("Sent 11101000", { exact: false }).waitFor();
      await figure.screenshot({ path: `${screenshotDir}/lesson-1-figure-narrow.png` });

      const check = firstCheck(page);
      const mine = bitRateFor(learner.id);
      await answer(check, `${Number((mine.rate / 1e6).toPrecision(4))}MHz`, `Correct: ${mine.shown}.`);
      await saveScreenshot(page, "lesson-1-narrow");
      await page.goto("/learn");
      await saveScreenshot(page, "course-map-narrow");
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
