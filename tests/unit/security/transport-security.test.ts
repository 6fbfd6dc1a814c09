/**
 * What the app asks of the transport follows APP_URL's scheme, not only NODE_ENV: HSTS only from a
 * production server whose address is https, and the session cookie marked Secure only then (a
 * Secure cookie over plain http is dropped by the browser, RFC 6265bis §5.7). Both modules read
 * their settings when first loaded, so each case loads them afresh under its own environment.
 */
import { NextRequest } from "next/server";
import { afterEach, describe, expect, it, vi } from "vitest";

afterEach(() => {
  vi.unstubAllEnvs();
});

async function loadUnder<T>(env: Record<string, string>, load: () => Promise<T>): Promise<T> {
  vi.resetModules();
  for (const [name, value] of Object.entries(env)) vi.stubEnv(name, value);
  return load();
}

describe("Strict-Transport-Security", () => {
  it.each([
    ["production", "https://edgewise.example", "max-age=63072000; includeSubDomains"],
    ["production", "http://127.0.0.1:3100", null],
    ["development", "https://edgewise.example", null],
    ["development", "http://127.0.0.1:3000", null],
  ])("under NODE_ENV=%s and APP_URL=%s is %j", async (nodeEnv, appUrl, expected) => {
    const { proxy } = await loadUnder({ NODE_ENV: nodeEnv, APP_URL: appUrl }, () => import("@/proxy"));
    // A page request gets it whether the database answers (the page) or not (the 503 page).
    const response = await proxy(new NextRequest(`${appUrl}/learn`));
    expect(response.headers.get("strict-transport-security")).toBe(expected);
  });
});

describe("the session cookie", () => {
  it.each([
    ["https://edgewise.example", true],
    ["http://127.0.0.1:3100", false],
  ])("under APP_URL=%s is Secure: %s, and always HttpOnly, SameSite=Lax, Path=/", async (appUrl, secure) => {
    const { blankSessionCookie } = await loadUnder({ NODE_ENV: "production", APP_URL: appUrl }, () => import("@/lib/auth/session-store"));
    expect(blankSessionCookie().attributes).toMatchObject({ secure, httpOnly: true, sameSite: "lax", path: "/" });
  });
});
