import { asc, eq } from "drizzle-orm";
import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { markLessonsCompleted } from "@/db/queries/progress";
import { cohortMemberships, quickCheckAnswers } from "@/db/schema";
import { getLesson, type Lesson } from "@/lessons";
import { correctChoice, presentChoiceCheck, quickCheckSeed } from "@/lib/quick-checks";
import { createPerson, findDemoCohortId } from "../integration/support/people";
import { launchBrowser, openPage, saveScreenshot, screenshotDir, signInAs, signInThroughForm, type viewports } from "./support/browser";

// A learner answers lesson 1's pick-the-trace and predict-then-run checks in a real browser: the
// traces are drawn before the first, the run only after a prediction is committed, both are
// graded on the server and kept, and the cohort's instructor reads them in the learner's record.

const password = "reading far-end traces";
const lesson = getLesson("pixel-data-stream")!;
type Choice = Extract<Lesson["blocks"][number], { kind: "choice" }>;
const pickTrace = lesson.blocks.find((b): b is Choice => b.kind === "choice" && b.ask === "pick-trace")!;
const predict = lesson.blocks.find((b): b is Choice => b.kind === "choice" && b.ask === "predict")!;
const lessonTwo = getLesson("logic-levels")!;
const diagnose = lessonTwo.blocks.find((b): b is Choice => b.kind === "choice" && b.ask === "diagnose")!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function startSession(viewport: keyof typeof viewports) {
  const learner = await createPerson({ role: "learner", password, label: "choice-checks-e2e" });
  await db.insert(cohortMemberships).values({ cohortId: await findDemoCohortId(), userId: learner.id, role: "learner" });
  const { context, page } = await openPage(browser, viewport);
  const errors: string[] = [];
  page.on("pageerror", (error) => errors.push(error.message));
  await signInThroughForm(page, { email: learner.email, password });
  await page.goto(`/lessons/${lesson.slug}`);
  return { learner, context, page, errors };
}

/** The learner's options for a check: the right one and a wrong one, by their words on the page. */
function optionsFor(learnerId: string, check: Choice, slug = lesson.slug) {
  const seed = quickCheckSeed(learnerId, slug, check.id);
  const options = presentChoiceCheck(check, seed).options;
  const right = correctChoice(check, seed);
  return { right: options.find((o) => o.key === right)!.label, wrong: options.find((o) => o.key !== right)!.label };
}

async function choose(check: Locator, label: string, button: string, expected: string): Promise<void> {
  await check.getByRole("radio", { name: label, exact: true }).check();
  await check.getByRole("button", { name: button }).click();
  await check.getByRole("status").getByText(expected, { exact: true }).waitFor({ timeout: 15_000 });
}

const section = (page: Page, check: Choice) => page.locator(`#check-${check.id}`);

describe("quick checks answered by choosing", () => {
  it("picks the trace and predicts a run on a wide screen, and the instructor reads both answers", async () => {
    const { learner, context, page, errors } = await startSession("wide");
    try {
      const picking = section(page, pickTrace);
      expect(await picking.locator("[data-trace]").count()).toBe(pickTrace.runs.length);
      expect(await picking.getByText(/^The run:/).isVisible()).toBe(true);
      const pick = optionsFor(learner.id, pickTrace);
      await picking.scrollIntoViewIfNeeded();
      await picking.screenshot({ path: `${screenshotDir}/pick-trace-before-wide.png` });
      await choose(picking, pick.wrong, "Check answer", `Not yet: ${pick.wrong} is not the answer.`);
      await picking.getByText("Hint", { exact: true }).waitFor();
      await choose(picking, pick.right, "Check answer", `Correct: ${pick.right}.`);
      await picking.getByText("Why", { exact: true }).waitFor();
      await picking.screenshot({ path: `${screenshotDir}/pick-trace-answered-wide.png` });

      const predicting = section(page, predict);
      // Nothing of the run is drawn until the learner has committed to a prediction.
      expect(await predicting.locator("[data-trace]").count()).toBe(0);
      const guess = optionsFor(learner.id, predict);
      await predicting.scrollIntoViewIfNeeded();
      await predicting.screenshot({ path: `${screenshotDir}/predict-before-wide.png` });
      await choose(predicting, guess.wrong, "Commit to this prediction", `Not yet: ${guess.wrong} is not the answer.`);
      await predicting.locator('[data-trace="run"]').waitFor({ timeout: 15_000 });
      await choose(predicting, guess.right, "Commit to this prediction", `Correct: ${guess.right}.`);
      await predicting.screenshot({ path: `${screenshotDir}/predict-answered-wide.png` });

      await page.reload();
      await section(page, pickTrace).getByRole("status").getByText(`You answered this correctly: ${pick.right}.`).waitFor();
      expect(await section(page, pickTrace).getByRole("radio", { name: pick.right, exact: true }).isChecked()).toBe(true);

      const rows = await db
        .select({ checkId: quickCheckAnswers.checkId, entry: quickCheckAnswers.entry, value: quickCheckAnswers.value, correct: quickCheckAnswers.correct })
        .from(quickCheckAnswers)
        .where(eq(quickCheckAnswers.userId, learner.id))
        .orderBy(asc(quickCheckAnswers.createdAt));
      expect(rows).toEqual([
        { checkId: pickTrace.id, entry: pick.wrong, value: null, correct: false },
        { checkId: pickTrace.id, entry: pick.right, value: null, correct: true },
        { checkId: predict.id, entry: guess.wrong, value: null, correct: false },
        { checkId: predict.id, entry: guess.right, value: null, correct: true },
      ]);
      expect(errors).toEqual([]);

      const teacher = await openPage(browser, "wide");
      try {
        await signInAs(teacher.page, "instructor");
        await teacher.page.goto(`/cohorts/${await findDemoCohortId()}/learners/${learner.id}`);
        const checks = teacher.page.getByRole("region", { name: "Quick checks" });
        await checks.getByText("Lesson 1 · The pixel data stream").waitFor();
        for (const entry of [pick.wrong, pick.right, guess.wrong, guess.right]) expect(await checks.getByText(entry, { exact: true }).count()).toBeGreaterThan(0);
        expect(await checks.getByText("Pick the trace").count()).toBe(1);
        await checks.screenshot({ path: `${screenshotDir}/instructor-quick-checks-wide.png` });
      } finally {
        await teacher.context.close();
      }
    } finally {
      await context.close();
    }
  });

  it("answers both on a phone, the traces and options fitting its width", async () => {
    const { learner, context, page, errors } = await startSession("narrow");
    try {
      const picking = section(page, pickTrace);
      const pick = optionsFor(learner.id, pickTrace);
      await picking.scrollIntoViewIfNeeded();
      await choose(picking, pick.right, "Check answer", `Correct: ${pick.right}.`);
      const width = await page.evaluate(() => document.documentElement.scrollWidth);
      expect(width).toBeLessThanOrEqual(390);
      await picking.screenshot({ path: `${screenshotDir}/pick-trace-narrow.png` });

      const predicting = section(page, predict);
      const guess = optionsFor(learner.id, predict);
      await predicting.scrollIntoViewIfNeeded();
      await choose(predicting, guess.right, "Commit to this prediction", `Correct: ${guess.right}.`);
      await predicting.locator('[data-trace="run"]').waitFor({ timeout: 15_000 });
      await predicting.screenshot({ path: `${screenshotDir}/predict-narrow.png` });
      await saveScreenshot(page, "lesson-1-choice-checks-narrow");
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it("diagnoses a failing run from its drawn trace and symptom on a phone", async () => {
    const { learner, context, page, errors } = await startSession("narrow");
    try {
      await markLessonsCompleted({ userId: learner.id, completions: [{ lessonSlug: lesson.slug, completedAt: new Date() }] });
      await page.goto(`/lessons/${lessonTwo.slug}`);
      const diagnosing = page.locator(`#check-${diagnose.id}`);
      expect(await diagnosing.locator('[data-trace="given"]').count()).toBe(1);
      expect(await diagnosing.getByText(/^On site:/).isVisible()).toBe(true);
      const fix = optionsFor(learner.id, diagnose, lessonTwo.slug);
      await diagnosing.scrollIntoViewIfNeeded();
      await choose(diagnosing, fix.wrong, "Check answer", `Not yet: ${fix.wrong} is not the answer.`);
      await choose(diagnosing, fix.right, "Check answer", `Correct: ${fix.right}.`);
      await diagnosing.screenshot({ path: `${screenshotDir}/diagnose-narrow.png` });
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
