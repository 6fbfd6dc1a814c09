/**
 * Benchmark of grading one submission as a learner meets it: the time from posting choices to the
 * graded, stored answer (POST /api/labs/<lab>/attempts) on a private production instance, one
 * request at a time, per lab, for the lab's reference solution and its first catalogued mistake.
 *
 * Printed beside it, measured in the same process on the same instance:
 * - the health check's round trip (HTTP, session-free, one `select 1`): the floor any answer pays;
 * - the same grading done in this process without HTTP or database (validation, simulation,
 *   scoring): the share of the answer that is the simulator's.
 * The target (issue 4, point 6) is a median under 100 ms; it is printed as met or not, never asserted.
 *
 * Run: npm run bench:grading   (GRADING_SUBMISSIONS per lab and choice, default 15;
 *                               GRADING_PORT_BASE moves the instance's ports, default 57000)
 */
import { randomUUID } from "node:crypto";
import { availableParallelism, loadavg } from "node:os";
import { startAppInstance } from "./app-instance";
import type { BenchLearner } from "./bench-load/protocol";

const TARGET_MEDIAN_MS = 100;
const WARM_UP = 3;

function envCount(name: string, fallback: number): number {
  const value = Number(process.env[name] ?? fallback);
  if (!Number.isInteger(value) || value < 1) throw new Error(`${name} must be a whole number of at least 1, not "${process.env[name]}".`);
  return value;
}

const submissions = envCount("GRADING_SUBMISSIONS", 15);
const portBase = envCount("GRADING_PORT_BASE", 57000);

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

function percentile95(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil(0.95 * sorted.length) - 1)];
}

async function timed(action: () => Promise<void>): Promise<number> {
  const start = performance.now();
  await action();
  return performance.now() - start;
}

async function submit(baseUrl: string, learner: BenchLearner, choices: unknown): Promise<void> {
  const response = await fetch(`${baseUrl}/api/labs/${learner.labSlug}/attempts`, {
    method: "POST",
    headers: { "content-type": "application/json", cookie: learner.cookie },
    body: JSON.stringify({ choices, answers: learner.answers, idempotencyKey: randomUUID() }),
  });
  const body = await response.text();
  if (response.status !== 201 && response.status !== 200) throw new Error(`Grading ${learner.labSlug} answered ${response.status}: ${body.slice(0, 300)}`);
}

async function healthCheck(baseUrl: string): Promise<void> {
  const response = await fetch(`${baseUrl}/api/health`);
  await response.text();
  if (!response.ok) throw new Error(`The health check answered ${response.status}.`);
}

const ms = (value: number) => `${value.toFixed(1)} ms`.padStart(9);

async function main(): Promise<void> {
  console.log(`Grading benchmark: ${submissions} submissions per lab and choice, one at a time; ${availableParallelism()} cores, load average ${loadavg()[0].toFixed(2)}`);
  console.log("Starting the private instance (build if stale, fresh database)…");
  const instance = await startAppInstance({ name: "grading", portBase, build: true, appEnv: {} });
  try {
    Object.assign(process.env, instance.env);
    // Imported only now: the app's modules read the instance's DATABASE_URL on first use.
    const { createBenchLearners, closeBenchDatabase } = await import("./bench-load/learners");
    const { getCourse, getLab } = await import("../lessons");
    const { gradeWork, variantSeedFor } = await import("../lib/grading");
    const labCount = getCourse().lessons.filter((lesson) => lesson.lab).length;
    const learners = await createBenchLearners(labCount);
    const baseUrl = instance.baseUrl;

    // A fresh server compiles each route on first use: warm both routes before measuring.
    for (const learner of learners) for (let i = 0; i < WARM_UP; i++) await submit(baseUrl, learner, learner.passing);
    for (let i = 0; i < WARM_UP; i++) await healthCheck(baseUrl);

    const floor: number[] = [];
    for (let i = 0; i < submissions * 2; i++) floor.push(await timed(() => healthCheck(baseUrl)));
    const floorMedian = median(floor);

    const all: number[] = [];
    const labMedians: number[] = [];
    const rows: string[] = [];
    for (const learner of learners) {
      const lab = getLab(learner.labSlug)!;
      const seed = variantSeedFor(learner.userId, lab.slug);
      for (const [kind, choices] of [["solution", learner.passing], ["mistake", learner.failing]] as const) {
        const answers: number[] = [];
        const inProcess: number[] = [];
        for (let i = 0; i < submissions; i++) {
          answers.push(await timed(() => submit(baseUrl, learner, choices)));
          inProcess.push(await timed(async () => void gradeWork({ lab, seed, choices, answers: learner.answers })));
        }
        all.push(...answers);
        const answerMedian = median(answers);
        labMedians.push(answerMedian);
        rows.push(
          `${`${lab.slug} (${kind})`.padEnd(44)}${ms(answerMedian)}${ms(percentile95(answers))}${ms(median(inProcess))}   ×${(answerMedian / floorMedian).toFixed(1).padEnd(6)}×${(answerMedian / TARGET_MEDIAN_MS).toFixed(2)}`,
        );
      }
    }
    console.log("");
    console.log(`${"lab (choices)".padEnd(44)}   median      p95  grading   vs floor  vs ${TARGET_MEDIAN_MS} ms`);
    console.log(rows.join("\n"));
    console.log("");
    console.log(`Health-check round trip (the floor), median of ${floor.length}: ${floorMedian.toFixed(1)} ms`);
    const overall = median(all);
    console.log(`All ${all.length} submissions: median ${overall.toFixed(1)} ms, p95 ${percentile95(all).toFixed(1)} ms (×${(overall / TARGET_MEDIAN_MS).toFixed(2)} of the target)`);
    const met = (yes: boolean) => (yes ? "met" : "NOT met");
    console.log(`Target, median answer under ${TARGET_MEDIAN_MS} ms: ${met(overall < TARGET_MEDIAN_MS)} over all submissions; ${met(labMedians.every((m) => m < TARGET_MEDIAN_MS))} for every lab and choice`);
    console.log(`Load average at the end: ${loadavg()[0].toFixed(2)}`);
    await closeBenchDatabase();
  } finally {
    await instance.stop();
  }
}

main().then(
  () => process.exit(0),
  (error: unknown) => {
    console.error(error);
    process.exit(1);
  },
);
