import { readFileSync } from "node:fs";
import path from "node:path";
import { z } from "zod";

// The first-load figures `next build` writes for every route (this version of Next no longer
// prints them): read by `npm run size` and by the browser test that holds the workbench's budget.

const root = path.resolve(import.meta.dirname, "..");
const statsFile = path.join(root, ".next/diagnostics/route-bundle-stats.json");

const statsSchema = z.array(z.object({ route: z.string(), firstLoadUncompressedJsBytes: z.number(), firstLoadChunkPaths: z.array(z.string()) }));

export type RouteBundleStat = z.infer<typeof statsSchema>[number];

/** Every route's first-load chunks, as paths from the project's root (".next/static/chunks/…"). */
export function readRouteBundleStats(): RouteBundleStat[] {
  try {
    return statsSchema.parse(JSON.parse(readFileSync(statsFile, "utf8")));
  } catch (error) {
    throw new Error(`No usable build figures in ${path.relative(root, statsFile)} (run \`npx next build\` first): ${error instanceof Error ? error.message : error}`);
  }
}
