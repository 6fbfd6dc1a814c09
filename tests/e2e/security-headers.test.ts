/**
 * The security headers and the Content-Security-Policy on every kind of page, in a real browser
 * against the built app: each page answers with the headers, the browser reports no policy
 * violation while the page's interactive parts are used (live previews in the simulator worker,
 * an upload to the upload service, server-action forms), and inline scripts carry the nonce. HSTS
 * is sent only by a production server whose APP_URL is https; no response names the framework
 * that serves it (X-Powered-By).
 */
import type { Browser, BrowserContext, Page, Response } from "playwright-core";
import { PNG } from "pngjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { cohortMemberships } from "@/db/schema";
import { openBenchExercises } from "../integration/support/bench-people";
import { findDemoCohortId } from "../integration/support/people";
import { baseUrl, launchBrowser, openPage, signInAs, signInThroughForm } from "./support/browser";
import { createLearnerAtLab } from "./support/learner-at-lab";
import { startProductionServer } from "./support/second-server";

const LAB = "lone-lead-termination";
const password = "headers on every page";
const farEndTrace = 'path.recharts-line-curve[stroke="#b05f26"]';

type Watched = { context: BrowserContext; page: Page; problems: string[]; documents: Response[] };

let browser: Browser;
let learner: { email: string; password: string };

beforeAll(async () => {
  browser = await launchBrowser();
  const person = await createLearnerAtLab({ labSlug: LAB, password, label: "security-headers" });
  await db.insert(cohortMemberships).values({ cohortId: await findDemoCohortId(), userId: person.id, role: "learner" });
  // The page also uploads a bench photo, so the bench exercise's lesson is open too.
  await openBenchExercises(person.id);
  learner = person;
});

afterAll(async () => {
  await browser?.close();
});

/** A page whose policy violations, console errors and page errors are all collected. */
async function watchedPage(): Promise<Watched> {
  const { context, page } = await openPage(browser, "wide");
  const problems: string[] = [];
  const documents: Response[] = [];
  await context.exposeBinding("reportPolicyViolation", (_source, text: string) => problems.push(`violation: ${text}`));
  await context.addInitScript(() => {
    const report = (event: SecurityPolicyViolationEvent) =>
      (window as unknown as { reportPolicyViolation: (text: string) => void }).reportPolicyViolation(
        `${event.effectiveDirective} blocked ${event.blockedURI || "inline"} on ${location.pathname} (from ${event.sourceFile || "the page"}:${event.lineNumber})`,
      );
    document.addEventListener("securitypolicyviolation", report);
  });
  page.on("console", (message) => {
    if (message.type() === "error" || /Content Security Policy/i.test(message.text())) problems.push(`console: ${message.text()}`);
  });
  page.on("pageerror", (error) => problems.push(`page error: ${error.message}`));
  page.on("response", (response) => {
    if (response.request().resourceType() === "document") documents.push(response);
  });
  return { context, page, problems, documents };
}

function policyOf(response: Response): Map<string, string> {
  const header = response.headers()["content-security-policy"] ?? "";
  return new Map(
    header
      .split(";")
      .map((directive) => directive.trim().split(/\s+/))
      .filter((parts) => parts[0])
      .map(([name, ...sources]) => [name!, sources.join(" ")]),
  );
}

/** Every document the browser loaded carried the headers and a policy with a fresh nonce. */
function expectHeadersOnEveryDocument(documents: Response[]): void {
  expect(documents.length).toBeGreaterThan(0);
  const nonces = new Set<string>();
  for (const response of documents) {
    const headers = response.headers();
    const where = new URL(response.url()).pathname;
    expect(headers["referrer-policy"], where).toBe("strict-origin-when-cross-origin");
    expect(headers["x-content-type-options"], where).toBe("nosniff");
    expect(headers["x-frame-options"], where).toBe("DENY");
    expect(headers["permissions-policy"], where).toBe("camera=(), microphone=(), geolocation=()");
    // The app under test is served over plain http, where HSTS must not be sent.
    expect(headers["strict-transport-security"], where).toBeUndefined();

    const policy = policyOf(response);
    const nonce = policy.get("script-src")?.match(/'nonce-([A-Za-z0-9+/=]+)'/)?.[1];
    expect(nonce, `${where}: script-src ${policy.get("script-src")}`).toBeTruthy();
    expect(policy.get("script-src")).toBe(`'self' 'nonce-${nonce}' 'strict-dynamic'`);
    // Style sheets and <style> elements need the nonce; only style attributes may be inline.
    expect(policy.get("style-src")).toBe(`'self' 'nonce-${nonce}'`);
    expect(policy.get("style-src-attr")).toBe("'unsafe-inline'");
    expect(policy.has("style-src-elem")).toBe(false);
    expect(policy.get("frame-ancestors")).toBe("'none'");
    expect(policy.get("object-src")).toBe("'none'");
    expect(policy.get("base-uri")).toBe("'self'");
    expect(policy.get("form-action")).toBe("'self'");
    expect(policy.get("default-src")).toBe("'self'");
    nonces.add(nonce!);
  }
  expect(nonces.size).toBe(documents.length);
}

/**
 * The inline scripts Next writes into the page carry the nonce of the policy it was sent with, and
 * so does any <style> element: the policy refuses those without it.
 */
async function expectInlineScriptsNonced(page: Page): Promise<void> {
  const scripts = await page.evaluate(() => [...document.scripts].map((script) => ({ inline: !script.src, nonce: script.nonce })));
  expect(scripts.filter((script) => script.inline).length).toBeGreaterThan(0);
  expect(scripts.filter((script) => !script.nonce)).toEqual([]);
  const styles = await page.evaluate(() => [...document.querySelectorAll("style")].map((style) => style.nonce));
  expect(styles.filter((nonce) => !nonce)).toEqual([]);
}

async function finish(watched: Watched): Promise<void> {
  try {
    expect(watched.problems).toEqual([]);
    expectHeadersOnEveryDocument(watched.documents);
  } finally {
    await watched.context.close();
  }
}

/** A small valid PNG: an image the bench uploader accepts. */
function scopePhoto(): Buffer {
  const png = new PNG({ width: 320, height: 200 });
  for (let i = 0; i < png.data.length; i += 4) png.data.set([18, 24, (i / 4) % 320 < 160 ? 27 : 200, 255], i);
  return PNG.sync.write(png);
}

describe("security headers and the Content-Security-Policy", () => {
  it("hold on the public pages: landing, sign-in and the certificate check", async () => {
    const watched = await watchedPage();
    const { page } = watched;
    await page.goto("/");
    await expectInlineScriptsNonced(page);
    await page.goto("/sign-in");
    await page.getByLabel("E-mail address").fill("nobody@example.test");
    await page.getByLabel("Password", { exact: true }).fill("not the password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByRole("alert").first().waitFor({ timeout: 30_000 });
    await page.goto("/verify");
    await page.getByLabel("Verification code").fill("7K2M-QX9P-4TDW");
    await page.getByRole("button", { name: "Check the certificate" }).click();
    await page.waitForURL(/\/verify\?code=/);
    expect(await page.getByText("That is not a certificate code").isVisible()).toBe(true);
    await finish(watched);
  });

  it("hold for a learner: home, a lesson figure, a simulator figure, the workbench preview and a bench upload", async () => {
    const watched = await watchedPage();
    const { page } = watched;
    await signInThroughForm(page, learner);
    await page.goto("/learn");
    await expectInlineScriptsNonced(page);

    await page.goto("/lessons/pixel-data-stream");
    const pulses = page.getByRole("figure", { name: "Pulse train" });
    await pulses.getByText("the pixel reads 01101000: every bit as sent.", { exact: false }).waitFor();
    await pulses.getByRole("slider", { name: "High time of a 1 bit" }).focus();
    for (let i = 0; i < 5; i += 1) await page.keyboard.press("ArrowLeft");
    await pulses.getByText("the pixel reads 00000000: 3 of 8 bits wrong.", { exact: false }).waitFor();

    // The simulator figure runs in the browser's simulator worker, which the policy must let start.
    await page.goto("/lessons/series-termination");
    const simulated = page.getByRole("figure", { name: "Simulated run with a series resistor" }).first();
    await simulated.locator(farEndTrace).first().waitFor({ timeout: 60_000 });

    await page.goto(`/labs/${LAB}`);
    const preview = page.locator('[data-testid="workbench-preview"][data-pending="false"]');
    await preview.waitFor({ timeout: 60_000 });
    await page.locator(farEndTrace).first().waitFor({ timeout: 60_000 });
    const before = await page.locator(farEndTrace).first().getAttribute("d");
    await page.getByRole("slider", { name: "Series resistor (E24)" }).focus();
    for (let i = 0; i < 4; i += 1) await page.keyboard.press("ArrowRight");
    await expect.poll(() => page.locator(farEndTrace).first().getAttribute("d"), { timeout: 60_000 }).not.toBe(before);

    // The uploader PUTs the photo straight to the upload service's ingest host (connect-src).
    await page.goto("/bench/build-a-run");
    await page.locator('input[type="file"]').setInputFiles({ name: "policy-check.png", mimeType: "image/png", buffer: scopePhoto() });
    await page.getByText("“policy-check.png” added.").waitFor({ timeout: 30_000 });
    const thumbnail = page.getByRole("button", { name: "Open photo 1: policy-check.png" }).locator("img");
    await expect.poll(() => thumbnail.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth), { timeout: 30_000 }).toBe(320);
    await finish(watched);
  });

  it("hold for an instructor on the cohort grid and the review queue", async () => {
    const watched = await watchedPage();
    const { page } = watched;
    await signInAs(page, "instructor");
    await page.goto(`/cohorts/${await findDemoCohortId()}`);
    const sortButton = page.getByRole("button", { name: "Lab 1", exact: true });
    await sortButton.click();
    const header = page.locator("thead th", { has: sortButton });
    expect(await header.getAttribute("aria-sort")).toBe("descending");
    await page.goto("/reviews");
    await expectInlineScriptsNonced(page);
    await finish(watched);
  });

  it("hold for an admin on the school, cohort and certificate pages, and a server-action form answers", async () => {
    const watched = await watchedPage();
    const { page } = watched;
    await signInAs(page, "admin");
    await page.goto("/admin");
    await page.goto(`/admin/cohorts/${await findDemoCohortId()}`);
    await page.goto("/certificates");
    await page.goto("/dev/mail");
    await expectInlineScriptsNonced(page);
    await page.goto("/admin/cohorts/new");
    await page.getByLabel("Cohort name").fill("Policy check cohort");
    await page.getByLabel("First day").fill("2026-09-14");
    await page.getByLabel("Last day").fill("2026-09-01");
    await page.getByRole("button", { name: "Create cohort" }).click();
    await page.getByText("The last day cannot be before the first day.").waitFor({ timeout: 30_000 });
    await finish(watched);
  });
});

describe("X-Powered-By", () => {
  it("is sent by no kind of response: pages, redirects, route handlers, refusals, build files, the not-found page", async () => {
    const landing = await fetch(`${baseUrl}/`);
    const script = /<script[^>]+src="(\/_next\/static\/[^"]+\.js)"/.exec(await landing.text())?.[1];
    expect(script).toBeTruthy();
    const responses: [string, Promise<globalThis.Response>][] = [
      ["landing page", Promise.resolve(landing)],
      ["sign-in page", fetch(`${baseUrl}/sign-in`)],
      ["redirect to sign-in", fetch(`${baseUrl}/learn`, { redirect: "manual" })],
      ["not-found page", fetch(`${baseUrl}/no-such-page`)],
      ["health check", fetch(`${baseUrl}/api/health`)],
      ["route handler refusal", fetch(`${baseUrl}/api/labs/${LAB}/attempts`)],
      ["server action refusal", fetch(`${baseUrl}/sign-in`, { method: "POST", headers: { origin: baseUrl, "next-action": "0".repeat(42) }, body: "not a call" })],
      ["build file", fetch(`${baseUrl}${script}`)],
      ["public file", fetch(`${baseUrl}/robots.txt`)],
    ];
    for (const [what, pending] of responses) {
      const response = await pending;
      expect(response.status, what).toBeLessThan(500);
      expect(response.headers.get("x-powered-by"), what).toBeNull();
    }
  });
});

describe("Strict-Transport-Security", () => {
  // The TLS-terminating proxy in front of a real deployment is not run here: the server decides
  // from APP_URL, so one started with an https APP_URL answers as it would behind that proxy.
  it("is sent on every page by the production server when APP_URL is https, for two years with subdomains", async () => {
    const server = await startProductionServer({ APP_URL: "https://edgewise.example" });
    try {
      for (const path of ["/", "/sign-in", "/verify", "/learn"]) {
        const response = await fetch(`${server.origin}${path}`, { redirect: "manual" });
        expect(response.headers.get("strict-transport-security"), path).toBe("max-age=63072000; includeSubDomains");
      }
    } finally {
      await server.stop();
    }
  });
});
