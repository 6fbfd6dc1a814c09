/**
 * `npm run -s sim -- case.json` (or `-` for standard input): runs the line simulator on one case
 * and prints the result as one JSON object (docs/simulator.md, "The JSON interface").
 */
import { readFileSync } from "node:fs";
import { SimInputError, SimSolveBudgetError, simulateRun } from "@/lib/sim";

const USAGE = "usage: npm run -s sim -- case.json   (or - to read the case from standard input)";

/**
 * Without output.sampleInterval the command line samples every 0.5 ns (coarser only past 200,000
 * points), so that ringing which re-crosses a switching point for a few nanoseconds shows in the
 * printed trace; the workbench draws from its own, coarser grid.
 */
const CLI_GRID = { finestInterval: 0.5e-9, maxPoints: 200_000 };

function fail(message: string): never {
  process.stderr.write(`${message}\n`);
  process.exit(1);
}

process.stdout.on("error", (error: NodeJS.ErrnoException) => {
  if (error.code === "EPIPE") process.exit(0);
  throw error;
});

const source = process.argv[2];
if (!source || process.argv.length > 3) fail(USAGE);

let text: string;
try {
  text = readFileSync(source === "-" ? 0 : source, "utf8");
} catch (error) {
  fail(`cannot read ${source === "-" ? "standard input" : source}: ${(error as Error).message}`);
}

let input: unknown;
try {
  input = JSON.parse(text);
} catch (error) {
  fail(`the case is not valid JSON: ${(error as Error).message}`);
}

try {
  const { full: _full, ...result } = simulateRun(input as never, { grid: CLI_GRID });
  process.stdout.write(`${JSON.stringify(result)}\n`);
} catch (error) {
  if (error instanceof SimInputError) {
    fail(["the case is not valid:", ...error.issues.map((issue) => `  ${issue.path || "(case)"}: ${issue.message}`)].join("\n"));
  }
  if (error instanceof SimSolveBudgetError) fail(`the case is too large to simulate: ${error.message}`);
  throw error;
}
