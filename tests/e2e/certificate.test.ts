/**
 * The certificate end to end in a real browser against the running app: a graduate (whose
 * results are written straight into the database) opens their certificate page, which issues the
 * certificate, and downloads the PDF; a visitor with no account checks it by its code; the school's
 * admin revokes it, after which the check page and the download say so. Screenshots of each screen
 * go to test-results/screenshots, the downloaded PDF to test-results/.
 */
import { mkdir, readFile } from "node:fs/promises";
import path from "node:path";
import { randomUUID } from "node:crypto";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { findLinks } from "@/lib/mail/sink";
import { createAccount, createCertificateCohort, passingResults, recordResults } from "../integration/certificate-fixtures";
import { waitForMessage } from "../integration/support/mail-sink";
import { readCertificatePdf } from "../unit/certificates/read-certificate-pdf";
import { baseUrl, launchBrowser, openPage, saveScreenshot, signInAs, signInThroughForm } from "./support/browser";

const password = "certificate e2e password";
const learnerName = `Marisol Quennell-${randomUUID().slice(0, 4)}`;
let learner: { id: string; email: string };
let browser: Browser;
let code = "";
let pdfPath = "";

beforeAll(async () => {
  const cohort = await createCertificateCohort();
  const instructor = await createAccount({ role: "instructor", name: "Orla Fenwick", cohortId: cohort.id });
  learner = await createAccount({ role: "learner", name: learnerName, cohortId: cohort.id, password });
  await recordResults({ learnerId: learner.id, cohortId: cohort.id, reviewerId: instructor.id, results: passingResults() });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

describe("a certificate from download to check", () => {
  it("a learner who has not finished sees what is left, and no certificate", async () => {
    const cohort = await createCertificateCohort();
    const instructor = await createAccount({ role: "instructor", name: "Orla Fenwick", cohortId: cohort.id });
    const unfinished = await createAccount({ role: "learner", name: "Tobias Arkwright", cohortId: cohort.id, password });
    const results = passingResults();
    const [lastBench] = [...results.benchDecisions.keys()].slice(-1);
    results.benchDecisions.set(lastBench!, "return");
    await recordResults({ learnerId: unfinished.id, cohortId: cohort.id, reviewerId: instructor.id, results });
    const { context, page } = await openPage(browser, "wide");
    try {
      await signInThroughForm(page, { email: unfinished.email, password });
      await page.goto("/certificate");
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Not earned yet");
      const total = results.labScores.size + results.benchDecisions.size;
      expect(await page.getByText(`${total - 1} of ${total} requirements met`).isVisible()).toBe(true);
      expect(await page.getByText("Not accepted yet").count()).toBe(1);
      expect(await page.getByRole("link", { name: "Download the certificate (PDF)" }).count()).toBe(0);
      await saveScreenshot(page, "certificate-learner-not-yet");
    } finally {
      await context.close();
    }
  });

  it("the graduate's page issues the certificate, e-mails them, and the PDF downloads with their name, code and QR code", async () => {
    const { context, page } = await openPage(browser, "wide");
    try {
      await signInThroughForm(page, { email: learner.email, password });
      await page.goto("/certificate");
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("You have earned your certificate");
      code = (await page.getByText(/^[0-9A-Z]{4}-[0-9A-Z]{4}-[0-9A-Z]{4}-[0-9A-Z]{4}$/).first().textContent())!;
      expect(code).toMatch(/^[0-9A-HJKMNP-TV-Z]{4}(-[0-9A-HJKMNP-TV-Z]{4}){3}$/);
      await saveScreenshot(page, "certificate-learner-wide");

      pdfPath = (await page.getByRole("link", { name: "Download the certificate (PDF)" }).getAttribute("href"))!;
      const [download] = await Promise.all([
        page.waitForEvent("download"),
        page.getByRole("link", { name: "Download the certificate (PDF)" }).click(),
      ]);
      expect(download.suggestedFilename()).toBe(`certificate-${code}.pdf`);
      const file = path.resolve("test-results", "certificate-e2e.pdf");
      await mkdir(path.dirname(file), { recursive: true });
      await download.saveAs(file);
      const read = await readCertificatePdf(new Uint8Array(await readFile(file)));
      expect(read.text).toContain(learnerName);
      expect(read.text).toContain(code);
      expect(read.qrText).toBe(`${baseUrl}/c/${code}`);

      const mail = await waitForMessage({ to: learner.email, subject: /certificate/i });
      expect(findLinks(mail.text)).toContain(`${baseUrl}/c/${code}`);

      // The same PDF straight from the learner's home page.
      await page.goto("/learn");
      const homeCard = page.locator("section, div").filter({ has: page.getByRole("heading", { name: "Your certificate is ready" }) }).last();
      expect(await homeCard.getByText(`Code ${code}.`).isVisible()).toBe(true);
      const [fromHome] = await Promise.all([page.waitForEvent("download"), homeCard.getByRole("link", { name: "Download the certificate (PDF)" }).click()]);
      expect(fromHome.suggestedFilename()).toBe(`certificate-${code}.pdf`);
      const homeFile = path.resolve("test-results", "certificate-e2e-from-home.pdf");
      await fromHome.saveAs(homeFile);
      expect((await readCertificatePdf(new Uint8Array(await readFile(homeFile)))).text).toContain(code);
      await saveScreenshot(page, "certificate-learner-home");
    } finally {
      await context.close();
    }
  });

  it("the learner's page fits a phone", async () => {
    const { context, page } = await openPage(browser, "narrow");
    try {
      await signInThroughForm(page, { email: learner.email, password });
      await page.goto("/certificate");
      expect(await page.getByRole("link", { name: "Download the certificate (PDF)" }).isVisible()).toBe(true);
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow).toBeLessThanOrEqual(0);
      await saveScreenshot(page, "certificate-learner-narrow");
    } finally {
      await context.close();
    }
  });

  it("a visitor without an account checks it by typing the code, and a mistyped code is caught", async () => {
    expect(code).not.toBe("");
    const { context, page } = await openPage(browser, "wide");
    try {
      await page.goto("/verify");
      await page.getByLabel("Verification code").fill("7K2M-QX9P-4TDW");
      await page.getByRole("button", { name: "Check the certificate" }).click();
      await page.waitForURL(/\/verify\?code=/);
      expect(await page.getByText("That is not a certificate code").isVisible()).toBe(true);
      await saveScreenshot(page, "certificate-verify-mistyped");

      await page.getByLabel("Verification code").fill(code.toLowerCase().replaceAll("-", " "));
      await page.getByRole("button", { name: "Check the certificate" }).click();
      await page.waitForURL(`**/c/${code}`);
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("This certificate is valid");
      expect(await page.getByText(learnerName, { exact: true }).isVisible()).toBe(true);
      expect(await page.getByText("Data runs that work").first().isVisible()).toBe(true);
      expect(await page.getByText("Fernhallow Trades College").first().isVisible()).toBe(true);
      expect(await page.content()).not.toContain(learner.email);
      await saveScreenshot(page, "certificate-check-valid");

      const unknown = `${code.slice(0, -1)}${code.endsWith("0") ? "1" : "0"}`;
      expect((await page.goto(`/c/${unknown}`))!.status()).toBe(404);
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("No certificate has this code");
      await saveScreenshot(page, "certificate-check-unknown");
      expect((await page.goto("/c/not-a-code"))!.status()).toBe(404);
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("No certificate has this code");
    } finally {
      await context.close();
    }
  });

  it("once the school's admin revokes it, the check page says so and the PDF is no longer served", async () => {
    const admin = await openPage(browser, "wide");
    try {
      await signInAs(admin.page, "admin");
      await admin.page.goto("/certificates");
      const row = admin.page.locator("li", { hasText: learnerName });
      await row.getByText("Revoke…").click();
      await row.getByLabel(/Reason for revoking/).fill("Bench photos were found to be another learner's work.");
      await row.getByRole("button", { name: "Revoke the certificate" }).click();
      await row.getByText(/Revoked .* by Noor Whitcombe: Bench photos were found/).waitFor();
      await saveScreenshot(admin.page, "certificate-admin-revoked");
    } finally {
      await admin.context.close();
    }

    const visitor = await openPage(browser, "narrow");
    try {
      await visitor.page.goto(`/c/${code}`);
      await expect(visitor.page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("This certificate was revoked");
      expect(await visitor.page.content()).not.toContain(learnerName);
      expect(await visitor.page.content()).not.toContain("another learner");
      await saveScreenshot(visitor.page, "certificate-check-revoked-narrow");
    } finally {
      await visitor.context.close();
    }

    const graduate = await openPage(browser, "wide");
    try {
      await signInThroughForm(graduate.page, { email: learner.email, password });
      await graduate.page.goto("/certificate");
      await expect(graduate.page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Certificate revoked");
      expect(await graduate.page.getByText("Bench photos were found to be another learner's work.").isVisible()).toBe(true);
      expect(await graduate.page.getByRole("link", { name: "Download the certificate (PDF)" }).count()).toBe(0);
      await graduate.page.goto("/learn");
      await graduate.page.getByRole("heading", { name: "Certificate revoked" }).waitFor();
      expect(await graduate.page.getByRole("link", { name: "Download the certificate (PDF)" }).count()).toBe(0);
      const refused = await graduate.page.request.get(pdfPath, { maxRedirects: 0 });
      expect(refused.status()).toBe(303);
      expect(refused.headers()["location"]).toBe(`/c/${code}`);
      await saveScreenshot(graduate.page, "certificate-learner-revoked");
    } finally {
      await graduate.context.close();
    }
  });
});
