/**
 * The caught-mail page is a development aid: a deployment's build (plain `npm run build`) must not
 * route it, while the builds the project's scripts make (demo, development, tests) do.
 */
import { readdirSync } from "node:fs";
import path from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";

async function pageExtensionsWith(flag: string | undefined): Promise<string[]> {
  vi.resetModules();
  vi.stubEnv("EDGEWISE_LOCAL_PAGES", flag);
  const config = (await import("@/next.config")).default;
  return config.pageExtensions ?? [];
}

/** The route files Next would take from a folder, given the page extensions in force. */
function routedFiles(folder: string, extensions: string[]): string[] {
  return readdirSync(folder).filter((file) => extensions.some((extension) => ["page", "error"].some((name) => file === `${name}.${extension}`)));
}

afterEach(() => {
  vi.unstubAllEnvs();
});

describe("pages for the local stand-ins", () => {
  const mailPageFolder = path.resolve("app/dev/mail");

  it("are left out of a deployment's build", async () => {
    const extensions = await pageExtensionsWith(undefined);
    expect(extensions).not.toContain("dev.tsx");
    expect(routedFiles(mailPageFolder, extensions)).toEqual([]);
  });

  it("are in the builds the scripts make", async () => {
    const extensions = await pageExtensionsWith("1");
    expect(routedFiles(mailPageFolder, extensions).sort()).toEqual(["error.dev.tsx", "page.dev.tsx"]);
  });

  it("are the only files named that way: no other page is left out of a deployment", () => {
    const list = (dir: string): string[] =>
      readdirSync(dir, { withFileTypes: true }).flatMap((entry) => (entry.isDirectory() ? list(path.join(dir, entry.name)) : [path.join(dir, entry.name)]));
    const devFiles = list(path.resolve("app")).filter((file) => file.endsWith(".dev.tsx"));
    expect(devFiles.map((file) => path.relative(path.resolve("app"), file)).sort()).toEqual(["dev/mail/error.dev.tsx", "dev/mail/page.dev.tsx"]);
  });
});
