import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { signInAttempts } from "@/db/schema";
import { signInWithPassword } from "@/lib/auth/sign-in";
import { signInLimits } from "@/lib/auth/throttle";
import { createPerson, uniqueAddress, uniqueEmail } from "./support/people";

const password = "correct horse on the bench";

async function failTimes(params: { email: string; clientAddress: string; times: number }) {
  for (let i = 0; i < params.times; i += 1) {
    const result = await signInWithPassword({ email: params.email, password: "definitely wrong", clientAddress: params.clientAddress });
    expect(result).toEqual({ ok: false, reason: "invalid-credentials" });
  }
}

describe("sign-in", () => {
  it("opens a session for the right password", async () => {
    const person = await createPerson({ role: "instructor", password });
    const result = await signInWithPassword({ email: person.email, password, clientAddress: uniqueAddress() });
    if (!result.ok) throw new Error(result.reason);
    expect(result.user).toEqual({
      id: person.id,
      schoolId: person.schoolId,
      email: person.email,
      name: person.name,
      role: "instructor",
      active: true,
    });
    expect(result.cookie.name).toBe("edgewise_session");
    expect(result.cookie.attributes).toMatchObject({ httpOnly: true, sameSite: "lax", secure: false });
  });

  it("answers a wrong password, an unknown address and a deactivated account the same way", async () => {
    const person = await createPerson({ role: "learner", password });
    const inactive = await createPerson({ role: "learner", password, active: false });
    const wrongPassword = await signInWithPassword({ email: person.email, password: "wrong", clientAddress: uniqueAddress() });
    const unknownEmail = await signInWithPassword({ email: uniqueEmail("ghost"), password, clientAddress: uniqueAddress() });
    const deactivated = await signInWithPassword({ email: inactive.email, password, clientAddress: uniqueAddress() });
    expect(wrongPassword).toEqual({ ok: false, reason: "invalid-credentials" });
    expect(unknownEmail).toEqual(wrongPassword);
    expect(deactivated).toEqual(wrongPassword);
  });
});

describe("sign-in throttling", () => {
  it(`refuses an account after ${signInLimits.failuresPerAccount} failures, even with the right password and from another address`, async () => {
    const person = await createPerson({ role: "learner", password });
    await failTimes({ email: person.email, clientAddress: uniqueAddress(), times: signInLimits.failuresPerAccount });

    const refused = await signInWithPassword({ email: person.email, password, clientAddress: uniqueAddress() });
    if (refused.ok || refused.reason !== "throttled") throw new Error("expected the account to be throttled");
    expect(refused.retryAfterMinutes).toBeGreaterThanOrEqual(signInLimits.windowMinutes - 1);
    expect(refused.retryAfterMinutes).toBeLessThanOrEqual(signInLimits.windowMinutes);
  });

  it("throttles an unknown address exactly like a real one, so the limit reveals nothing", async () => {
    const ghost = uniqueEmail("ghost");
    await failTimes({ email: ghost, clientAddress: uniqueAddress(), times: signInLimits.failuresPerAccount });
    const refused = await signInWithPassword({ email: ghost, password, clientAddress: uniqueAddress() });
    expect(refused).toMatchObject({ ok: false, reason: "throttled" });
  });

  it("lifts the lock once the failures are older than the window", async () => {
    const person = await createPerson({ role: "learner", password });
    await failTimes({ email: person.email, clientAddress: uniqueAddress(), times: signInLimits.failuresPerAccount });
    const afterWindow = new Date(Date.now() + signInLimits.windowMinutes * 60_000 + 1000);
    const result = await signInWithPassword({ email: person.email, password, clientAddress: uniqueAddress(), now: afterWindow });
    expect(result.ok).toBe(true);
  });

  it("counts failures only since the last successful sign-in", async () => {
    const person = await createPerson({ role: "learner", password });
    const address = uniqueAddress();
    await failTimes({ email: person.email, clientAddress: address, times: signInLimits.failuresPerAccount - 1 });
    expect((await signInWithPassword({ email: person.email, password, clientAddress: address })).ok).toBe(true);
    await failTimes({ email: person.email, clientAddress: address, times: signInLimits.failuresPerAccount - 1 });
    expect((await signInWithPassword({ email: person.email, password, clientAddress: address })).ok).toBe(true);
  });

  it(`refuses a client address after ${signInLimits.failuresPerAddress} failures across accounts, and only that address`, async () => {
    const address = uniqueAddress();
    // Recorded directly: hashing fifty wrong passwords would only slow the test down.
    await db.insert(signInAttempts).values(
      Array.from({ length: signInLimits.failuresPerAddress }, (_, i) => ({
        email: uniqueEmail(`sweep${i}`),
        clientAddress: address,
        succeeded: false,
      })),
    );
    const person = await createPerson({ role: "learner", password });
    const fromSweeper = await signInWithPassword({ email: person.email, password, clientAddress: address });
    expect(fromSweeper).toMatchObject({ ok: false, reason: "throttled" });
    const fromElsewhere = await signInWithPassword({ email: person.email, password, clientAddress: uniqueAddress() });
    expect(fromElsewhere.ok).toBe(true);
  });

  it("records every checked attempt, and none that were refused unchecked", async () => {
    const ghost = uniqueEmail("counted");
    const address = uniqueAddress();
    await failTimes({ email: ghost, clientAddress: address, times: signInLimits.failuresPerAccount });
    await signInWithPassword({ email: ghost, password, clientAddress: address });
    const rows = await db.select().from(signInAttempts).where(eq(signInAttempts.email, ghost));
    expect(rows).toHaveLength(signInLimits.failuresPerAccount);
    expect(rows.every((row) => !row.succeeded && row.clientAddress === address)).toBe(true);
  });
});
