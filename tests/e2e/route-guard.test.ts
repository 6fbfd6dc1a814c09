import type { APIRequestContext, Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { demoCohorts } from "@/db/demo-data";
import type { Role } from "@/db/schema";
import { benchSubmissions, users } from "@/db/schema";
import { db } from "@/db/client";
import { getCourse } from "@/lessons";
import { fillRoute, protectedRoutes, type ProtectedRoute } from "@/lib/auth/route-access";
import { baseUrl, demoAccounts, launchBrowser, openPage, saveScreenshot, signInAs } from "./support/browser";

// Walks every protected route over HTTP as each role and as an anonymous visitor.

const roles: Role[] = ["admin", "instructor", "learner"];
let browser: Browser;
let cohortId: string;
// Real values for every route parameter, so each allowed page answers 200 rather than 404.
let routeParams: Record<string, string>;

async function requestAs(role: Role): Promise<{ request: APIRequestContext; close: () => Promise<void> }> {
  const { context, page } = await openPage(browser, "wide");
  await signInAs(page, role);
  return { request: context.request, close: () => context.close() };
}

function concretePath(route: ProtectedRoute): string {
  return fillRoute(route, routeParams);
}

/** The demo learner's hand-in waiting in the demo instructor's queue, created once per run. */
async function ensureWaitingSubmission(learnerId: string, exerciseSlug: string): Promise<string> {
  const [existing] = await db.select({ id: benchSubmissions.id }).from(benchSubmissions).where(eq(benchSubmissions.learnerId, learnerId));
  if (existing) return existing.id;
  const [created] = await db
    .insert(benchSubmissions)
    .values({ learnerId, cohortId, exerciseSlug, status: "submitted", submittedAt: new Date(), note: "Route walk fixture." })
    .returning({ id: benchSubmissions.id });
  return created!.id;
}

beforeAll(async () => {
  browser = await launchBrowser();
  const { context, page } = await openPage(browser, "wide");
  await signInAs(page, "instructor");
  const href = await page.locator('a[href^="/cohorts/"]').first().getAttribute("href");
  cohortId = href!.split("/").pop()!;
  await context.close();

  const [learner] = await db.select({ id: users.id }).from(users).where(eq(users.email, demoAccounts.learner.email));
  const course = getCourse();
  const firstLesson = course.lessons[0]!;
  const exerciseSlug = course.completion.benchExercises[0]!;
  routeParams = {
    cohortId,
    learnerId: learner!.id,
    lessonSlug: firstLesson.slug,
    labSlug: firstLesson.lab!.slug,
    exerciseSlug,
    submissionId: await ensureWaitingSubmission(learner!.id, exerciseSlug),
  };
});
afterAll(async () => {
  await browser?.close();
});

describe("protected routes over HTTP", () => {
  for (const role of roles) {
    it(`as ${role}: own pages open, every other page answers 403`, async () => {
      const { request, close } = await requestAs(role);
      try {
        for (const route of Object.keys(protectedRoutes) as ProtectedRoute[]) {
          const allowed = (protectedRoutes[route] as readonly Role[]).includes(role);
          const response = await request.get(concretePath(route), { maxRedirects: 0 });
          const body = await response.text();
          expect({ route, status: response.status() }).toEqual({ route, status: allowed ? 200 : 403 });
          if (!allowed) expect(body).toContain("This page is not open to your account");
        }
      } finally {
        await close();
      }
    });
  }

  it("anonymous visitors are redirected to sign-in with a way back", async () => {
    const { context } = await openPage(browser, "wide");
    try {
      for (const route of Object.keys(protectedRoutes) as ProtectedRoute[]) {
        const path = concretePath(route);
        const response = await context.request.get(path, { maxRedirects: 0 });
        expect({ route, status: response.status() }).toEqual({ route, status: 307 });
        const location = new URL(response.headers()["location"]!, baseUrl);
        expect(location.pathname).toBe("/sign-in");
        expect(location.searchParams.get("next")).toBe(path);
      }
    } finally {
      await context.close();
    }
  });
});

describe("in the browser", () => {
  it("a learner opening an admin URL sees the 403 page", async () => {
    const { context, page } = await openPage(browser, "narrow");
    try {
      await signInAs(page, "learner");
      const response = await page.goto("/admin");
      expect(response?.status()).toBe(403);
      expect(await page.getByRole("heading", { name: "This page is not open to your account" }).isVisible()).toBe(true);
      expect(await page.getByText("Fernhallow Trades College").count()).toBe(0);
      await saveScreenshot(page, "forbidden-learner-on-admin-narrow");
    } finally {
      await context.close();
    }
  });

  it("an anonymous visitor is sent to sign-in and comes back to the page after signing in", async () => {
    const { context, page } = await openPage(browser, "wide");
    try {
      await page.goto(`/cohorts/${cohortId}`);
      await page.waitForURL(`**/sign-in?next=${encodeURIComponent(`/cohorts/${cohortId}`)}`);
      await page.getByLabel("E-mail address").fill("tomasz.brennholt@fernhallow.example");
      await page.getByLabel("Password", { exact: true }).fill("edgewise-demo");
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL(`**/cohorts/${cohortId}`);
      expect(await page.getByRole("heading", { name: demoCohorts[0].name }).isVisible()).toBe(true);
      await saveScreenshot(page, "instructor-cohort-wide");
    } finally {
      await context.close();
    }
  });

  it("an instructor gets 404, not an error, for a cohort that is not theirs or not an id", async () => {
    const { context, page } = await openPage(browser, "wide");
    try {
      await signInAs(page, "instructor");
      expect((await page.goto("/cohorts/not-a-cohort"))?.status()).toBe(404);
      expect((await page.goto("/cohorts/00000000-0000-4000-8000-000000000000"))?.status()).toBe(404);
      expect(await page.getByRole("heading", { name: "We could not find that page" }).isVisible()).toBe(true);
    } finally {
      await context.close();
    }
  });

  it("a return link to another site is ignored after sign-in", async () => {
    const { context, page } = await openPage(browser, "wide");
    try {
      await page.goto("/sign-in?next=%2F%2Felsewhere.example%2Fphish");
      await page.getByLabel("E-mail address").fill("admin@fernhallow.example");
      await page.getByLabel("Password", { exact: true }).fill("edgewise-demo");
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL("**/admin");
      expect(new URL(page.url()).origin).toBe(baseUrl);
    } finally {
      await context.close();
    }
  });
});
