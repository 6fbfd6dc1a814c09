import { mkdir } from "node:fs/promises";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { demoAdmin, demoCohorts, demoLearnerEmail, demoPassword } from "@/db/demo-data";
import type { Role } from "@/db/schema";

// Shared by every browser test: Debian's chromium, the app under test at E2E_BASE_URL, the
// seeded demo accounts and a sign-in that goes through the real form.

export const baseUrl = (process.env.E2E_BASE_URL ?? "http://127.0.0.1:3100").replace(/\/+$/, "");
export const screenshotDir = path.resolve("test-results", "screenshots");

export const demoAccounts: Record<Role, { email: string; password: string; name: string }> = {
  admin: { email: demoAdmin.email, password: demoPassword, name: demoAdmin.name },
  instructor: { ...demoCohorts[0].instructor, password: demoPassword },
  learner: { email: demoLearnerEmail(demoCohorts[0].learners[0]), password: demoPassword, name: demoCohorts[0].learners[0] },
};

export const viewports = {
  narrow: { width: 390, height: 844 },
  wide: { width: 1366, height: 900 },
} as const;

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--no-first-run",
      "--disable-quic",
    ],
  });
}

/** A fresh browser context on the app at `origin` (the suite's app unless a test runs its own copy). */
export async function openPage(
  browser: Browser,
  viewport: keyof typeof viewports = "wide",
  origin = baseUrl,
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ baseURL: origin, viewport: viewports[viewport] });
  const page = await context.newPage();
  return { context, page };
}

/** Signs in through the sign-in form and waits until the app has navigated away from it. */
export async function signInThroughForm(page: Page, credentials: { email: string; password: string }): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail address").fill(credentials.email);
  await page.getByLabel("Password", { exact: true }).fill(credentials.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 30_000 });
}

export async function signInAs(page: Page, role: Role): Promise<void> {
  await signInThroughForm(page, demoAccounts[role]);
}

/** The whole page, or with `fullPage: false` what the viewport shows (a phone's screen as the learner sees it). */
export async function saveScreenshot(page: Page, name: string, options: { fullPage?: boolean } = {}): Promise<string> {
  await mkdir(screenshotDir, { recursive: true });
  const file = path.join(screenshotDir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: options.fullPage ?? true });
  return file;
}
