import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoCohorts } from "@/db/demo-data";
import type { Role } from "@/db/schema";
import { demoAccounts, launchBrowser, openPage, saveScreenshot, signInAs, viewports } from "./support/browser";

// Each role signs in through the real form and lands on its own home page, on a phone-sized
// and a desktop-sized window; every landing page is saved to test-results/screenshots.

// Integration tests add learners and cohorts to the demo school before this runs, so counts are not fixed.
const homes: Record<Role, { path: string; heading: RegExp; visible: (string | RegExp)[] }> = {
  learner: { path: "/learn", heading: /^Welcome, Priya$/, visible: ["Course map", demoCohorts[0].name] },
  instructor: { path: "/cohorts", heading: /^My cohorts$/, visible: [demoCohorts[0].name, /^\d+ learners →$/] },
  admin: {
    path: "/admin",
    heading: /^Fernhallow Trades College$/,
    visible: [/^Cohorts \(\d+\)$/, "Invite someone", "Adaeze Lindqvist"],
  },
};

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("signing in as each role", () => {
  for (const viewport of Object.keys(viewports) as (keyof typeof viewports)[]) {
    for (const role of Object.keys(homes) as Role[]) {
      it(`${role} lands on ${homes[role].path} (${viewport})`, async () => {
        const { context, page } = await openPage(browser, viewport);
        const errors: string[] = [];
        page.on("pageerror", (error) => errors.push(error.message));
        try {
          await signInAs(page, role);
          expect(new URL(page.url()).pathname).toBe(homes[role].path);
          await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toMatch(homes[role].heading);
          for (const text of homes[role].visible) {
            expect(await page.getByText(text, { exact: false }).first().isVisible()).toBe(true);
          }
          if (viewport === "wide") {
            expect(await page.getByText(demoAccounts[role].name, { exact: true }).first().isVisible()).toBe(true);
          }
          await saveScreenshot(page, `home-${role}-${viewport}`);

          const [cookie] = (await context.cookies()).filter((c) => c.name === "edgewise_session");
          expect(cookie).toMatchObject({ httpOnly: true, sameSite: "Lax", path: "/" });
          expect(cookie!.secure).toBe(new URL(page.url()).protocol === "https:");
          expect(errors).toEqual([]);
        } finally {
          await context.close();
        }
      });
    }
  }

  it("the public start page explains Edgewise and sends signed-in people home", async () => {
    const { context, page } = await openPage(browser, "wide");
    try {
      const response = await page.goto("/");
      expect(response?.status()).toBe(200);
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toContain("long pixel run flicker");
      await saveScreenshot(page, "start-page-wide");
      await page.getByRole("link", { name: "Sign in to your course" }).click();
      await page.waitForURL("**/sign-in");
      await signInAs(page, "instructor");
      await page.goto("/");
      await page.waitForURL("**/cohorts");
    } finally {
      await context.close();
    }
  });

  it("signing out from the header ends the session", async () => {
    const { context, page } = await openPage(browser, "narrow");
    try {
      await signInAs(page, "learner");
      await page.getByRole("button", { name: "Sign out" }).click();
      await page.waitForURL("**/sign-in?notice=signed-out");
      expect(await page.getByText("You are signed out.").isVisible()).toBe(true);
      await page.goto("/learn");
      await page.waitForURL("**/sign-in?next=%2Flearn");
    } finally {
      await context.close();
    }
  });
});
