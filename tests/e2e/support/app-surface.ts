import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";

// Everything the app answers, found by reading app/ the way Next routes it: pages (page.tsx, and
// page.dev.tsx, which the scripts' builds under test include),
// route handlers (route.ts, one entry per exported HTTP method) and server actions (the exported
// functions of "use server" modules), the last mapped to the ids the build gave them.

const appDir = path.resolve("app");
const httpMethods = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;

function listFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    return entry.isDirectory() ? listFiles(full) : [full];
  });
}

/** "app/(teach)/cohorts/[cohortId]/page.tsx" → "/cohorts/[cohortId]": route groups are not part of the URL. */
export function routePatternOf(file: string): string {
  const segments = path.relative(appDir, path.dirname(file)).split(path.sep).filter((segment) => segment && !/^\(.*\)$/.test(segment));
  return `/${segments.join("/")}`;
}

function projectPath(file: string): string {
  return path.relative(process.cwd(), file).split(path.sep).join("/");
}

export function discoverPages(): string[] {
  return listFiles(appDir)
    .filter((file) => ["page.tsx", "page.dev.tsx"].includes(path.basename(file)))
    .map(routePatternOf)
    .sort();
}

/** "GET /api/health", one per HTTP method the route module exports. */
export function discoverRouteHandlers(): string[] {
  return listFiles(appDir)
    .filter((file) => path.basename(file) === "route.ts")
    .flatMap((file) => {
      const source = readFileSync(file, "utf8");
      const exported = httpMethods.filter((method) =>
        new RegExp(`export\\s+(async\\s+)?function\\s+${method}\\b|export\\s+const\\s+\\{[^}]*\\b${method}\\b[^}]*\\}`).test(source),
      );
      return exported.map((method) => `${method} ${routePatternOf(file)}`);
    })
    .sort();
}

/** "app/(auth)/sign-in/actions.ts#signIn" for every function a "use server" module exports. */
export function discoverServerActions(): string[] {
  return listFiles(appDir)
    .filter((file) => /\.tsx?$/.test(file))
    .flatMap((file) => {
      const source = readFileSync(file, "utf8");
      if (!/^\s*["']use server["'];?/.test(source)) return [];
      return [...source.matchAll(/export\s+async\s+function\s+(\w+)/g)].map((match) => `${projectPath(file)}#${match[1]}`);
    })
    .sort();
}

type ManifestEntry = { filename: string; exportedName: string; workers: Record<string, unknown> };

export type BuiltAction = { id: string; key: string; pagePatterns: string[] };

/**
 * The build's server-reference manifest: each action's id, its module and export, and the pages
 * whose bundles carry it ("app/(auth)/sign-in/page" → "/sign-in").
 */
export function readBuiltActions(): Map<string, BuiltAction> {
  const manifest = JSON.parse(readFileSync(path.resolve(".next/server/server-reference-manifest.json"), "utf8")) as {
    node: Record<string, ManifestEntry>;
  };
  const actions = new Map<string, BuiltAction>();
  for (const [id, entry] of Object.entries(manifest.node)) {
    const key = `${entry.filename}#${entry.exportedName}`;
    const pagePatterns = Object.keys(entry.workers)
      .filter((worker) => worker.endsWith("/page"))
      .map((worker) => routePatternOf(path.join(process.cwd(), `${worker}.tsx`)));
    actions.set(key, { id, key, pagePatterns });
  }
  return actions;
}

let builtActions: Map<string, BuiltAction> | undefined;

/** The id the build gave the action "module#export". */
export function builtActionId(key: string): string {
  const action = (builtActions ??= readBuiltActions()).get(key);
  if (!action) throw new Error(`${key} is not in the build's action manifest: rebuild the app.`);
  return action.id;
}
