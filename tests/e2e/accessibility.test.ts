/**
 * Every kind of page checked with axe-core, the open-source accessibility rules engine, against
 * WCAG 2.1 levels A and AA (the rules tagged wcag2a, wcag2aa, wcag21a, wcag21aa): as a visitor, a
 * learner, an instructor and an admin, at desktop and phone widths. Any violation fails, with the
 * rule, its help text and the offending elements named.
 */
import { createRequire } from "node:module";
import { readFileSync } from "node:fs";
import { and, asc, eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { demoCohorts, demoLearnerEmail } from "@/db/demo-data";
import { benchSubmissions, users, type Role } from "@/db/schema";
import { getCourse } from "@/lessons";
import { findDemoCohortId } from "../integration/support/people";
import { baseUrl, demoAccounts, launchBrowser, signInAs, signInThroughForm, viewports } from "./support/browser";

const axeSource = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");
const wcagTags = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"];

type Violation = { id: string; impact: string | null; help: string; nodes: { target: string[] }[] };

let browser: Browser;
let cohortId: string;
let learnerId: string;
let submissionId: string;
// The seed gives every learner of a cohort but the first work far into the course: this one has
// the later lessons and labs open.
const advancedLearner = { email: demoLearnerEmail(demoCohorts[0].learners[1]), password: demoAccounts.learner.password };

beforeAll(async () => {
  browser = await launchBrowser();
  cohortId = await findDemoCohortId();
  const [learner] = await db.select({ id: users.id }).from(users).where(eq(users.email, advancedLearner.email));
  learnerId = learner!.id;
  const [waiting] = await db
    .select({ id: benchSubmissions.id })
    .from(benchSubmissions)
    .where(and(eq(benchSubmissions.cohortId, cohortId), eq(benchSubmissions.status, "submitted")))
    .orderBy(asc(benchSubmissions.submittedAt))
    .limit(1);
  if (!waiting) throw new Error("The demo seed left no bench hand-in waiting for review.");
  submissionId = waiting.id;
});

afterAll(async () => {
  await browser?.close();
});

/** axe's findings on the page as it is now, for the WCAG 2.1 A and AA rules. */
async function violationsOn(page: Page): Promise<Violation[]> {
  // Evaluated through the DevTools protocol, so the page's Content-Security-Policy does not apply.
  await page.evaluate(axeSource);
  return page.evaluate(async (tags) => {
    const axe = (window as unknown as { axe: { run: (context: Document, options: unknown) => Promise<{ violations: Violation[] }> } }).axe;
    const result = await axe.run(document, { runOnly: { type: "tag", values: tags }, resultTypes: ["violations"] });
    return result.violations.map(({ id, impact, help, nodes }) => ({ id, impact, help, nodes: nodes.map((node) => ({ target: node.target })) }));
  }, wcagTags);
}

const describeViolations = (violations: Violation[]) =>
  violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).slice(0, 5).join(", ")}`);

const lesson = (number: number) => getCourse().lessons[number - 1]!;
const pagesByPersona: Record<"visitor" | Role, () => string[]> = {
  visitor: () => ["/sign-in", "/reset-password", "/verify", "/c/0000-0000-0000-0000", "/invitations/not-a-real-token"],
  learner: () => [
    "/learn",
    `/lessons/${lesson(1).slug}`,
    `/lessons/${lesson(5).slug}`,
    `/labs/${lesson(1).lab!.slug}`,
    `/labs/${lesson(6).lab!.slug}`,
    "/bench/build-a-run",
    "/certificate",
  ],
  instructor: () => ["/cohorts", `/cohorts/${cohortId}`, `/cohorts/${cohortId}/learners/${learnerId}`, "/reviews", `/reviews/${submissionId}`],
  admin: () => ["/admin", "/admin/cohorts/new", `/admin/cohorts/${cohortId}`, `/admin/cohorts/${cohortId}/edit`, `/admin/cohorts/${cohortId}/import`, "/certificates"],
};

describe("accessibility (axe-core, WCAG 2.1 A and AA)", () => {
  for (const viewport of Object.keys(viewports) as (keyof typeof viewports)[]) {
    for (const persona of Object.keys(pagesByPersona) as ("visitor" | Role)[]) {
      it(`finds no violation on the ${persona}'s pages (${viewport})`, async () => {
        const context = await browser.newContext({ baseURL: baseUrl, viewport: viewports[viewport] });
        const page = await context.newPage();
        try {
          if (persona === "learner") await signInThroughForm(page, advancedLearner);
          else if (persona !== "visitor") await signInAs(page, persona);
          const found: string[] = [];
          for (const path of pagesByPersona[persona]()) {
            await page.goto(path);
            await page.waitForLoadState("networkidle");
            // A scope still being simulated is drawn faded on purpose; check it as it settles.
            await page.locator("figure[aria-busy=true]").first().waitFor({ state: "detached", timeout: 60_000 });
            await page.waitForTimeout(300);
            found.push(...describeViolations(await violationsOn(page)).map((line) => `${path}: ${line}`));
          }
          expect(found).toEqual([]);
        } finally {
          await context.close();
        }
      });
    }
  }
});
