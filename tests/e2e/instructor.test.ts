import { randomUUID } from "node:crypto";
import { readFile } from "node:fs/promises";
import { and, eq } from "drizzle-orm";
import Papa from "papaparse";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { demoCohorts, demoPassword } from "@/db/demo-data";
import { cohortMemberships, labAttempts, users } from "@/db/schema";
import { getCourse, getLab } from "@/lessons";
import { formatInUnit } from "@/lib/answers";
import { gradeWork, outcomeOf, scoreWork, variantSeedFor } from "@/lib/grading";
import { launchBrowser, openPage, saveScreenshot, signInAs, signInThroughForm } from "./support/browser";
import { createTaughtCohort } from "./support/taught-cohort";

// The instructor's side of a running cohort in a real browser: the progress grid sorted and
// filtered, a stuck learner called out in words, a learner's attempt redrawn on the scope, and
// the grade book downloaded. The cohort is made here, taught by the seeded instructor, with
// attempts graded by the real grader, so the grid has something to show.

const day = 86_400_000;
const labSlugs = getCourse().lessons.flatMap((lesson) => (lesson.lab ? [lesson.lab.slug] : []));
const cohortName = `Data lines — late autumn ${randomUUID().slice(0, 4)}`;

const people = {
  steady: "Marisol Quenneville",
  stuck: "Oskar Delacroix-Imai",
  silent: "Tamsin Okonkwo-Berg",
  quick: "Zeno Haraldsen",
} as const;

let browser: Browser;
let cohortId: string;
const learnerIds = {} as Record<keyof typeof people, string>;

async function addAttempts(userId: string, labSlug: string, good: boolean, daysAgo: number[]) {
  const lab = getLab(labSlug)!;
  const seed = variantSeedFor(userId, labSlug);
  const answers = Object.fromEntries(lab.questions.map((q) => [q.id, formatInUnit(q.answer.value, q.answer.unit)]));
  const work = gradeWork({ lab, seed, choices: good ? lab.reference.solution : lab.reference.mistakes[0].choices, answers });
  const existing = await db.$count(labAttempts, and(eq(labAttempts.userId, userId), eq(labAttempts.labSlug, labSlug)));
  for (const [i, ago] of daysAgo.entries()) {
    const grade = scoreWork(lab, work, existing + i + 1);
    await db.insert(labAttempts).values({
      userId,
      labSlug,
      cohortId,
      idempotencyKey: randomUUID(),
      attemptNumber: grade.attemptNumber,
      variantSeed: seed,
      choices: work.choices,
      outcome: outcomeOf(grade),
      score: grade.score,
      passed: grade.passed,
      createdAt: new Date(Date.now() - ago * day),
    });
  }
}

async function createCohortWithWork(): Promise<void> {
  const cohort = await createTaughtCohort({ name: cohortName, startedDaysAgo: 20, endsInDays: 70 });
  cohortId = cohort.cohortId;
  for (const [key, name] of Object.entries(people) as [keyof typeof people, string][]) {
    const [learner] = await db
      .insert(users)
      .values({
        schoolId: cohort.schoolId,
        email: `${key}.${randomUUID().slice(0, 8)}@browser.example`,
        name,
        role: "learner",
        passwordHash: "not-a-login",
      })
      .returning();
    learnerIds[key] = learner!.id;
    await db.insert(cohortMemberships).values({ cohortId, userId: learner!.id, role: "learner", createdAt: new Date(Date.now() - 20 * day) });
  }
  await addAttempts(learnerIds.steady, labSlugs[0]!, false, [6]);
  await addAttempts(learnerIds.steady, labSlugs[0]!, true, [5]);
  await addAttempts(learnerIds.steady, labSlugs[1]!, true, [2]);
  await addAttempts(learnerIds.stuck, labSlugs[0]!, true, [9]);
  await addAttempts(learnerIds.stuck, labSlugs[1]!, false, [4, 3, 3, 2, 1]);
  await addAttempts(learnerIds.quick, labSlugs[0]!, true, [1]);
}

/** Learner names down the grid, as shown. */
function gridNames(page: Page): Promise<string[]> {
  return page.locator("tbody tr th a").allTextContents();
}

async function openCohortFromHome(page: Page): Promise<void> {
  await signInAs(page, "instructor");
  await page.getByRole("link", { name: new RegExp(cohortName) }).click();
  await page.waitForURL(`**/cohorts/${cohortId}`);
  await page.getByRole("heading", { level: 1, name: cohortName }).waitFor();
}

async function pageWidthFits(page: Page): Promise<boolean> {
  return page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);
}

beforeAll(async () => {
  await createCohortWithWork();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("an instructor with a running cohort", () => {
  it("sorts and filters the progress grid, sees who is stuck and why, and downloads the grade book (wide)", async () => {
    const { context, page } = await openPage(browser, "wide");
    const errors: string[] = [];
    page.on("pageerror", (error) => errors.push(error.message));
    try {
      await openCohortFromHome(page);
      expect(await page.getByText("Showing 4 of 4 learners").isVisible()).toBe(true);
      expect(await gridNames(page)).toEqual([people.steady, people.stuck, people.silent, people.quick]);

      const stuckRow = page.locator(`tbody tr[data-standing="stuck"]`, { hasText: people.stuck });
      expect(await stuckRow.getByText("Needs attention").isVisible()).toBe(true);
      expect(await stuckRow.getByText(/^5 failed attempts at Lab 2 \(.+\) without a pass$/).isVisible()).toBe(true);
      const silentRow = page.locator("tbody tr", { hasText: people.silent });
      expect(await silentRow.getByText(/^No activity in the 20 days since the course opened to them$/).isVisible()).toBe(true);
      await saveScreenshot(page, "instructor-grid-wide");

      await page.getByRole("button", { name: "Lab 2", exact: true }).click();
      const lab2Header = page.locator("thead th", { has: page.getByRole("button", { name: "Lab 2", exact: true }) });
      expect(await lab2Header.getAttribute("aria-sort")).toBe("descending");
      expect((await gridNames(page)).slice(0, 2)).toEqual([people.steady, people.stuck]);
      expect((await gridNames(page)).slice(2).sort()).toEqual([people.quick, people.silent].sort());
      await page.getByRole("button", { name: "Lab 2", exact: true }).click();
      expect(await lab2Header.getAttribute("aria-sort")).toBe("ascending");
      expect((await gridNames(page)).slice(0, 2)).toEqual([people.stuck, people.steady]);

      await page.getByLabel("Show").selectOption({ label: "Needs attention (2)" });
      expect((await gridNames(page)).sort()).toEqual([people.silent, people.stuck].sort());
      expect(await page.getByText("Showing 2 of 4 learners").isVisible()).toBe(true);
      await page.getByLabel("Show").selectOption({ label: "Everyone (4)" });
      await page.getByLabel("Find a learner").fill("haralds");
      expect(await gridNames(page)).toEqual([people.quick]);
      await page.getByLabel("Find a learner").fill("nobody-by-this-name");
      expect(await page.getByText("No learner matches these filters.").isVisible()).toBe(true);
      await page.getByRole("button", { name: "Clear sorting and filters" }).click();
      expect(await gridNames(page)).toEqual([people.steady, people.stuck, people.silent, people.quick]);

      expect(await page.getByRole("img", { name: /learners? scored on Lab 1/ }).isVisible()).toBe(true);
      expect(await page.getByText(/^10 lab attempts over \d+ days: 4 passed, 6 failed\./).isVisible()).toBe(true);

      const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Download grade book (CSV)" }).click()]);
      expect(download.suggestedFilename()).toMatch(/^gradebook-data-lines-late-autumn-[a-z0-9]+-\d{4}-\d{2}-\d{2}\.csv$/);
      const text = (await readFile((await download.path())!, "utf8")).replace(/^\uFEFF/, "");
      const { data } = Papa.parse<string[]>(text, { newline: "\r\n" });
      const [header, ...rows] = data;
      const stuckLine = rows.find((row) => row[0] === people.stuck)!;
      expect(stuckLine[header.indexOf("Lab 1 passed")]).toBe("yes");
      expect(stuckLine[header.indexOf("Lab 2 passed")]).toBe("no");
      expect(stuckLine[header.indexOf("Needs attention")]).toMatch(/^5 failed attempts at Lab 2/);
      expect(rows.map((row) => row[0]).sort()).toEqual(Object.values(people).sort());
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it("opens a learner and redraws an attempt on the scope from its stored inputs (wide)", async () => {
    const { context, page } = await openPage(browser, "wide");
    const errors: string[] = [];
    page.on("pageerror", (error) => errors.push(error.message));
    try {
      await openCohortFromHome(page);
      await page.getByRole("link", { name: people.stuck }).click();
      await page.waitForURL(`**/cohorts/${cohortId}/learners/${learnerIds.stuck}`);
      expect(await page.getByRole("heading", { level: 1, name: people.stuck }).isVisible()).toBe(true);
      const lab2 = page.locator("section", { has: page.getByRole("heading", { name: /^Lab 2 · / }) });
      expect(await lab2.getByText("Not passed in 5 attempts", { exact: false }).isVisible()).toBe(true);
      expect(await lab2.getByRole("list", { name: "Attempts at Lab 2" }).getByRole("listitem").count()).toBe(5);

      await lab2.getByRole("button", { name: "Open on scope (attempt 3)" }).click();
      const scope = lab2.getByTestId("attempt-scope");
      await scope.getByText("Simulator verdict", { exact: false }).waitFor({ timeout: 60_000 });
      expect(await scope.getByText(/^Attempt 3 redrawn from its stored inputs/).isVisible()).toBe(true);
      await scope.locator("svg .recharts-line-curve").nth(1).waitFor({ timeout: 30_000 });
      expect(await scope.locator("svg .recharts-line-curve").count()).toBe(2);
      await saveScreenshot(page, "instructor-learner-scope-wide");
      await lab2.getByRole("button", { name: "Close scope (attempt 3)" }).click();
      expect(await scope.count()).toBe(0);
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it("fits a phone: the grid scrolls inside its card, the page itself does not (narrow)", async () => {
    const { context, page } = await openPage(browser, "narrow");
    try {
      await openCohortFromHome(page);
      expect(await pageWidthFits(page)).toBe(true);
      const table = page.locator("table").first();
      const scroller = await table.evaluate((element) => {
        const box = element.parentElement!;
        return { scrolls: box.scrollWidth > box.clientWidth, overflow: getComputedStyle(box).overflowX };
      });
      expect(scroller).toEqual({ scrolls: true, overflow: "auto" });
      await saveScreenshot(page, "instructor-grid-narrow");

      await page.getByRole("link", { name: people.steady }).click();
      await page.waitForURL(`**/learners/${learnerIds.steady}`);
      await page.getByRole("button", { name: "Open on scope (attempt 1)" }).first().click();
      await page.getByTestId("attempt-scope").getByText("Simulator verdict", { exact: false }).waitFor({ timeout: 60_000 });
      expect(await pageWidthFits(page)).toBe(true);
      await saveScreenshot(page, "instructor-learner-scope-narrow");
    } finally {
      await context.close();
    }
  });

  it("shows the cohort to the school's admin, and to no other instructor", async () => {
    const admin = await openPage(browser, "wide");
    try {
      await signInAs(admin.page, "admin");
      const response = await admin.page.goto(`/cohorts/${cohortId}`);
      expect(response?.status()).toBe(200);
      expect(await admin.page.getByText("Showing 4 of 4 learners").isVisible()).toBe(true);
      expect(await admin.page.getByRole("link", { name: "← School" }).isVisible()).toBe(true);
    } finally {
      await admin.context.close();
    }

    const other = await openPage(browser, "wide");
    try {
      await signInThroughForm(other.page, { email: demoCohorts[1].instructor.email, password: demoPassword });
      expect((await other.page.goto(`/cohorts/${cohortId}`))?.status()).toBe(404);
      expect((await other.page.goto(`/cohorts/${cohortId}/learners/${learnerIds.stuck}`))?.status()).toBe(404);
      const csv = await other.context.request.get(`/api/cohorts/${cohortId}/gradebook.csv`);
      expect(csv.status()).toBe(404);
      expect(await csv.text()).not.toContain(people.stuck);
    } finally {
      await other.context.close();
    }
  });
});
