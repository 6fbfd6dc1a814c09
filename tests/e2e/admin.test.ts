import { randomUUID } from "node:crypto";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { cohortMemberships, cohorts, schools, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { listCaughtMessages } from "@/lib/mail/sink";
import { launchBrowser, openPage, saveScreenshot, signInThroughForm } from "./support/browser";

// A school admin in a real browser: creates a cohort, uploads a CSV, reads the preview with its
// duplicate and invalid rows, imports; then an invited learner opens the link caught by the mail
// sink, sets a password and lands signed in. The school is made for this run, so the seeded demo
// school that other browser tests read stays as it is.

const tag = randomUUID().slice(0, 8);
const domain = `e2e-${tag}.example`;
const adminAccount = { email: `admin@${domain}`, password: "copper ground plane", name: "Maren Oakhurst" };
const instructorName = "Tobias Wrenfield";
const existingLearner = { name: "Yara Pell", email: `yara@${domain}` };
const newLearners = [
  { name: "Ines Varga", email: `ines@${domain}` },
  { name: "Brandt, Ole", email: `ole@${domain}` },
  { name: "Kalani Moreau", email: `kalani@${domain}` },
];
const cohortName = `Evening runs ${tag}`;

let browser: Browser;
let cohortPath = "";

beforeAll(async () => {
  browser = await launchBrowser();
  const [school] = await db.insert(schools).values({ slug: `e2e-${tag}`, name: `Harrowgate Signal School ${tag}` }).returning();
  const passwordHash = await hashPassword(adminAccount.password);
  const [, , learner] = await db
    .insert(users)
    .values([
      { schoolId: school!.id, role: "admin", passwordHash, ...adminAccount },
      { schoolId: school!.id, role: "instructor", passwordHash, name: instructorName, email: `tobias@${domain}` },
      { schoolId: school!.id, role: "learner", passwordHash, ...existingLearner },
    ])
    .returning();
  // The existing learner is in an older cohort, so the new cohort's import meets them as "already at the school".
  const [older] = await db
    .insert(cohorts)
    .values({ schoolId: school!.id, name: `Earlier runs ${tag}`, courseSlug: "data-runs", startsOn: "2026-01-05", endsOn: "2026-03-27" })
    .returning();
  await db.insert(cohortMemberships).values({ cohortId: older!.id, userId: learner!.id, role: "learner" });
});

afterAll(async () => {
  await browser?.close();
});

async function signInAsAdmin(page: Page): Promise<void> {
  await signInThroughForm(page, adminAccount);
  expect(new URL(page.url()).pathname).toBe("/admin");
}

function statusRows(page: Page, status: "valid" | "duplicate" | "invalid") {
  return page.locator(`tbody tr[data-status="${status}"]`);
}

describe("school admin: cohort, CSV import, invitation", () => {
  it("creates a cohort, with clear answers to a bad date range and a taken name", async () => {
    const { context, page } = await openPage(browser, "wide");
    const errors: string[] = [];
    page.on("pageerror", (error) => errors.push(error.message));
    try {
      await signInAsAdmin(page);
      await page.getByRole("link", { name: "New cohort" }).click();
      await page.waitForURL("**/admin/cohorts/new");
      await page.getByLabel("Cohort name").fill(cohortName);
      await page.getByLabel("First day").fill("2026-09-14");
      await page.getByLabel("Last day").fill("2026-09-01");
      await page.getByLabel(instructorName).check();
      await page.getByRole("button", { name: "Create cohort" }).click();
      await page.getByText("The last day cannot be before the first day.").waitFor();
      expect(await page.getByLabel("Cohort name").inputValue()).toBe(cohortName);
      expect(await page.getByLabel(instructorName).isChecked()).toBe(true);
      await saveScreenshot(page, "admin-cohort-form-error-wide");

      await page.getByLabel("Last day").fill("2026-12-18");
      await page.getByRole("button", { name: "Create cohort" }).click();
      await page.waitForURL(/\/admin\/cohorts\/[0-9a-f-]{36}\?notice=created$/);
      cohortPath = new URL(page.url()).pathname;
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(cohortName);
      expect(await page.getByText(`taught by ${instructorName}`).isVisible()).toBe(true);
      expect(await page.getByText("Cohort created.", { exact: false }).isVisible()).toBe(true);

      await page.goto("/admin/cohorts/new");
      await page.getByLabel("Cohort name").fill(`Earlier runs ${tag}`);
      await page.getByLabel("First day").fill("2026-09-14");
      await page.getByLabel("Last day").fill("2026-12-18");
      await page.getByRole("button", { name: "Create cohort" }).click();
      await page.getByText("Another cohort at your school already has this name.").waitFor();
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it("uploads a CSV, sees every row classified before anything is written, and imports the valid ones", async () => {
    const csv = [
      "\uFEFFName;E-mail",
      ...newLearners.map((learner) => `"${learner.name}";${learner.email}`),
      `Ines again;INES@${domain}`,
      `${existingLearner.name};${existingLearner.email}`,
      "No Address;not-an-address",
    ].join("\r\n");

    for (const viewport of ["narrow", "wide"] as const) {
      const { context, page } = await openPage(browser, viewport);
      try {
        await signInAsAdmin(page);
        await page.goto(cohortPath);
        await page.getByRole("link", { name: "Import a CSV list" }).click();
        await page.waitForURL(`**${cohortPath}/import`);
        await page.getByLabel("CSV file").setInputFiles({ name: "evening-runs.csv", mimeType: "text/csv", buffer: Buffer.from(csv, "utf8") });
        await page.getByRole("button", { name: "Check the file" }).click();
        await page.getByRole("heading", { name: "Preview of evening-runs.csv" }).waitFor();

        expect(await statusRows(page, "valid").count()).toBe(3);
        expect(await statusRows(page, "duplicate").count()).toBe(2);
        expect(await statusRows(page, "invalid").count()).toBe(1);
        expect(await statusRows(page, "duplicate").filter({ hasText: "Same e-mail address as row 2." }).count()).toBe(1);
        expect(await statusRows(page, "duplicate").filter({ hasText: "Already has an account at this school" }).count()).toBe(1);
        expect(await statusRows(page, "invalid").filter({ hasText: "“not-an-address” is not an e-mail address." }).count()).toBe(1);
        expect(await statusRows(page, "valid").getByText("Brandt, Ole", { exact: true }).isVisible()).toBe(true);
        await saveScreenshot(page, `admin-import-preview-${viewport}`);

        await page.getByRole("button", { name: "Invalid · 1" }).click();
        expect(await page.locator("tbody tr").count()).toBe(1);
        await page.getByRole("button", { name: "All rows · 6" }).click();
        expect(await page.locator("tbody tr").count()).toBe(6);

        if (viewport === "wide") {
          await page.getByRole("button", { name: "Import 3 valid rows" }).click();
          await page.getByText("Imported 3 learners. 3 invitation e-mails were sent.").waitFor({ timeout: 30_000 });
          await saveScreenshot(page, "admin-import-done-wide");
          await page.getByRole("link", { name: `See the learners of ${cohortName}` }).click();
          await page.waitForURL(`**${cohortPath}?notice=imported`);
          for (const learner of newLearners) {
            const row = page.locator("tbody tr").filter({ hasText: learner.email });
            expect(await row.getByText("Invitation pending").filter({ visible: true }).count()).toBe(1);
          }
          expect(await page.getByRole("link", { name: "Invitation pending · 3" }).isVisible()).toBe(true);
          await saveScreenshot(page, "admin-cohort-roster-wide");
        } else {
          // The narrow run only looks; nothing it previewed has been written.
          await page.goto(cohortPath);
          expect(await page.getByText("Nobody is enrolled yet.", { exact: false }).isVisible()).toBe(true);
        }
      } finally {
        await context.close();
      }
    }
  });

  it("lets an invited learner accept from the caught e-mail and land signed in", async () => {
    const learner = newLearners[0]!;
    const messages = await listCaughtMessages({ to: learner.email });
    expect(messages).toHaveLength(1);
    expect(messages[0]!.subject).toMatch(/^Your invitation to Harrowgate Signal School/);
    const acceptUrl = messages[0]!.text.match(/https?:\/\/\S+\/invitations\/[A-Za-z0-9_-]{43}/)![0];

    const { context, page } = await openPage(browser, "narrow");
    try {
      await page.goto(new URL(acceptUrl).pathname);
      expect(await page.getByText(cohortName, { exact: false }).first().isVisible()).toBe(true);
      await page.getByLabel("Your name").fill("Ines Varga-Holm");
      await page.getByLabel("Choose a password").fill("scope probe spring clip");
      await page.getByLabel("Type the password again").fill("scope probe spring clip");
      await saveScreenshot(page, "admin-invited-learner-accept-narrow");
      await page.getByRole("button", { name: "Set up my account" }).click();
      await page.waitForURL("**/learn");
      expect(await page.getByRole("button", { name: "Sign out" }).isVisible()).toBe(true);
      await saveScreenshot(page, "admin-invited-learner-signed-in-narrow");
    } finally {
      await context.close();
    }

    const admin = await openPage(browser, "narrow");
    try {
      await signInAsAdmin(admin.page);
      await admin.page.goto(`${cohortPath}?state=accepted`);
      const row = admin.page.locator("tbody tr").filter({ hasText: learner.email });
      expect(await row.getByText("Ines Varga-Holm").isVisible()).toBe(true);
      expect(await row.getByText("Accepted").filter({ visible: true }).count()).toBe(1);
      await saveScreenshot(admin.page, "admin-cohort-roster-accepted-narrow");
    } finally {
      await admin.context.close();
    }
  });
});
