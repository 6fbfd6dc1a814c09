import { randomUUID } from "node:crypto";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoCohorts, demoSchool } from "@/db/demo-data";
import { waitForMessage } from "../integration/support/mail-sink";
import { launchBrowser, openPage, saveScreenshot, signInAs, signInThroughForm } from "./support/browser";

// The sign-in, invitation and password-reset journeys as a person clicks through them, with the
// e-mails caught by the real mail sink.

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

function freshEmail(label: string): string {
  return `${label}.${randomUUID().slice(0, 8)}@e2e.example`;
}

async function expectAlert(page: Page, text: string): Promise<void> {
  await page.getByRole("status").filter({ hasText: text }).waitFor({ timeout: 15_000 });
}

/**
 * Clicks a submit button and waits for the server action's answer to arrive and be shown: React
 * resets the form when the action settles, so typing into it before then can be wiped out.
 */
async function submit(page: Page, button: string): Promise<void> {
  const submitButton = page.getByRole("button", { name: button, exact: true });
  await Promise.all([page.waitForResponse((response) => response.request().method() === "POST"), submitButton.click()]);
  await submitButton.and(page.locator(":enabled")).waitFor();
}

describe("invitation", () => {
  it("admin invites, the link in the caught mail sets up the account, and the learner lands in the course", async () => {
    const email = freshEmail("invitee");
    let acceptUrl = "";
    const admin = await openPage(browser, "wide");
    try {
      await signInAs(admin.page, "admin");
      await admin.page.getByLabel("E-mail address").fill(email);
      await admin.page.getByLabel("Cohort").selectOption({ label: demoCohorts[1].name });
      await admin.page.getByRole("button", { name: "Send invitation" }).click();
      await expectAlert(admin.page, `Invitation sent to ${email}.`);
      expect(await admin.page.getByText(email).count()).toBeGreaterThan(0);

      const message = await waitForMessage({ to: email, subject: /invitation/i });
      acceptUrl = message.text.match(/https?:\/\/\S+\/invitations\/\S+/)![0];
      await admin.page.goto("/dev/mail");
      expect(await admin.page.locator(`a[href="${acceptUrl}"]`).count()).toBe(1);
      await saveScreenshot(admin.page, "caught-mail-wide");
    } finally {
      await admin.context.close();
    }

    const invitee = await openPage(browser, "narrow");
    try {
      await invitee.page.goto(acceptUrl);
      expect(await invitee.page.getByText(`${demoCohorts[1].name}, ${demoSchool.name}`).isVisible()).toBe(true);
      await invitee.page.getByLabel("Your name").fill("Ines Varga-Holm");
      await invitee.page.getByLabel("Choose a password").fill("short");
      await invitee.page.getByLabel("Type the password again").fill("short");
      await invitee.page.getByRole("button", { name: "Set up my account" }).click();
      await invitee.page.getByText("Use at least 10 characters.").waitFor();
      expect(await invitee.page.getByLabel("Your name").inputValue()).toBe("Ines Varga-Holm");
      await saveScreenshot(invitee.page, "accept-invitation-error-narrow");

      await invitee.page.getByLabel("Choose a password").fill("scope ground spring clip");
      await invitee.page.getByLabel("Type the password again").fill("scope ground spring clip");
      await invitee.page.getByRole("button", { name: "Set up my account" }).click();
      await invitee.page.waitForURL("**/learn");
      expect(await invitee.page.getByRole("heading", { name: "Welcome, Ines" }).isVisible()).toBe(true);
      expect(await invitee.page.getByText(demoCohorts[1].name).isVisible()).toBe(true);

      await invitee.page.getByRole("button", { name: "Sign out" }).click();
      await invitee.page.waitForURL("**/sign-in?notice=signed-out");
      await invitee.page.goto(acceptUrl);
      expect(await invitee.page.getByText("This invitation has already been used.").isVisible()).toBe(true);

      await signInThroughForm(invitee.page, { email, password: "scope ground spring clip" });
      expect(new URL(invitee.page.url()).pathname).toBe("/learn");
    } finally {
      await invitee.context.close();
    }
  });

  it("a mangled invitation link shows a clear message, not an error", async () => {
    const { context, page } = await openPage(browser, "wide");
    try {
      const response = await page.goto("/invitations/%3Cscript%3E");
      expect(response?.status()).toBe(200);
      expect(await page.getByText("This invitation link is not valid.").isVisible()).toBe(true);
    } finally {
      await context.close();
    }
  });
});

describe("password reset", () => {
  it("the e-mailed link sets a new password and the old one stops working", async () => {
    const email = freshEmail("resetter");
    const { context, page } = await openPage(browser, "wide");
    try {
      // Accounts are only made by invitation, so this journey starts with one.
      await signInAs(page, "admin");
      await page.getByLabel("E-mail address").fill(email);
      await page.getByLabel("Role").selectOption("instructor");
      await page.getByRole("button", { name: "Send invitation" }).click();
      await expectAlert(page, `Invitation sent to ${email}.`);
      await context.clearCookies();
      const invitation = await waitForMessage({ to: email, subject: /invitation/i });
      await page.goto(invitation.text.match(/https?:\/\/\S+\/invitations\/\S+/)![0]);
      await page.getByLabel("Your name").fill("Oskar Mbeki-Laine");
      await page.getByLabel("Choose a password").fill("first password of many");
      await page.getByLabel("Type the password again").fill("first password of many");
      await page.getByRole("button", { name: "Set up my account" }).click();
      await page.waitForURL("**/cohorts");
      await context.clearCookies();

      await page.goto("/sign-in");
      await page.getByRole("link", { name: "Forgot your password?" }).click();
      await page.waitForURL("**/reset-password");
      await page.getByLabel("E-mail address").fill(email.toUpperCase());
      await page.getByRole("button", { name: "Send me a reset link" }).click();
      await expectAlert(page, "a link to choose a new password is on its way");
      await saveScreenshot(page, "reset-requested-wide");

      const resetMail = await waitForMessage({ to: email, subject: /reset/i });
      const resetUrl = resetMail.text.match(/https?:\/\/\S+\/reset-password\/\S+/)![0];
      await page.goto(resetUrl);
      await page.getByLabel("New password", { exact: true }).fill("second password now");
      await page.getByLabel("Type the new password again").fill("second password now");
      await page.getByRole("button", { name: "Save the new password" }).click();
      await page.waitForURL("**/cohorts");
      await context.clearCookies();

      await page.goto("/sign-in");
      await page.getByLabel("E-mail address").fill(email);
      await page.getByLabel("Password", { exact: true }).fill("first password of many");
      await page.getByRole("button", { name: "Sign in" }).click();
      await expectAlert(page, "That e-mail and password do not match an account.");

      await signInThroughForm(page, { email, password: "second password now" });
      expect(new URL(page.url()).pathname).toBe("/cohorts");

      await page.goto(resetUrl);
      expect(await page.getByText("This reset link has already been used.").isVisible()).toBe(true);
    } finally {
      await context.close();
    }
  });

  it("answers an unknown address exactly like a known one", async () => {
    const { context, page } = await openPage(browser, "narrow");
    try {
      await page.goto("/reset-password");
      const unknown = freshEmail("unknown");
      await page.getByLabel("E-mail address").fill(unknown);
      await page.getByRole("button", { name: "Send me a reset link" }).click();
      await expectAlert(page, `If an account uses ${unknown}, a link to choose a new password is on its way.`);
    } finally {
      await context.close();
    }
  });
});

describe("sign-in form", () => {
  it("explains bad input instead of failing, and keeps what was typed", async () => {
    const { context, page } = await openPage(browser, "narrow");
    try {
      await page.goto("/sign-in");
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.getByText("Enter your e-mail address.").waitFor();
      expect(await page.getByText("Enter your password.").isVisible()).toBe(true);

      await page.getByLabel("E-mail address").fill("not an address");
      await page.getByLabel("Password", { exact: true }).fill("whatever it is");
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.getByText("Enter a valid e-mail address, like name@example.com.").waitFor();
      expect(await page.getByLabel("E-mail address").inputValue()).toBe("not an address");
      expect(await page.getByLabel("E-mail address").getAttribute("aria-invalid")).toBe("true");
      await saveScreenshot(page, "sign-in-invalid-narrow");
    } finally {
      await context.close();
    }
  });

  it("refuses further attempts after five failures, with a clear wait time", async () => {
    const email = freshEmail("throttled");
    const { context, page } = await openPage(browser, "wide");
    try {
      await page.goto("/sign-in");
      for (let attempt = 1; attempt <= 5; attempt += 1) {
        await page.getByLabel("E-mail address").fill(email);
        await page.getByLabel("Password", { exact: true }).fill(`wrong guess ${attempt}`);
        await submit(page, "Sign in");
        await expectAlert(page, "That e-mail and password do not match an account.");
      }
      await page.getByLabel("Password", { exact: true }).fill("one more guess");
      await submit(page, "Sign in");
      await expectAlert(page, "Too many attempts. Try again in 15 minutes.");
      await saveScreenshot(page, "sign-in-throttled-wide");
    } finally {
      await context.close();
    }
  });
});
