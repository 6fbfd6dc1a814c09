/**
 * A learner's journey told truly, in a real browser: the course map lists every requirement of the
 * certificate, the bench exercises with their state among them; the home page says "finished" only
 * once the certificate's requirements are met and otherwise what remains; a bench exercise stays
 * locked with its lesson; and a lesson prints as a handout (read back from chromium's own PDF).
 * Results are written straight into the database; screenshots and PDFs go to test-results/.
 */
import { mkdir, writeFile } from "node:fs/promises";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { markLessonsCompleted } from "@/db/queries/progress";
import { benchSubmissions } from "@/db/schema";
import { getCourse } from "@/lessons";
import { findBenchExercise } from "@/lib/bench/exercises";
import { createAccount, createCertificateCohort, recordBenchWork, recordLabAttempt } from "../integration/certificate-fixtures";
import { readCertificatePdf } from "../unit/certificates/read-certificate-pdf";
import { launchBrowser, openPage, saveScreenshot, signInThroughForm, viewports } from "./support/browser";

const course = getCourse();
const password = "journey e2e password";
const [buildRun, documentRun] = course.completion.benchExercises.map((slug) => findBenchExercise(slug)!);
let browser: Browser;
let cohort: { id: string; name: string };
let instructor: { id: string };

async function doneThrough(userId: string, lessonNumber: number): Promise<void> {
  const lessons = course.lessons.filter((lesson) => lesson.number <= lessonNumber);
  await markLessonsCompleted({ userId, completions: lessons.map((lesson) => ({ lessonSlug: lesson.slug, completedAt: new Date() })) });
}

async function newLearner(label: string) {
  return createAccount({ role: "learner", name: `${label} ${randomUUID().slice(0, 4)}`, cohortId: cohort.id, password });
}

async function signedIn(viewport: keyof typeof viewports, learner: { email: string }): Promise<{ page: Page; close: () => Promise<void> }> {
  const { context, page } = await openPage(browser, viewport);
  await signInThroughForm(page, { email: learner.email, password });
  return { page, close: () => context.close() };
}

const noOverflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

/** The course map's line for a lesson's bench exercise, as a person reads it. */
const benchLine = (page: Page, entry: { lesson: { number: number } }) =>
  page
    .getByRole("list", { name: `Lesson ${entry.lesson.number}: work for the certificate` })
    .getByRole("listitem")
    .filter({ hasText: "Bench exercise:" });

beforeAll(async () => {
  cohort = await createCertificateCohort();
  instructor = await createAccount({ role: "instructor", name: "Orla Fenwick", cohortId: cohort.id });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

describe("completion told truly", () => {
  it("lists the bench exercises on the course map, locked with their lessons, for a learner at lesson 1", async () => {
    const learner = await newLearner("Anouk Beresford");
    for (const viewport of ["wide", "narrow"] as const) {
      const { page, close } = await signedIn(viewport, learner);
      try {
        await page.goto("/learn");
        for (const entry of [buildRun, documentRun]) {
          const line = benchLine(page, entry!);
          expect(await line.textContent()).toBe(`Bench exercise: ${entry.exercise.title} · opens with the lesson`);
          expect(await line.getByRole("link").count()).toBe(0);
        }
        expect(await page.getByText("Course finished").count()).toBe(0);
        expect(await noOverflow(page)).toBeLessThanOrEqual(0);
        await saveScreenshot(page, `journey-map-start-${viewport}`);
      } finally {
        await close();
      }
    }
  });

  it("with every lesson done and every lab passed, says what the certificate still needs, bench work by its state, and 'finished' only once it is met", async () => {
    const learner = await newLearner("Jorun Ekwueme");
    await doneThrough(learner.id, course.lessons.length);
    for (const { lab, minScore } of course.completion.labs) {
      await recordLabAttempt({ userId: learner.id, cohortId: cohort.id, labSlug: lab, score: minScore + 5, passed: true });
    }
    // One exercise handed in and waiting, the other not started.
    await db.insert(benchSubmissions).values({ learnerId: learner.id, cohortId: cohort.id, exerciseSlug: buildRun!.exercise.slug, status: "submitted", submittedAt: new Date() });

    const { page, close } = await signedIn("wide", learner);
    try {
      await page.goto("/learn");
      expect(await page.getByText("Course finished").count()).toBe(0);
      await page.getByRole("heading", { name: "Still to do for the certificate" }).waitFor();
      const remaining = page.getByRole("list", { name: "Still to do for the certificate" });
      expect((await remaining.getByRole("listitem").allTextContents()).map((text) => text.trim())).toEqual([
        `Bench exercise: ${buildRun!.exercise.title} · Handed in, waiting for review, to be accepted by your instructor`,
        `Bench exercise: ${documentRun!.exercise.title} · Not started, to be accepted by your instructor`,
      ]);
      expect(await benchLine(page, buildRun!).textContent()).toBe(`Bench exercise: ${buildRun!.exercise.title} · Handed in, waiting for review`);
      expect(await benchLine(page, documentRun!).textContent()).toBe(`Bench exercise: ${documentRun!.exercise.title} · Not started`);
      await benchLine(page, documentRun!).getByRole("link", { name: documentRun!.exercise.title }).waitFor();
      await saveScreenshot(page, "journey-home-bench-remaining-wide");

      // Returned for rework, then accepted: the map follows, and the course is finished only at the end.
      await recordBenchWork({ learnerId: learner.id, cohortId: cohort.id, reviewerId: instructor.id, exerciseSlug: buildRun!.exercise.slug, decision: "return", points: 4, maxPoints: 9 });
      await page.reload();
      expect(await benchLine(page, buildRun!).textContent()).toBe(`Bench exercise: ${buildRun!.exercise.title} · Returned for rework`);
      expect(await page.getByText("Course finished").count()).toBe(0);

      await recordBenchWork({ learnerId: learner.id, cohortId: cohort.id, reviewerId: instructor.id, exerciseSlug: buildRun!.exercise.slug, decision: "accept", points: 8, maxPoints: 9 });
      await page.reload();
      expect(await benchLine(page, buildRun!).textContent()).toBe(`Bench exercise: ${buildRun!.exercise.title} · Accepted`);
      expect((await page.getByRole("list", { name: "Still to do for the certificate" }).getByRole("listitem").allTextContents()).length).toBe(1);
      expect(await page.getByText("Course finished").count()).toBe(0);

      await recordBenchWork({ learnerId: learner.id, cohortId: cohort.id, reviewerId: instructor.id, exerciseSlug: documentRun!.exercise.slug, decision: "accept", points: 9, maxPoints: 9 });
      await page.reload();
      await page.getByText("Course finished").waitFor();
      expect(await page.getByRole("heading", { name: "Every requirement of the certificate is met" }).isVisible()).toBe(true);
      expect(await page.getByRole("heading", { name: "Your certificate is ready" }).isVisible()).toBe(true);
      expect(await benchLine(page, documentRun!).textContent()).toBe(`Bench exercise: ${documentRun!.exercise.title} · Accepted`);
      await saveScreenshot(page, "journey-home-finished-wide");
    } finally {
      await close();
    }
  });

  it("a pass below the certificate's minimum is named on the map and on the home page", async () => {
    const learner = await newLearner("Cyprian Holloway");
    await doneThrough(learner.id, course.lessons.length);
    const [first, ...rest] = course.completion.labs;
    await recordLabAttempt({ userId: learner.id, cohortId: cohort.id, labSlug: first!.lab, score: first!.minScore - 5, passed: true });
    for (const { lab, minScore } of rest) await recordLabAttempt({ userId: learner.id, cohortId: cohort.id, labSlug: lab, score: minScore, passed: true });
    for (const slug of course.completion.benchExercises) {
      await recordBenchWork({ learnerId: learner.id, cohortId: cohort.id, reviewerId: instructor.id, exerciseSlug: slug, decision: "accept", points: 7, maxPoints: 9 });
    }
    const labTitle = course.lessons.find((lesson) => lesson.lab?.slug === first!.lab)!.lab!.title;
    const { page, close } = await signedIn("narrow", learner);
    try {
      await page.goto("/learn");
      const remaining = page.getByRole("list", { name: "Still to do for the certificate" });
      expect((await remaining.getByRole("listitem").allTextContents()).map((text) => text.trim())).toEqual([
        `Lab: ${labTitle} · a passing score of ${first!.minScore} or more (best so far ${first!.minScore - 5})`,
      ]);
      const labLesson = course.lessons.find((lesson) => lesson.lab?.slug === first!.lab)!;
      const labLine = page
        .getByRole("list", { name: `Lesson ${labLesson.number}: work for the certificate` })
        .getByRole("listitem")
        .filter({ hasText: "Lab:" });
      expect(await labLine.textContent()).toBe(`Lab: ${labTitle} · passed · best score ${first!.minScore - 5} · the certificate needs ${first!.minScore}`);
      expect(await page.getByText("Course finished").count()).toBe(0);
      expect(await noOverflow(page)).toBeLessThanOrEqual(0);
      await saveScreenshot(page, "journey-home-lab-below-minimum-narrow");
    } finally {
      await close();
    }
  });
});

describe("a bench exercise locked with its lesson", () => {
  it("shows a learner at lesson 1 which lesson to finish first, and none of the exercise's forms", async () => {
    const learner = await newLearner("Beatrix Oyelowo");
    const before = course.lessons[buildRun!.lesson.number - 2]!;
    for (const viewport of ["wide", "narrow"] as const) {
      const { page, close } = await signedIn(viewport, learner);
      try {
        const response = await page.goto(`/bench/${buildRun!.exercise.slug}`);
        expect(response!.status()).toBe(200);
        await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(`Finish lesson ${before.number} first`);
        expect(await page.getByText(`${buildRun!.exercise.title} is the bench exercise of lesson ${buildRun!.lesson.number}`).isVisible()).toBe(true);
        expect(await page.locator('input[type="file"]').count()).toBe(0);
        expect(await page.getByRole("heading", { name: "Your work" }).count()).toBe(0);
        expect(await page.getByRole("link", { name: `Go to lesson ${before.number}` }).isVisible()).toBe(true);
        expect(await noOverflow(page)).toBeLessThanOrEqual(0);
        await saveScreenshot(page, `journey-bench-locked-${viewport}`);
      } finally {
        await close();
      }
    }
    const drafts = await db
      .select()
      .from(benchSubmissions)
      .where(and(eq(benchSubmissions.learnerId, learner.id), eq(benchSubmissions.exerciseSlug, buildRun!.exercise.slug)));
    expect(drafts).toEqual([]);
  });

  it("opens once the lesson before it is done", async () => {
    const learner = await newLearner("Tamsin Okafor");
    await doneThrough(learner.id, buildRun!.lesson.number - 1);
    const { page, close } = await signedIn("wide", learner);
    try {
      await page.goto(`/bench/${buildRun!.exercise.slug}`);
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(buildRun!.exercise.title);
      expect(await page.locator('input[type="file"]').count()).toBe(1);
      await page.goto(`/bench/${documentRun!.exercise.slug}`);
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(`Finish lesson ${buildRun!.lesson.number} first`);
    } finally {
      await close();
    }
  });
});

describe("a lesson on paper", () => {
  /** Text as a PDF reader extracts it, without the line breaks and spaces that depend on the layout. */
  const squeeze = (text: string) => text.replace(/\s+/g, "");

  for (const number of [7, 5]) {
    it(`prints lesson ${number} as a handout: no navigation, every figure drawn with its caption, a sensible page count`, async () => {
      const lesson = course.lessons[number - 1]!;
      const learner = await newLearner("Halvard Mbeki");
      await doneThrough(learner.id, number - 1);
      const { page, close } = await signedIn("wide", learner);
      try {
        await page.goto(`/lessons/${lesson.slug}`);
        const figures = lesson.blocks.filter((block) => block.kind === "figure");
        await expect.poll(() => page.locator("figure svg").count(), { timeout: 30_000 }).toBeGreaterThanOrEqual(figures.length);
        // The same page printed with its screen layout, as it printed before it had a print layout.
        await page.emulateMedia({ media: "screen" });
        const screenLayout = await readCertificatePdf(new Uint8Array(await page.pdf({ format: "A4", printBackground: true })));
        await page.emulateMedia({ media: "print" });
        await saveScreenshot(page, `journey-lesson-${number}-print-media`);
        const pdf = await page.pdf({ format: "A4", printBackground: true });
        const file = path.resolve("test-results", `journey-lesson-${number}.pdf`);
        await mkdir(path.dirname(file), { recursive: true });
        await writeFile(file, pdf);
        const read = await readCertificatePdf(new Uint8Array(pdf));

        // About 450 words of text a page, a page for each figure at most (kept whole, one may leave a
        // page short), and one more for the bench exercise's brief: fewer pages than the screen layout.
        const words = lesson.blocks
          .flatMap((block) => (block.kind === "text" || block.kind === "caution" ? [block.markdown] : []))
          .concat(lesson.bench?.brief ?? "")
          .join(" ")
          .split(/\s+/)
          .filter(Boolean).length;
        const handoutPages = Math.ceil(words / 450) + figures.length + 1;
        expect(read.pageCount, `${read.pageCount} pages; the screen layout took ${screenLayout.pageCount}`).toBeLessThanOrEqual(handoutPages);
        expect(read.pageCount).toBeLessThan(screenLayout.pageCount);
        const text = squeeze(read.text);
        expect(text).toContain(squeeze(lesson.title));
        for (const figure of figures) if (figure.kind === "figure") expect(text).toContain(squeeze(figure.caption));
        const navigationTexts = ["Course map", "Sign out", "In this lesson", "Your progress", "Check answer", "Open the lab on the workbench", `← Lesson ${number - 1}`];
        for (const navigation of navigationTexts) {
          expect(text, `"${navigation}" is printed`).not.toContain(squeeze(navigation));
        }
        // Each printed figure is one drawing on one page: no figure (a drawing inside one goes with it) is cut by a
        // page break. Figures left off paper (the quick checks' traces) take no room in the print layout.
        const cut = await page.evaluate(() =>
          [...document.querySelectorAll("figure")]
            .filter((figure) => !figure.parentElement?.closest("figure"))
            .filter((figure) => figure.getClientRects().length > 0)
            .filter((figure) => getComputedStyle(figure).breakInside !== "avoid").length,
        );
        expect(cut).toBe(0);
      } finally {
        await close();
      }
    });
  }
});
