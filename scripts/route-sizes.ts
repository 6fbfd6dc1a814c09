/**
 * The JavaScript each page route ships on its first load, from the figures `next build` itself
 * writes (.next/diagnostics/route-bundle-stats.json: the first-load chunks of every route; this
 * version of Next no longer prints them), compressed with gzip as `next start` serves them.
 * The workbench's budget (issue 4, point 6) is printed as met or not; nothing here fails a build.
 *
 * Run after a build: npm run size
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { readRouteBundleStats } from "./route-bundle-stats";

const root = path.resolve(import.meta.dirname, "..");
const WORKBENCH_ROUTE = "/labs/[labSlug]";
const BUDGET_KB = 250;

const gzippedSize = new Map<string, number>();
function compressed(chunk: string): number {
  if (!gzippedSize.has(chunk)) gzippedSize.set(chunk, gzipSync(readFileSync(path.join(root, chunk))).length);
  return gzippedSize.get(chunk)!;
}

const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`.padStart(10);

const rows = readRouteBundleStats()
  .map((stat) => ({ route: stat.route, raw: stat.firstLoadUncompressedJsBytes, gzip: stat.firstLoadChunkPaths.reduce((sum, chunk) => sum + compressed(chunk), 0) }))
  .sort((a, b) => b.gzip - a.gzip);

console.log(`${"route".padEnd(44)}  first-load JS   gzip`);
for (const row of rows) console.log(`${row.route.padEnd(44)}${kB(row.raw)}${kB(row.gzip)}`);
const workbench = rows.find((row) => row.route === WORKBENCH_ROUTE);
if (!workbench) throw new Error(`The build has no ${WORKBENCH_ROUTE} route.`);
console.log(`\nWorkbench (${WORKBENCH_ROUTE}): ${(workbench.gzip / 1000).toFixed(1)} kB compressed on first load, ×${(workbench.gzip / 1000 / BUDGET_KB).toFixed(2)} of the ${BUDGET_KB} kB budget: ${workbench.gzip / 1000 <= BUDGET_KB ? "met" : "NOT met"}`);
