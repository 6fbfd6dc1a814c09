/**
 * The caught-mail page keeps each school's mail in that school. Another school's admin goes after
 * a demo-school account the way an attacker would: invites its address (so that mail to it is
 * mail of their school too), asks for its password reset from the public form, then looks for the
 * reset link on the caught-mail page, and does not find it. The invitation answers as it would
 * for an address nobody has used. The demo school's admin sees the reset link and not the other
 * school's invitation. Real app, real mail sink, chromium.
 */
import { randomUUID } from "node:crypto";
import { eq, or } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { schools, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { findLinks } from "@/lib/mail/sink";
import { createPerson } from "../integration/support/people";
import { waitForMessage } from "../integration/support/mail-sink";
import { launchBrowser, openPage, saveScreenshot, signInAs, signInThroughForm } from "./support/browser";

const tag = randomUUID().slice(0, 8);
const attacker = { email: `admin@quarrydown-${tag}.example`, password: "quarry signal ground probe" };
let browser: Browser;
let schoolId = "";
let target: { id: string; email: string };

beforeAll(async () => {
  browser = await launchBrowser();
  const [school] = await db.insert(schools).values({ slug: `quarrydown-${tag}`, name: `Quarrydown Signal Institute ${tag}` }).returning();
  schoolId = school!.id;
  await db.insert(users).values({
    schoolId,
    email: attacker.email,
    name: "Vero Quill",
    role: "admin",
    passwordHash: await hashPassword(attacker.password),
  });
  target = await createPerson({ role: "instructor", password: "the demo instructor's own", label: "reset-target" });
});

afterAll(async () => {
  await browser?.close();
  // Sessions and reset links go with their accounts, invitations with their school.
  await db.delete(users).where(or(eq(users.schoolId, schoolId), eq(users.id, target.id)));
  await db.delete(schools).where(eq(schools.id, schoolId));
});

async function invite(page: Page, email: string): Promise<string> {
  await page.goto("/admin");
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Role").selectOption("instructor");
  await page.getByRole("button", { name: "Send invitation" }).click();
  const answer = page.getByRole("status").filter({ hasText: email });
  await answer.waitFor({ timeout: 15_000 });
  return (await answer.innerText()).replaceAll(email, "<address>");
}

/** Every link on the caught-mail page. */
async function caughtLinks(page: Page): Promise<string[]> {
  await page.goto("/dev/mail");
  await page.getByRole("heading", { name: "Caught mail" }).waitFor();
  return page.locator("main a[href^='http']").evaluateAll((anchors) => anchors.map((a) => (a as HTMLAnchorElement).href));
}

describe("the caught-mail page", () => {
  it("never shows one school's admin another school's password-reset link", async () => {
    const outsider = await openPage(browser, "wide");
    try {
      await signInThroughForm(outsider.page, attacker);
      const forTarget = await invite(outsider.page, target.email);
      const forNobody = await invite(outsider.page, `nobody.${tag}@quarrydown-${tag}.example`);
      expect(forTarget).toBe("Invitation sent to <address>.");
      expect(forTarget).toBe(forNobody);
      const invitation = await waitForMessage({ to: target.email, subject: /invitation/i });
      const invitationLink = findLinks(invitation.text).find((link) => link.includes("/invitations/"))!;

      // Anyone may ask for a reset of any address on the public form.
      await outsider.page.goto("/reset-password");
      await outsider.page.getByLabel("E-mail address").fill(target.email);
      await outsider.page.getByRole("button", { name: "Send me a reset link" }).click();
      await outsider.page.getByRole("status").filter({ hasText: "a link to choose a new password is on its way" }).waitFor();
      const reset = await waitForMessage({ to: target.email, subject: /reset/i });
      const resetLink = findLinks(reset.text).find((link) => link.includes("/reset-password/"))!;
      expect(resetLink).toBeDefined();

      const outsiderSees = await caughtLinks(outsider.page);
      expect(outsiderSees).toContain(invitationLink);
      expect(outsiderSees).not.toContain(resetLink);
      const token = new URL(resetLink).pathname.split("/").pop()!;
      expect(await outsider.page.content()).not.toContain(token);
      await saveScreenshot(outsider.page, "caught-mail-other-school-wide");
    } finally {
      await outsider.context.close();
    }

    const home = await openPage(browser, "wide");
    try {
      await signInAs(home.page, "admin");
      const homeSees = await caughtLinks(home.page);
      const reset = await waitForMessage({ to: target.email, subject: /reset/i });
      expect(homeSees).toContain(findLinks(reset.text).find((link) => link.includes("/reset-password/")));
      const invitation = await waitForMessage({ to: target.email, subject: /invitation/i });
      expect(homeSees).not.toContain(findLinks(invitation.text).find((link) => link.includes("/invitations/")));
    } finally {
      await home.context.close();
    }
  });
});
