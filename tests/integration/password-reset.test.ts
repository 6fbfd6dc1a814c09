import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { passwordResets } from "@/db/schema";
import { admitPasswordResetRequest, checkPasswordResetToken, completePasswordReset, requestPasswordReset } from "@/lib/auth/password-reset";
import { ruleOf } from "@/lib/rate-limit/limits";
import { createSession, validateSessionToken } from "@/lib/auth/session-store";
import { signInWithPassword } from "@/lib/auth/sign-in";
import { hashToken } from "@/lib/auth/tokens";
import { countMessagesTo, tokenFromLink, waitForMessage } from "./support/mail-sink";
import { createPerson, uniqueAddress, uniqueEmail } from "./support/people";

const oldPassword = "the old bench password";
const newPassword = "a brand new bench password";

describe("password reset", () => {
  it("e-mails a link, sets the new password, signs out every other session and retires the old password", async () => {
    const person = await createPerson({ role: "learner", password: oldPassword, label: "reset" });
    const laptop = await createSession(person.id);
    const phone = await createSession(person.id);

    await requestPasswordReset({ email: person.email });
    const message = await waitForMessage({ to: person.email, subject: /reset/i });
    expect(message.text).toContain("Hello Test learner,");
    const token = tokenFromLink(message, "/reset-password/");
    expect(await checkPasswordResetToken({ token })).toBe("usable");

    const completed = await completePasswordReset({ token, password: newPassword });
    if (!completed.ok) throw new Error(completed.reason);
    expect(completed.role).toBe("learner");

    expect((await validateSessionToken(laptop.value)).user).toBeNull();
    expect((await validateSessionToken(phone.value)).user).toBeNull();
    expect((await validateSessionToken(completed.cookie.value)).user?.id).toBe(person.id);

    const withOld = await signInWithPassword({ email: person.email, password: oldPassword, clientAddress: uniqueAddress() });
    expect(withOld).toEqual({ ok: false, reason: "invalid-credentials" });
    const withNew = await signInWithPassword({ email: person.email, password: newPassword, clientAddress: uniqueAddress() });
    expect(withNew.ok).toBe(true);
  });

  it("refuses a link a second time", async () => {
    const person = await createPerson({ role: "instructor", password: oldPassword, label: "reset-twice" });
    await requestPasswordReset({ email: person.email });
    const token = tokenFromLink(await waitForMessage({ to: person.email }), "/reset-password/");

    expect((await completePasswordReset({ token, password: newPassword })).ok).toBe(true);
    expect(await completePasswordReset({ token, password: "a third password entirely" })).toEqual({ ok: false, reason: "used" });
    expect(await checkPasswordResetToken({ token })).toBe("used");
    const signIn = await signInWithPassword({ email: person.email, password: newPassword, clientAddress: uniqueAddress() });
    expect(signIn.ok).toBe(true);
  });

  it("retires every open link of the account once one of them is used", async () => {
    const person = await createPerson({ role: "learner", password: oldPassword, label: "reset-siblings" });
    await requestPasswordReset({ email: person.email });
    const first = tokenFromLink(await waitForMessage({ to: person.email }), "/reset-password/");
    await requestPasswordReset({ email: person.email });
    const deadline = Date.now() + 10_000;
    let second = first;
    while (second === first && Date.now() < deadline) second = tokenFromLink(await waitForMessage({ to: person.email }), "/reset-password/");
    expect(second).not.toBe(first);

    expect((await completePasswordReset({ token: second, password: newPassword })).ok).toBe(true);
    expect(await completePasswordReset({ token: first, password: "sneaky other password" })).toEqual({ ok: false, reason: "used" });
  });

  it("refuses an expired link and keeps the old password", async () => {
    const person = await createPerson({ role: "learner", password: oldPassword, label: "reset-expired" });
    await requestPasswordReset({ email: person.email });
    const token = tokenFromLink(await waitForMessage({ to: person.email }), "/reset-password/");
    await db
      .update(passwordResets)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(passwordResets.tokenHash, hashToken(token)));

    expect(await checkPasswordResetToken({ token })).toBe("expired");
    expect(await completePasswordReset({ token, password: newPassword })).toEqual({ ok: false, reason: "expired" });
    const signIn = await signInWithPassword({ email: person.email, password: oldPassword, clientAddress: uniqueAddress() });
    expect(signIn.ok).toBe(true);
  });

  it("links expire sixty minutes after the request", async () => {
    const person = await createPerson({ role: "learner", password: oldPassword, label: "reset-lifetime" });
    const requestedAt = new Date();
    await requestPasswordReset({ email: person.email, now: requestedAt });
    const token = tokenFromLink(await waitForMessage({ to: person.email }), "/reset-password/");
    const later = (minutes: number) => new Date(requestedAt.getTime() + minutes * 60_000);
    expect(await checkPasswordResetToken({ token, now: later(59) })).toBe("usable");
    expect(await checkPasswordResetToken({ token, now: later(60) })).toBe("expired");
  });

  it("sends nothing for an unknown or deactivated address, and caps requests per account", async () => {
    const unknown = uniqueEmail("nobody");
    const inactive = await createPerson({ role: "learner", password: oldPassword, active: false, label: "inactive" });
    const active = await createPerson({ role: "learner", password: oldPassword, label: "capped" });

    await requestPasswordReset({ email: unknown });
    await requestPasswordReset({ email: inactive.email });
    const perEmail = ruleOf("password-reset", "person").points;
    const admitted = [];
    for (let i = 0; i < perEmail + 2; i += 1) {
      const decision = await admitPasswordResetRequest({ email: active.email, clientAddress: uniqueAddress() });
      admitted.push(decision.allowed);
      if (decision.allowed) await requestPasswordReset({ email: active.email });
    }
    expect(admitted).toEqual([...Array<boolean>(perEmail).fill(true), false, false]);

    // Mail to the active account proves the sink has caught up with everything sent before it.
    await waitForMessage({ to: active.email });
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(await countMessagesTo(unknown)).toBe(0);
    expect(await countMessagesTo(inactive.email)).toBe(0);
    expect(await countMessagesTo(active.email)).toBe(perEmail);
  });

  it("refuses an unknown token", async () => {
    const token = "Z".repeat(43);
    expect(await checkPasswordResetToken({ token })).toBe("unknown");
    expect(await completePasswordReset({ token, password: newPassword })).toEqual({ ok: false, reason: "unknown" });
  });
});
