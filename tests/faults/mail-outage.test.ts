/**
 * The SMTP server is down when an admin enrols a learner through the cohort page: the invitation
 * is kept, the admin is told it has not gone out, and the server process sends it on its own once
 * mail works again, without anyone pressing "Resend". Runs against the instance's real mail sink,
 * stopped and started, and reads the caught e-mail from the sink's HTTP API.
 */
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { invitations } from "@/db/schema";
import { previewInvitation } from "@/lib/auth/invitations";
import type { AppInstance } from "@/scripts/app-instance";
import { launchBrowser, openPage, saveScreenshot, signInAs } from "../e2e/support/browser";
import { countMessagesTo, tokenFromLink, waitForMessage } from "../integration/support/mail-sink";
import { findDemoCohortId } from "../integration/support/people";
import { startFaultInstance } from "./support/instance";

// A retry interval of a second (instead of a minute) so the background sender acts within the test.
const retrySeconds = 1;

let instance: AppInstance;
let browser: Browser;

beforeAll(async () => {
  instance = await startFaultInstance({ appEnv: { INVITATION_MAIL_RETRY_SECONDS: String(retrySeconds) } });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await instance?.stop();
});

describe("enrolling a learner while the mail server is down", () => {
  const email = `mail-outage.${randomUUID().slice(0, 8)}@faults.example`;
  const name = "Noor Lindqvist";

  it("keeps the invitation, tells the admin, and sends it on its own once mail is back", async () => {
    const cohortId = await findDemoCohortId();
    const { context, page } = await openPage(browser, "wide", instance.baseUrl);
    try {
      await signInAs(page, "admin");
      await instance.stopPart("mail");

      await page.goto(`/admin/cohorts/${cohortId}`);
      await page.getByLabel("Learner's name").fill(name);
      await page.getByLabel("Learner's e-mail").fill(email);
      await page.getByRole("button", { name: "Enrol and invite" }).click();
      await page.getByText(`${name} is enrolled. 1 invitation e-mail was not sent because the mail server did not answer.`, { exact: false }).waitFor();
      expect(await page.getByText("Edgewise keeps trying to send them on its own", { exact: false }).isVisible()).toBe(true);

      // Reopened later, the cohort page still says which invitation has not gone out.
      await page.goto(`/admin/cohorts/${cohortId}?q=${encodeURIComponent(email)}`);
      await page.getByText("1 invitation e-mail has not gone out yet", { exact: false }).waitFor();
      const line = page.getByRole("row", { name: new RegExp(name) });
      await line.getByText("E-mail not sent yet").filter({ visible: true }).waitFor();
      await saveScreenshot(page, "faults-mail-outage-cohort-wide");

      // Several tries fail while the server stays down; the row counts them and stays waiting.
      await expect.poll(async () => (await invitationOf(email)).mailAttempts, { timeout: 30_000 }).toBeGreaterThanOrEqual(2);
      expect((await invitationOf(email)).mailPendingSince).not.toBeNull();

      await instance.startPart("mail");
      const message = await waitForMessage({ to: email, subject: /invit/i, timeoutMs: 90_000 });
      const token = tokenFromLink(message, "/invitations/");
      expect(await previewInvitation({ token })).toMatchObject({ state: "usable", email, role: "learner" });
      expect((await invitationOf(email)).mailPendingSince).toBeNull();

      await page.goto(`/admin/cohorts/${cohortId}?q=${encodeURIComponent(email)}`);
      await page.getByRole("row", { name: new RegExp(name) }).getByText("Invitation pending").filter({ visible: true }).waitFor();
      expect(await page.getByText("has not gone out yet", { exact: false }).count()).toBe(0);

      // Sent once: a few more rounds of the background sender add nothing.
      await new Promise((resolve) => setTimeout(resolve, 4 * retrySeconds * 1_000));
      expect(await countMessagesTo(email)).toBe(1);
    } finally {
      await context.close();
    }
  });
});

async function invitationOf(email: string) {
  const rows = await db.select().from(invitations).where(eq(invitations.email, email));
  expect(rows).toHaveLength(1);
  return rows[0]!;
}
