/**
 * The session cookie as the browser receives it from the built app: the Set-Cookie headers of the
 * real sign-in and sign-out, read off the wire. The app under test is served over plain http, where
 * the cookie must not be marked Secure (the browser would drop it) — Secure follows APP_URL's scheme.
 */
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sessionCookieName } from "@/lib/auth/session-store";
import { createPerson } from "../integration/support/people";
import { baseUrl, launchBrowser, openPage, signInThroughForm } from "./support/browser";

type SetCookie = { name: string; value: string; attributes: Map<string, string> };

let browser: Browser;
const password = "cookies on the wire";
const accounts: { email: string; password: string }[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  for (const label of ["cookie-first", "cookie-second"]) {
    const person = await createPerson({ role: "learner", password, label });
    accounts.push({ email: person.email, password });
  }
});

afterAll(async () => {
  await browser?.close();
});

/** RFC 6265 §4.1.1: name=value, then attributes; attribute names are case-insensitive. */
function parseSetCookie(header: string): SetCookie {
  const [pair = "", ...attributes] = header.split(";").map((part) => part.trim());
  const cut = pair.indexOf("=");
  return {
    name: pair.slice(0, cut),
    value: pair.slice(cut + 1),
    attributes: new Map(
      attributes.map((attribute) => {
        const [key = "", ...value] = attribute.split("=");
        return [key.toLowerCase(), value.join("=")];
      }),
    ),
  };
}

/** Every Set-Cookie header of every response the page receives, read once those responses are in. */
function collectSetCookies(page: Page): () => Promise<SetCookie[]> {
  const reads: Promise<SetCookie[]>[] = [];
  page.on("response", (response) => {
    reads.push(response.headersArray().then((headers) => headers.filter((h) => h.name.toLowerCase() === "set-cookie").map((h) => parseSetCookie(h.value))));
  });
  return async () => (await Promise.all(reads)).flat();
}

function expectSafeFlags(cookie: SetCookie): void {
  expect(cookie.attributes.has("httponly"), `${cookie.name} HttpOnly`).toBe(true);
  expect(cookie.attributes.get("samesite")?.toLowerCase(), `${cookie.name} SameSite`).toMatch(/^(lax|strict)$/);
  expect(cookie.attributes.get("path"), `${cookie.name} Path`).toBe("/");
  expect(cookie.attributes.has("secure"), `${cookie.name} Secure over ${baseUrl}`).toBe(baseUrl.startsWith("https:"));
}

/** Runs `use` in a browser context of its own, closed afterwards whatever happens. */
async function inFreshContext<T>(use: (opened: { context: BrowserContext; page: Page }) => Promise<T>): Promise<T> {
  const opened = await openPage(browser);
  try {
    return await use(opened);
  } finally {
    await opened.context.close();
  }
}

const sessionValueIn = async (context: BrowserContext) => (await context.cookies()).find((c) => c.name === sessionCookieName)?.value;

/** Whether a browser holding only this session cookie value is let into the learner's home. */
function sessionOpensHome(value: string): Promise<boolean> {
  return inFreshContext(async ({ context, page }) => {
    await context.addCookies([{ name: sessionCookieName, value, url: baseUrl }]);
    await page.goto("/learn");
    return !new URL(page.url()).pathname.startsWith("/sign-in");
  });
}

describe("the session cookie", () => {
  it("is set on sign-in HttpOnly, SameSite=Lax, Path=/, and never takes over a value the browser had before", async () => {
    await inFreshContext(async ({ context, page }) => {
      const planted = "planted0before0sign0in0aaaaaaaaaaaaaaaa";
      await context.addCookies([{ name: sessionCookieName, value: planted, url: baseUrl }]);
      const readSetCookies = collectSetCookies(page);
      await signInThroughForm(page, accounts[0]!);
      const setCookies = await readSetCookies();

      const issued = setCookies.filter((cookie) => cookie.name === sessionCookieName && cookie.value !== "");
      expect(issued).toHaveLength(1);
      expect(issued[0]!.value).not.toBe(planted);
      expect(issued[0]!.value.length).toBeGreaterThanOrEqual(20);
      // lucia's session lifetime is 30 days (lib/auth/session-store.ts).
      expect(Number(issued[0]!.attributes.get("max-age"))).toBe(30 * 24 * 60 * 60);
      for (const cookie of setCookies) expectSafeFlags(cookie);

      expect(await sessionValueIn(context)).toBe(issued[0]!.value);
      expect(await page.evaluate(() => document.cookie)).not.toContain(sessionCookieName);
      expect(await sessionOpensHome(issued[0]!.value)).toBe(true);
      expect(await sessionOpensHome(planted)).toBe(false);
    });
  });

  it("reads as signed out when mangled, on pages and route handlers alike, and does not stop a sign-in", async () => {
    await inFreshContext(async ({ context, page }) => {
      // %00 decodes to a NUL byte, which the database refuses in text.
      await context.addCookies([{ name: sessionCookieName, value: "%00", url: baseUrl }]);
      for (const path of ["/", "/sign-in", "/learn", "/api/bench-photos/3f2b8c1e-9a4d-4e6b-8c7a-1d2e3f4a5b6c"]) {
        const response = await page.goto(path);
        expect(response!.status(), path).toBeLessThan(500);
      }
      await page.goto("/learn");
      expect(new URL(page.url()).pathname).toBe("/sign-in");
      await signInThroughForm(page, accounts[0]!);
      expect(new URL(page.url()).pathname).toBe("/learn");
    });
  });

  it("is replaced, and the earlier session ended, when someone signs in from a sign-in page left open", async () => {
    await inFreshContext(async ({ context, page }) => {
      const staleForm = await context.newPage();
      await staleForm.goto("/sign-in");
      await signInThroughForm(page, accounts[0]!);
      const first = (await sessionValueIn(context))!;
      expect(await sessionOpensHome(first)).toBe(true);

      await staleForm.getByLabel("E-mail address").fill(accounts[1]!.email);
      await staleForm.getByLabel("Password", { exact: true }).fill(accounts[1]!.password);
      await staleForm.getByRole("button", { name: "Sign in" }).click();
      await staleForm.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 30_000 });

      const second = (await sessionValueIn(context))!;
      expect(second).not.toBe(first);
      expect(await sessionOpensHome(second)).toBe(true);
      expect(await sessionOpensHome(first)).toBe(false);
    });
  });

  it("is cleared on sign-out with the same flags, and the session it held stops working", async () => {
    await inFreshContext(async ({ context, page }) => {
      await signInThroughForm(page, accounts[1]!);
      const signedIn = (await sessionValueIn(context))!;
      const readSetCookies = collectSetCookies(page);

      await page.goto("/sign-out");
      await page.getByRole("button", { name: "Sign out" }).click();
      await page.waitForURL(/\/sign-in\?notice=signed-out/, { timeout: 30_000 });
      const setCookies = await readSetCookies();

      const cleared = setCookies.filter((cookie) => cookie.name === sessionCookieName);
      expect(cleared).toHaveLength(1);
      expect(cleared[0]!.value).toBe("");
      expect(cleared[0]!.attributes.get("max-age")).toBe("0");
      for (const cookie of setCookies) expectSafeFlags(cookie);

      expect(await sessionValueIn(context)).toBeUndefined();
      expect(await sessionOpensHome(signedIn)).toBe(false);
    });
  });
});
