/**
 * A cohort too large for one screen: the progress grid shows it fifty learners at a time, while
 * search, the standing filter and sorting still reach every learner, so the one who needs
 * attention is found on the first page whatever page they would fall on by name.
 */
import { randomUUID } from "node:crypto";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { cohortMemberships, labAttempts, users } from "@/db/schema";
import { getCourse } from "@/lessons";
import { formatInUnit } from "@/lib/answers";
import { gradeWork, outcomeOf, scoreWork, variantSeedFor } from "@/lib/grading";
import { launchBrowser, openPage, saveScreenshot, signInAs } from "./support/browser";
import { createTaughtCohort } from "./support/taught-cohort";

const LEARNERS = 120;
const cohortName = `Evening course, large intake ${randomUUID().slice(0, 4)}`;
const name = (n: number) => `Grid Learner ${String(n).padStart(3, "0")}`;
/** Last by name, so by name alone they would sit on the last page. */
const stuckLearner = name(LEARNERS);

let browser: Browser;
let cohortId: string;

async function createLargeCohort(): Promise<void> {
  const cohort = await createTaughtCohort({ name: cohortName, startedDaysAgo: 10, endsInDays: 80 });
  cohortId = cohort.cohortId;
  const learners = await db
    .insert(users)
    .values(
      Array.from({ length: LEARNERS }, (_, i) => ({
        schoolId: cohort.schoolId,
        email: `grid-${i + 1}.${randomUUID().slice(0, 8)}@browser.example`,
        name: name(i + 1),
        role: "learner" as const,
        passwordHash: "not-a-login",
      })),
    )
    .returning({ id: users.id, name: users.name });
  await db.insert(cohortMemberships).values(learners.map((learner) => ({ cohortId, userId: learner.id, role: "learner" as const })));

  // Five failed attempts at the first lab, all this week: stuck by the grid's rule, not idle.
  const stuck = learners.find((learner) => learner.name === stuckLearner)!;
  const lab = getCourse().lessons[0]!.lab!;
  const seed = variantSeedFor(stuck.id, lab.slug);
  const answers = Object.fromEntries(lab.questions.map((q) => [q.id, formatInUnit(q.answer.value, q.answer.unit)]));
  const work = gradeWork({ lab, seed, choices: lab.reference.mistakes[0].choices, answers });
  for (let attempt = 1; attempt <= 5; attempt += 1) {
    const grade = scoreWork(lab, work, attempt);
    await db.insert(labAttempts).values({
      userId: stuck.id,
      labSlug: lab.slug,
      cohortId,
      idempotencyKey: randomUUID(),
      attemptNumber: attempt,
      variantSeed: seed,
      choices: work.choices,
      outcome: outcomeOf(grade),
      score: grade.score,
      passed: grade.passed,
      createdAt: new Date(Date.now() - (6 - attempt) * 3_600_000),
    });
  }
}

beforeAll(async () => {
  await createLargeCohort();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("the progress grid of a large cohort", () => {
  it("pages through fifty learners at a time, and search, filter and sort reach every learner", async () => {
    const { context, page } = await openPage(browser, "wide");
    try {
      await signInAs(page, "instructor");
      await page.goto(`/cohorts/${cohortId}`);
      await page.getByRole("heading", { level: 1, name: cohortName }).waitFor();
      const names = () => page.locator("tbody tr th a").allTextContents();

      expect(await page.getByText(`Showing 1–50 of ${LEARNERS} learners`).isVisible()).toBe(true);
      expect(await page.getByText("Page 1 of 3").isVisible()).toBe(true);
      expect(await names()).toHaveLength(50);
      expect(await names()).not.toContain(stuckLearner);
      expect(await page.getByRole("button", { name: "← Previous 50" }).isDisabled()).toBe(true);

      await page.getByRole("button", { name: "Next 50 →" }).click();
      await page.getByText(`Showing 51–100 of ${LEARNERS} learners`).waitFor();
      expect((await names())[0]).toBe(name(51));
      await page.getByRole("button", { name: "Next 50 →" }).click();
      await page.getByText(`Showing 101–120 of ${LEARNERS} learners`).waitFor();
      expect(await names()).toHaveLength(20);
      expect(await page.getByRole("button", { name: "Next 50 →" }).isDisabled()).toBe(true);

      // Sorting by standing starts again at page 1, with the learner who needs attention first.
      await page.getByRole("button", { name: "Standing", exact: true }).click();
      await page.getByText(`Showing 1–50 of ${LEARNERS} learners`).waitFor();
      expect((await names())[0]).toBe(stuckLearner);
      await saveScreenshot(page, "large-cohort-grid-wide");

      await page.getByRole("button", { name: "Clear sorting and filters" }).click();
      await page.getByLabel("Find a learner").fill("Learner 117");
      await page.getByText(`Showing 1 of ${LEARNERS} learners`).waitFor();
      expect(await names()).toEqual([name(117)]);
      expect(await page.getByRole("navigation", { name: "Grid pages" }).count()).toBe(0);
    } finally {
      await context.close();
    }
  });
});
