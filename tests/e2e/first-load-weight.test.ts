/**
 * What the workbench costs a learner's connection: the compressed JavaScript chromium receives
 * when the lab page first loads in a fresh browser (no cache), counted on the wire by the
 * DevTools protocol, against the course's budget of 250 kB (issue 4, point 6). "First load" as
 * `next build` counts it: the route's first-load chunks (its own diagnostics file), which
 * chromium must fetch before the page works; the scope chart that is loaded lazily after them is
 * reported beside it. A size, not a time: the same build always ships the same bytes.
 */
import path from "node:path";
import type { Browser, CDPSession } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readRouteBundleStats } from "@/scripts/route-bundle-stats";
import { baseUrl, launchBrowser, openPage, signInThroughForm, viewports } from "./support/browser";
import { createLearnerAtLab } from "./support/learner-at-lab";

const LAB = "lone-lead-termination";
const ROUTE = "/labs/[labSlug]";
const BUDGET_BYTES = 250_000;
const password = "count the bytes on the wire";

let browser: Browser;
let learner: { email: string; password: string };

beforeAll(async () => {
  browser = await launchBrowser();
  learner = await createLearnerAtLab({ labSlug: LAB, password, label: "first-load" });
});

afterAll(async () => {
  await browser?.close();
});

/** The route's first-load chunks as `next build` lists them, by URL path. */
function firstLoadChunks(): Set<string> {
  const route = readRouteBundleStats().find((stat) => stat.route === ROUTE);
  if (!route) throw new Error(`The build lists no ${ROUTE} route.`);
  return new Set(route.firstLoadChunkPaths.map((chunk) => `/_next/${chunk.replace(/^\.next\//, "")}`));
}

type ScriptLoad = { url: string; bytes: number; encoding: string | undefined };

/** Scripts received from now on, with the bytes each took on the wire (headers and compressed body). */
async function recordScripts(session: CDPSession): Promise<() => ScriptLoad[]> {
  const pending = new Map<string, { url: string; encoding: string | undefined }>();
  const loads: ScriptLoad[] = [];
  await session.send("Network.enable");
  await session.send("Network.setCacheDisabled", { cacheDisabled: true });
  session.on("Network.responseReceived", ({ requestId, type, response }) => {
    if (type === "Script") pending.set(requestId, { url: response.url, encoding: response.headers["content-encoding"] ?? response.headers["Content-Encoding"] });
  });
  session.on("Network.loadingFinished", ({ requestId, encodedDataLength }) => {
    const script = pending.get(requestId);
    if (script) loads.push({ ...script, bytes: encodedDataLength });
  });
  return () => [...loads];
}

describe("the workbench's first load", () => {
  it("ships no more than 250 kB of compressed JavaScript", async () => {
    // Signed in through the form in one context; measured in a second one that holds only the
    // session cookie, so nothing is in its cache.
    const signIn = await openPage(browser, "wide");
    await signInThroughForm(signIn.page, learner);
    const storageState = await signIn.context.storageState();
    await signIn.context.close();
    const context = await browser.newContext({ baseURL: baseUrl, viewport: viewports.wide, storageState });
    try {
      const page = await context.newPage();
      const session = await context.newCDPSession(page);
      const scripts = await recordScripts(session);
      await page.goto(`/labs/${LAB}`, { waitUntil: "load" });
      await page.getByRole("slider", { name: "Series resistor (E24)" }).waitFor();
      await page.waitForLoadState("networkidle");

      const loads = scripts();
      const chunks = firstLoadChunks();
      const firstLoad = loads.filter((load) => chunks.has(new URL(load.url).pathname));
      const later = loads.filter((load) => !chunks.has(new URL(load.url).pathname));
      const kB = (list: ScriptLoad[]) => `${(list.reduce((sum, load) => sum + load.bytes, 0) / 1000).toFixed(1)} kB`;
      console.log(`Workbench: first load ${firstLoad.length} scripts, ${kB(firstLoad)} on the wire; loaded after it ${later.length} scripts, ${kB(later)}: ${later.map((load) => path.basename(load.url)).join(", ")}`);

      // The list is this build's: nearly all of it was fetched. A listed chunk the page never asks
      // for (a shared layout's part this page does not render) costs the learner nothing.
      expect(firstLoad.length).toBeGreaterThanOrEqual(chunks.size - 2);
      // Compressed as served: an uncompressed response would make the budget meaningless.
      expect(loads.filter((load) => load.bytes > 2_000 && load.encoding === undefined)).toEqual([]);
      expect(firstLoad.reduce((sum, load) => sum + load.bytes, 0)).toBeLessThanOrEqual(BUDGET_BYTES);
    } finally {
      await context.close();
    }
  });
});
