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
import { getCourse } from "@/lessons";
import { courseCertification } from "@/lib/certificates/certification";
import { createAccount, createCertificateCohort, createSchool, passingResults, recordResults } from "../integration/certificate-fixtures";
import { waitForMessage } from "../integration/support/mail-sink";
import { fetchFrom, uniqueLoopbackAddress } from "../support/loopback-client";
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

describe("who signs for the school, and what the certificate certifies", () => {
  const signatory = { name: "Wilhelmina Sterne-Aballa", role: "Head of electrical installation" };
  const certification = courseCertification(getCourse());

  /** The learner opens their certificate page, which issues it; its code and PDF bytes. */
  async function issueThroughPage(person: { email: string }): Promise<{ code: string; pdf: Uint8Array }> {
    const { context, page } = await openPage(browser, "wide");
    try {
      await signInThroughForm(page, { email: person.email, password });
      await page.goto("/certificate");
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("You have earned your certificate");
      const issued = (await page.getByText(/^[0-9A-Z]{4}-[0-9A-Z]{4}-[0-9A-Z]{4}-[0-9A-Z]{4}$/).first().textContent())!;
      const href = (await page.getByRole("link", { name: "Download the certificate (PDF)" }).getAttribute("href"))!;
      const response = await page.request.get(href);
      expect(response.status()).toBe(200);
      return { code: issued, pdf: new Uint8Array(await response.body()) };
    } finally {
      await context.close();
    }
  }

  it("is set by the school's admin, validated, printed on certificates issued after it and shown on their public page; an earlier certificate keeps none", async () => {
    const school = await createSchool();
    const schoolCohort = await createCertificateCohort({ schoolId: school.id });
    const schoolInstructor = await createAccount({ role: "instructor", name: "Ilse Marchbank", cohortId: schoolCohort.id, schoolId: school.id });
    const admin = await createAccount({ role: "admin", name: "Petra Lowndes", schoolId: school.id, password });
    const graduateOf = async (name: string) => {
      const person = await createAccount({ role: "learner", name, cohortId: schoolCohort.id, schoolId: school.id, password });
      await recordResults({ learnerId: person.id, cohortId: schoolCohort.id, reviewerId: schoolInstructor.id, results: passingResults() });
      return person;
    };

    const early = await issueThroughPage(await graduateOf("Edda Pomeroy"));
    const earlyText = (await readCertificatePdf(early.pdf)).text;
    for (const competence of certification.competences) expect(earlyText).toContain(competence);
    expect(earlyText).not.toContain("Signed for the school");

    for (const viewport of ["wide", "narrow"] as const) {
      const { context, page } = await openPage(browser, viewport);
      try {
        await signInThroughForm(page, { email: admin.email, password });
        await page.goto("/certificates");
        if (viewport === "wide") {
          await page.getByText("Nobody is named yet, so certificates carry no signatory.").waitFor();
          await page.getByLabel("Name", { exact: true }).fill(signatory.name);
          await page.getByLabel("Role at the school").fill(" ");
          await page.getByRole("button", { name: "Save the signatory" }).click();
          await page.getByText("Enter the signatory's role.").waitFor();
          await saveScreenshot(page, "certificate-admin-signatory-invalid");
          await page.getByLabel("Role at the school").fill(signatory.role);
          await page.getByRole("button", { name: "Save the signatory" }).click();
          await page.getByText(/^Saved\. Certificates issued from now on carry this signatory/).waitFor();
          await page.reload();
        }
        await page.getByText(`Certificates are signed by ${signatory.name}, ${signatory.role}.`).waitFor();
        expect(await page.getByLabel("Name", { exact: true }).inputValue()).toBe(signatory.name);
        expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
        await saveScreenshot(page, `certificate-admin-signatory-${viewport}`);
      } finally {
        await context.close();
      }
    }

    const late = await issueThroughPage(await graduateOf("Rasmus Oduya"));
    const lateText = (await readCertificatePdf(late.pdf)).text;
    expect(lateText).toContain(signatory.name);
    expect(lateText).toContain(signatory.role);
    expect(lateText).toContain(`${certification.studyHours} hours of study`);
    for (const competence of certification.competences) expect(lateText).toContain(competence);

    // Issued before the school named anyone: it keeps what it was issued with. Asked through the
    // public check for programs, from an address of its own, so the page loads below keep the
    // browser's address within its look-up limit.
    const earlyCheck = await fetchFrom(uniqueLoopbackAddress(), `${baseUrl}/api/certificates/verify/${early.code}`);
    expect(await earlyCheck.json()).toMatchObject({ status: "valid", signatory: null, competences: certification.competences });

    for (const viewport of ["wide", "narrow"] as const) {
      const { context, page } = await openPage(browser, viewport);
      try {
        await page.goto(`/c/${late.code}`);
        await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("This certificate is valid");
        expect(await page.getByText(signatory.name, { exact: true }).isVisible()).toBe(true);
        expect(await page.getByText(signatory.role, { exact: true }).isVisible()).toBe(true);
        expect(await page.getByText(`${certification.studyHours} hours of study`).isVisible()).toBe(true);
        const listed = await page.getByRole("region", { name: "What the holder can do" }).getByRole("listitem").allTextContents();
        expect(listed).toEqual(certification.competences);
        expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
        await saveScreenshot(page, `certificate-check-signatory-${viewport}`);

      } finally {
        await context.close();
      }
    }
  });
});
