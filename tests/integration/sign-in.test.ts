import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { rateLimits } from "@/db/schema";
import { signInWithPassword, type SignInResult } from "@/lib/auth/sign-in";
import { ruleOf } from "@/lib/rate-limit/limits";
import { createPerson, uniqueAddress, uniqueEmail } from "./support/people";

const password = "correct horse on the bench";
const perAccount = ruleOf("sign-in-failure", "person");
const perAddress = ruleOf("sign-in-failure", "address");

async function failTimes(params: { email: string; clientAddress: string; times: number }) {
  for (let i = 0; i < params.times; i += 1) {
    const result = await signInWithPassword({ email: params.email, password: "definitely wrong", clientAddress: params.clientAddress });
    expect(result).toEqual({ ok: false, reason: "invalid-credentials" });
  }
}

/** Ends the current window of a count now, as if its time had passed. */
async function endWindow(key: string) {
  await db.update(rateLimits).set({ expire: Date.now() - 1 }).where(eq(rateLimits.key, key));
}

const tally = (results: SignInResult[]) => ({
  checked: results.filter((r) => !r.ok && r.reason === "invalid-credentials").length,
  throttled: results.filter((r) => !r.ok && r.reason === "throttled").length,
});

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
  it(`refuses an account after ${perAccount.points} failures, even with the right password and from another address`, async () => {
    const person = await createPerson({ role: "learner", password });
    await failTimes({ email: person.email, clientAddress: uniqueAddress(), times: perAccount.points });

    const refused = await signInWithPassword({ email: person.email, password, clientAddress: uniqueAddress() });
    if (refused.ok || refused.reason !== "throttled") throw new Error("expected the account to be throttled");
    expect(refused.retryAfterSeconds).toBeGreaterThan(perAccount.windowSeconds - 60);
    expect(refused.retryAfterSeconds).toBeLessThanOrEqual(perAccount.windowSeconds);
  });

  it("throttles an unknown address exactly like a real one, so the limit reveals nothing", async () => {
    const ghost = uniqueEmail("ghost");
    await failTimes({ email: ghost, clientAddress: uniqueAddress(), times: perAccount.points });
    const refused = await signInWithPassword({ email: ghost, password, clientAddress: uniqueAddress() });
    expect(refused).toMatchObject({ ok: false, reason: "throttled" });
  });

  it("lifts the lock once the window is over", async () => {
    const person = await createPerson({ role: "learner", password });
    await failTimes({ email: person.email, clientAddress: uniqueAddress(), times: perAccount.points });
    expect(await signInWithPassword({ email: person.email, password, clientAddress: uniqueAddress() })).toMatchObject({ reason: "throttled" });
    await endWindow(`sign-in-failure:person:${person.email}`);
    const result = await signInWithPassword({ email: person.email, password, clientAddress: uniqueAddress() });
    expect(result.ok).toBe(true);
  });

  it("counts failures only since the last successful sign-in", async () => {
    const person = await createPerson({ role: "learner", password });
    const address = uniqueAddress();
    await failTimes({ email: person.email, clientAddress: address, times: perAccount.points - 1 });
    expect((await signInWithPassword({ email: person.email, password, clientAddress: address })).ok).toBe(true);
    await failTimes({ email: person.email, clientAddress: address, times: perAccount.points - 1 });
    expect((await signInWithPassword({ email: person.email, password, clientAddress: address })).ok).toBe(true);
  });

  it(`refuses a client address after ${perAddress.points} failures across accounts, and only that address`, async () => {
    const address = uniqueAddress();
    // Counted directly: hashing fifty wrong passwords one after another would only slow the test down.
    await db.insert(rateLimits).values({ key: `sign-in-failure:address:${address}`, points: perAddress.points, expire: Date.now() + 60_000 });
    const person = await createPerson({ role: "learner", password });
    const fromSweeper = await signInWithPassword({ email: person.email, password, clientAddress: address });
    expect(fromSweeper).toMatchObject({ ok: false, reason: "throttled" });
    const fromElsewhere = await signInWithPassword({ email: person.email, password, clientAddress: uniqueAddress() });
    expect(fromElsewhere.ok).toBe(true);
  });

  it("does not count a refused attempt against the other limit, so a locked account does not lock out its address", async () => {
    const person = await createPerson({ role: "learner", password });
    const address = uniqueAddress();
    await failTimes({ email: person.email, clientAddress: address, times: perAccount.points });
    for (let i = 0; i < 10; i += 1) {
      expect(await signInWithPassword({ email: person.email, password, clientAddress: address })).toMatchObject({ reason: "throttled" });
    }
    const [addressCount] = await db.select().from(rateLimits).where(eq(rateLimits.key, `sign-in-failure:address:${address}`));
    expect(addressCount?.points).toBe(perAccount.points);
  });
});

describe("sign-in throttling under concurrent attempts", () => {
  it(`checks at most ${perAccount.points} of 50 wrong passwords sent at once for one account`, async () => {
    const person = await createPerson({ role: "learner", password });
    const results = await Promise.all(
      Array.from({ length: 50 }, () => signInWithPassword({ email: person.email, password: "wrong at once", clientAddress: uniqueAddress() })),
    );
    // Every password that was checked was answered "invalid-credentials"; the others were refused unchecked.
    expect(tally(results)).toEqual({ checked: perAccount.points, throttled: 50 - perAccount.points });
    expect(await signInWithPassword({ email: person.email, password, clientAddress: uniqueAddress() })).toMatchObject({ reason: "throttled" });
  });

  it(`checks at most ${perAccount.points} of 50 at once from one address either, and refuses the rest`, async () => {
    const ghost = uniqueEmail("burst");
    const address = uniqueAddress();
    const results = await Promise.all(
      Array.from({ length: 50 }, () => signInWithPassword({ email: ghost, password: "wrong at once", clientAddress: address })),
    );
    expect(tally(results)).toEqual({ checked: perAccount.points, throttled: 50 - perAccount.points });
  });

  it(`checks at most ${perAddress.points} of ${perAddress.points + 20} wrong passwords sent at once from one address to many accounts`, async () => {
    const address = uniqueAddress();
    const total = perAddress.points + 20;
    const results = await Promise.all(
      Array.from({ length: total }, (_, i) => signInWithPassword({ email: uniqueEmail(`spray${i}`), password: "wrong at once", clientAddress: address })),
    );
    expect(tally(results)).toEqual({ checked: perAddress.points, throttled: total - perAddress.points });
  });
});
