import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { demoAdmin, demoCohorts } from "@/db/demo-data";
import { cohortMemberships, invitations, users } from "@/db/schema";
import { acceptInvitation, issueInvitation, previewInvitation } from "@/lib/auth/invitations";
import { invalidateSession, validateSessionToken } from "@/lib/auth/session-store";
import { signInWithPassword } from "@/lib/auth/sign-in";
import { hashToken } from "@/lib/auth/tokens";
import { tokenFromLink, waitForMessage } from "./support/mail-sink";
import { findDemoAdmin, findDemoCohortId, findDemoSchoolId, uniqueAddress, uniqueEmail } from "./support/people";

async function invite(email: string, cohortId: string | null = null) {
  const result = await issueInvitation({
    schoolId: await findDemoSchoolId(),
    email,
    role: "learner",
    cohortId,
    inviter: { id: (await findDemoAdmin()).id, name: "Noor <b>Whitcombe</b>" },
  });
  expect(result.ok).toBe(true);
  return result;
}

describe("invitation → set password → sign in → sign out", () => {
  it("takes an invited learner from the e-mailed link to a working account", async () => {
    const email = uniqueEmail("invited");
    const cohortId = await findDemoCohortId();
    await invite(email, cohortId);

    const message = await waitForMessage({ to: email, subject: /invitation/i });
    expect(message.subject).toBe("Your invitation to Fernhallow Trades College on Edgewise");
    expect(message.text).toContain(demoCohorts[0].name);
    // The inviter's name is person-supplied text: it must arrive escaped in the HTML part.
    expect(message.html).toContain("Noor &lt;b&gt;Whitcombe&lt;/b&gt;");
    expect(message.html).not.toContain("<b>Whitcombe</b>");
    const token = tokenFromLink(message, "/invitations/");

    const [stored] = await db.select().from(invitations).where(eq(invitations.email, email));
    expect(stored?.tokenHash).toBe(hashToken(token));
    expect(JSON.stringify(stored)).not.toContain(token);

    expect(await previewInvitation({ token })).toMatchObject({ state: "usable", email, role: "learner" });

    const accepted = await acceptInvitation({ token, name: "Ines Varga-Holm", password: "bench scope probe ground" });
    if (!accepted.ok) throw new Error(`accept failed: ${accepted.reason}`);
    expect(accepted.role).toBe("learner");
    expect(accepted.cookie.attributes).toMatchObject({ httpOnly: true, sameSite: "lax", path: "/" });

    const session = await validateSessionToken(accepted.cookie.value);
    expect(session.user).toMatchObject({ email, name: "Ines Varga-Holm", role: "learner" });

    const [membership] = await db
      .select()
      .from(cohortMemberships)
      .where(and(eq(cohortMemberships.userId, accepted.userId), eq(cohortMemberships.cohortId, cohortId)));
    expect(membership?.role).toBe("learner");

    const signedIn = await signInWithPassword({ email, password: "bench scope probe ground", clientAddress: uniqueAddress() });
    if (!signedIn.ok) throw new Error(`sign-in failed: ${signedIn.reason}`);
    expect(signedIn.user.id).toBe(accepted.userId);

    await invalidateSession((await validateSessionToken(signedIn.cookie.value)).sessionId!);
    expect((await validateSessionToken(signedIn.cookie.value)).user).toBeNull();
    // Signing out one session leaves the other one alone.
    expect((await validateSessionToken(accepted.cookie.value)).user?.id).toBe(accepted.userId);
  });
});

describe("invitation links that cannot be used", () => {
  it("refuses a link a second time and creates no second account", async () => {
    const email = uniqueEmail("reused");
    await invite(email);
    const token = tokenFromLink(await waitForMessage({ to: email }), "/invitations/");

    expect((await acceptInvitation({ token, name: "First Use", password: "first password here" })).ok).toBe(true);
    expect(await acceptInvitation({ token, name: "Second Use", password: "second password here" })).toEqual({
      ok: false,
      reason: "used",
    });
    expect(await previewInvitation({ token })).toEqual({ state: "used" });
    const accounts = await db.select().from(users).where(eq(users.email, email));
    expect(accounts.map((account) => account.name)).toEqual(["First Use"]);
  });

  it("accepts only one of two simultaneous submissions of the same link", async () => {
    const email = uniqueEmail("double");
    await invite(email);
    const token = tokenFromLink(await waitForMessage({ to: email }), "/invitations/");
    const results = await Promise.all([
      acceptInvitation({ token, name: "Tab One", password: "double click one" }),
      acceptInvitation({ token, name: "Tab Two", password: "double click two" }),
    ]);
    expect(results.filter((result) => result.ok)).toHaveLength(1);
    expect(await db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
  });

  it("refuses an expired link", async () => {
    const email = uniqueEmail("expired");
    await invite(email);
    const token = tokenFromLink(await waitForMessage({ to: email }), "/invitations/");
    await db
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 60_000) })
      .where(eq(invitations.tokenHash, hashToken(token)));

    expect(await previewInvitation({ token })).toEqual({ state: "expired" });
    expect(await acceptInvitation({ token, name: "Too Late", password: "too late password" })).toEqual({
      ok: false,
      reason: "expired",
    });
    expect(await db.select().from(users).where(eq(users.email, email))).toHaveLength(0);
  });

  it("expires links seven days after they are sent", async () => {
    const email = uniqueEmail("lifetime");
    const sentAt = new Date("2026-03-01T09:00:00Z");
    const result = await issueInvitation({
      schoolId: await findDemoSchoolId(),
      email,
      role: "learner",
      cohortId: null,
      inviter: null,
      now: sentAt,
    });
    if (!result.ok) throw new Error(result.reason);
    expect(result.expiresAt.toISOString()).toBe("2026-03-08T09:00:00.000Z");
    const token = tokenFromLink(await waitForMessage({ to: email }), "/invitations/");
    expect((await previewInvitation({ token, now: new Date("2026-03-08T08:59:00Z") })).state).toBe("usable");
    expect((await previewInvitation({ token, now: new Date("2026-03-08T09:00:00Z") })).state).toBe("expired");
  });

  it("revokes the older link when the same person is invited again", async () => {
    const email = uniqueEmail("reinvited");
    await invite(email);
    const firstToken = tokenFromLink(await waitForMessage({ to: email }), "/invitations/");
    await invite(email);
    const deadline = Date.now() + 10_000;
    let secondToken = firstToken;
    while (secondToken === firstToken && Date.now() < deadline) {
      secondToken = tokenFromLink(await waitForMessage({ to: email }), "/invitations/");
    }
    expect(secondToken).not.toBe(firstToken);

    expect(await previewInvitation({ token: firstToken })).toEqual({ state: "revoked" });
    expect(await acceptInvitation({ token: firstToken, name: "Old Link", password: "old link password" })).toEqual({
      ok: false,
      reason: "revoked",
    });
    expect((await acceptInvitation({ token: secondToken, name: "New Link", password: "new link password" })).ok).toBe(true);
  });

  it("refuses an unknown token", async () => {
    const token = "A".repeat(43);
    expect(await previewInvitation({ token })).toEqual({ state: "unknown" });
    expect(await acceptInvitation({ token, name: "Nobody", password: "nobody password" })).toEqual({
      ok: false,
      reason: "unknown",
    });
  });

  it("does not invite an address that already has an account at the school", async () => {
    const result = await issueInvitation({
      schoolId: await findDemoSchoolId(),
      email: demoAdmin.email,
      role: "learner",
      cohortId: null,
      inviter: null,
    });
    expect(result).toEqual({ ok: false, reason: "already-registered" });
  });
});
