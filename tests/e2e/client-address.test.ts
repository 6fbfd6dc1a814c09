/**
 * Client addresses and rate limits over real connections to the production build: the limits
 * count the connection's own address, so a forged X-Forwarded-For neither escapes a limit nor locks
 * out the address it names while TRUSTED_PROXIES is empty; a second server on the same database
 * with TRUSTED_PROXIES set believes the header from its trusted proxy only; both servers count
 * against the same limits; the certificate's public page shares the look-up limit and answers 429
 * over it; and the limited server actions answer with the wait as form state.
 * Each client connects from an address of its own in 127.0.0.0/8, as another computer would.
 */
import { randomBytes, randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { encodeCertificateCode } from "@/lib/certificates/code";
import { ruleOf } from "@/lib/rate-limit/limits";
import { fetchFrom, uniqueLoopbackAddress } from "../support/loopback-client";
import { builtActionId } from "./support/app-surface";
import { baseUrl } from "./support/browser";
import { startProductionServer } from "./support/second-server";
import { callAction } from "./support/server-actions";

const lookups = ruleOf("certificate-lookup", "address");
// The test connects to the second server from 127.0.0.1, so that address plays its load balancer.
const trustedProxy = "127.0.0.1";

/** A well-formed code no certificate has: it is looked up (404), so it counts like any other. */
const anyCode = () => encodeCertificateCode(randomBytes(10));
/** A documentation-range address (RFC 5737) for X-Forwarded-For; nothing is ever sent to it. */
const documentationAddress = () => `198.51.100.${1 + Math.floor(Math.random() * 254)}`;

async function lookUp(origin: string, from: string, forwardedFor?: string): Promise<Response> {
  return fetchFrom(from, `${origin}/api/certificates/verify/${anyCode()}`, {
    headers: forwardedFor === undefined ? {} : { "x-forwarded-for": forwardedFor },
  });
}

async function spendLookups(origin: string, from: string, times: number, forwardedFor: () => string | undefined): Promise<void> {
  for (let i = 0; i < times; i += 1) expect((await lookUp(origin, from, forwardedFor())).status, `look-up ${i + 1}`).toBe(404);
}

let proxied: { origin: string; stop: () => Promise<void> };
beforeAll(async () => {
  proxied = await startProductionServer({ TRUSTED_PROXIES: `${trustedProxy}, 10.0.0.0/8` });
});
afterAll(async () => {
  await proxied?.stop();
});

describe("with no trusted proxy (the default)", () => {
  it("counts the connection's address: a forged X-Forwarded-For neither escapes the limit nor locks out the address it names", async () => {
    const attacker = uniqueLoopbackAddress();
    const victim = uniqueLoopbackAddress();
    // Every look-up claims to come from somewhere else, half of them from the victim.
    let turn = 0;
    await spendLookups(baseUrl, attacker, lookups.points, () => (++turn % 2 ? victim : `${documentationAddress()}, ${victim}`));
    const refused = await lookUp(baseUrl, attacker, documentationAddress());
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(lookups.windowSeconds - 60);
    expect((await lookUp(baseUrl, attacker)).status).toBe(429);
    expect((await lookUp(baseUrl, victim)).status).toBe(404);
  });

  it("gives a client that sends no X-Forwarded-For its own count, not one shared with every such client", async () => {
    const busy = uniqueLoopbackAddress();
    await spendLookups(baseUrl, busy, lookups.points, () => undefined);
    expect((await lookUp(baseUrl, busy)).status).toBe(429);
    expect((await lookUp(baseUrl, uniqueLoopbackAddress())).status).toBe(404);
  });
});

describe("with TRUSTED_PROXIES set", () => {
  it("counts the address the trusted proxy appended, and nothing the client wrote before it", async () => {
    const client = documentationAddress();
    await spendLookups(proxied.origin, trustedProxy, lookups.points, () => `${documentationAddress()}, ${client}`);
    expect((await lookUp(proxied.origin, trustedProxy, client)).status).toBe(429);
    // Behind two trusted hops the client is still the first untrusted address from the right.
    expect((await lookUp(proxied.origin, trustedProxy, `${client}, 10.9.8.7`)).status).toBe(429);
    expect((await lookUp(proxied.origin, trustedProxy, `${client}, ${documentationAddress()}`)).status).toBe(404);
  });

  it("ignores X-Forwarded-For from a connection that is not a trusted proxy", async () => {
    const direct = uniqueLoopbackAddress();
    const named = documentationAddress();
    await spendLookups(proxied.origin, direct, lookups.points, () => named);
    expect((await lookUp(proxied.origin, direct, documentationAddress())).status).toBe(429);
    expect((await lookUp(proxied.origin, trustedProxy, named)).status).toBe(404);
  });
});

describe("two app servers on one database", () => {
  it("count every address against the same limit", async () => {
    const roaming = uniqueLoopbackAddress();
    const half = Math.floor(lookups.points / 2);
    await spendLookups(baseUrl, roaming, half, () => undefined);
    await spendLookups(proxied.origin, roaming, lookups.points - half, () => undefined);
    expect((await lookUp(baseUrl, roaming)).status).toBe(429);
    expect((await lookUp(proxied.origin, roaming)).status).toBe(429);
  });
});

describe("the certificate's public page", () => {
  it("counts against the address's look-up limit with the API, and over it answers 429 with the wait", async () => {
    const from = uniqueLoopbackAddress();
    const openPage = (code: string, headers: Record<string, string> = {}) => fetchFrom(from, `${baseUrl}/c/${code}`, { headers });
    expect((await openPage(anyCode())).status).toBe(404);
    // A prefetch renders the page too, so it is counted like a visit.
    expect((await openPage(anyCode(), { "next-router-prefetch": "1" })).status).toBe(404);
    await spendLookups(baseUrl, from, lookups.points - 2, () => undefined);
    const refused = await openPage(anyCode());
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(lookups.windowSeconds - 60);
    expect(await refused.text()).toMatch(/Too many certificate checks[\s\S]*Wait \d+ minutes?/);
    expect((await lookUp(baseUrl, from)).status).toBe(429);
    // A malformed code is not looked up, so it is not counted or refused: it is simply not found.
    expect((await openPage("not-a-code")).status).toBe(404);
  });
});

describe("limited server actions", () => {
  const form = (fields: Record<string, string>) => {
    const data = new FormData();
    for (const [name, value] of Object.entries(fields)) data.set(name, value);
    return data;
  };

  it("sign-in says how long to wait once the account's failures are spent, whatever address they came from", async () => {
    const email = `locked.${randomUUID().slice(0, 8)}@e2e.example`;
    const attempt = () =>
      callAction({
        path: "/sign-in",
        actionId: builtActionId("app/(auth)/sign-in/actions.ts#signIn"),
        args: [{ status: "idle" }, form({ email, password: "not the password" })],
        from: uniqueLoopbackAddress(),
      });
    for (let i = 0; i < ruleOf("sign-in-failure", "person").points; i += 1) {
      expect((await attempt()).result, `attempt ${i + 1}`).toMatchObject({ status: "error", message: expect.stringMatching(/do not match an account/) });
    }
    expect((await attempt()).result).toMatchObject({ status: "error", message: "Too many attempts. Try again in 15 minutes." });
  });

  it("a password reset request says how long to wait once the address's requests are spent", async () => {
    const from = uniqueLoopbackAddress();
    const request = (address = from) =>
      callAction({
        path: "/reset-password",
        actionId: builtActionId("app/(auth)/reset-password/actions.ts#requestPasswordResetAction"),
        args: [{ status: "idle" }, form({ email: `forgetful.${randomUUID().slice(0, 8)}@e2e.example` })],
        from: address,
      });
    for (let i = 0; i < ruleOf("password-reset", "address").points; i += 1) {
      expect((await request()).result, `request ${i + 1}`).toMatchObject({ status: "success" });
    }
    expect((await request()).result).toMatchObject({ status: "error", message: "Too many reset requests. Try again in 60 minutes." });
    expect((await request(uniqueLoopbackAddress())).result).toMatchObject({ status: "success" });
  });
});
