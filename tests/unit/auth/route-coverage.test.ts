import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { fillRoute, protectedRoutes, type ProtectedRoute } from "@/lib/auth/route-access";

// Every page in the signed-in route groups must be in the protected route table and guard
// itself with requireRouteAccess for its own entry; a page that forgets fails here.

const appDir = path.resolve("app");
const guardedFolders = ["(learn)", "(teach)", "(admin)", "dev"];

async function findPages(dir: string): Promise<string[]> {
  const entries = await readdir(dir, { withFileTypes: true });
  const nested = await Promise.all(
    entries.map((entry) => {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) return findPages(full);
      // page.dev.tsx: a page only the project's scripts build in (see next.config.ts), guarded all the same.
      return Promise.resolve(entry.name === "page.tsx" || entry.name === "page.dev.tsx" ? [full] : []);
    }),
  );
  return nested.flat();
}

function routeOf(pageFile: string): string {
  const segments = path
    .relative(appDir, path.dirname(pageFile))
    .split(path.sep)
    .filter((segment) => !/^\(.*\)$/.test(segment));
  return `/${segments.join("/")}`;
}

describe("protected route table", () => {
  it("lists exactly the pages of the signed-in areas, and each page guards its own entry", async () => {
    const pages = (await Promise.all(guardedFolders.map((folder) => findPages(path.join(appDir, folder))))).flat();
    expect(pages.length).toBeGreaterThan(0);
    const routes = pages.map(routeOf).sort();
    expect(routes).toEqual(Object.keys(protectedRoutes).sort());

    for (const file of pages) {
      const source = await readFile(file, "utf8");
      expect(source, `${file} must call requireRouteAccess("${routeOf(file)}")`).toContain(
        `requireRouteAccess("${routeOf(file)}"`,
      );
    }
  });

  it("fills dynamic segments for the return link", () => {
    expect(fillRoute("/cohorts/[cohortId]" satisfies ProtectedRoute, { cohortId: "a/b" })).toBe("/cohorts/a%2Fb");
    expect(fillRoute("/admin")).toBe("/admin");
  });
});
