import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoCohorts } from "@/db/demo-data";
import { baseUrl, launchBrowser, openPage, saveScreenshot, signInAs } from "./support/browser";

// What a person sees when a guard stops them, in the browser. Which persona gets which answer on
// every route is the authorization matrix (authorization-matrix.test.ts).

let browser: Browser;
let cohortId: string;

beforeAll(async () => {
  browser = await launchBrowser();
  const { context, page } = await openPage(browser, "wide");
  await signInAs(page, "instructor");
  const href = await page.locator('a[href^="/cohorts/"]').first().getAttribute("href");
  cohortId = href!.split("/").pop()!;
  await context.close();
});
afterAll(async () => {
  await browser?.close();
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
