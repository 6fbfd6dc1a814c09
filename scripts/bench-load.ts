/**
 * Load benchmark: the production build on a private instance (scripts/app-instance.ts: own
 * PostgreSQL cluster, fresh demo-seeded database), driven over 127.0.0.1 by autocannon in a child
 * process (scripts/bench-load/driver.ts) so that the traffic's own CPU never runs on this
 * process's event loop, which only sets up, counts and reports.
 *
 * 1. Mix: LOAD_LEARNERS learners (default 200) for LOAD_SECONDS (default 60): each submits a lab
 *    attempt (passing and failing in turn, every 3rd a resend of the previous one with its
 *    idempotency key) and loads its workbench, again and again. LOAD_RATE (default 20) is the
 *    requests per second of all learners together, i.e. each learner acts every 10 s: a learner
 *    reads the result and changes the bench between two submissions. LOAD_RATE=0 gives each
 *    learner a connection sending as soon as answered, which measures capacity, not latency.
 * 2. Grading burst: a few learners only load their workbench, first alone, then while the others
 *    submit LOAD_BURST_RATE (default 40) attempts a second; LOAD_BURST_SECONDS (default 15) each.
 *    LOAD_BURST_ROUNDS (default 2) rounds, each once with the grading threads and once grading on
 *    the request thread (GRADING_THREADS=0): the reference whose ratios show what the threads give.
 * 3. Counts the stored attempts and compares them with the first-time submissions answered 2xx.
 *
 * Targets (hardening issue, point 3): no 5xx, p95 under 300 ms for each kind of request in the
 * mix, stored attempts = first-time 2xx answers, resends stored once, workbench p95 under 300 ms
 * during the burst. Printed as met or not; the figures also go to .data/bench-load.json.
 * Nothing here fails a build.
 *
 * Run: npm run bench:load   (LOAD_SECONDS=10 for a quick run; LOAD_PORT_BASE moves the instance's ports)
 */
import { writeFileSync } from "node:fs";
import { availableParallelism, loadavg } from "node:os";
import path from "node:path";
import { startAppInstance } from "./app-instance";
import { startDriver } from "./bench-load/driver-process";
import { count5xx, envNumber, kindLines, ms, nonSuccess, ratio } from "./bench-load/figures";
import type { DriverRequest, PhaseFigures } from "./bench-load/protocol";

const TARGET_P95_MS = 300;
const RETRY_EVERY = 3;
const PROBE_LEARNERS = 2;
const WARM_UP_SECONDS = 5;

const settings = {
  seconds: envNumber("LOAD_SECONDS", 60),
  learners: envNumber("LOAD_LEARNERS", 200),
  rate: envNumber("LOAD_RATE", 20),
  burstRate: envNumber("LOAD_BURST_RATE", 40),
  burstSeconds: envNumber("LOAD_BURST_SECONDS", 15),
  burstRounds: Math.max(1, envNumber("LOAD_BURST_ROUNDS", 2)),
  portBase: envNumber("LOAD_PORT_BASE", 58000),
};

type BurstFigures = { alone: number | null; burst: number | null; submitsPerSecond: number };

function meanOf(rounds: BurstFigures[]): BurstFigures {
  const mean = (values: (number | null)[]) => (values.includes(null) ? null : (values as number[]).reduce((a, b) => a + b, 0) / values.length);
  return { alone: mean(rounds.map((r) => r.alone)), burst: mean(rounds.map((r) => r.burst)), submitsPerSecond: mean(rounds.map((r) => r.submitsPerSecond))! };
}

const yes = (met: boolean) => (met ? "yes" : "NO");

function paceOf(requestsPerSecond: number): string {
  if (requestsPerSecond === 0) return `${settings.learners} learners, each sending as soon as answered`;
  return `${settings.learners} learners, ${requestsPerSecond} requests/s in all: one every ${(settings.learners / requestsPerSecond).toFixed(1)} s per learner`;
}

async function main(): Promise<void> {
  const load = loadavg()[0];
  console.log(`Load benchmark: ${settings.learners} learners, ${settings.seconds} s mix, ${settings.burstSeconds} s burst phases; ${availableParallelism()} cores, load average ${load.toFixed(2)}`);
  console.log("Starting the private instance (build if stale, fresh database)…");
  // The driver stands in for the load balancer of a deployment: the instance believes the
  // X-Forwarded-For it sends with each learner's own address, so rate limits count per learner.
  const behindBalancer = { TRUSTED_PROXIES: "127.0.0.1" };
  const instance = await startAppInstance({ name: "load", portBase: settings.portBase, build: true, appEnv: behindBalancer });
  const driver = startDriver();
  try {
    Object.assign(process.env, instance.env);
    // Imported only now: the app's modules read DATABASE_URL and APP_URL of the instance on first use.
    const { createBenchLearners, countBenchAttempts, closeBenchDatabase } = await import("./bench-load/learners");
    const { gradingThreadCount } = await import("../lib/grading/grading-pool");
    const learners = await createBenchLearners(settings.learners);
    const probe = learners.slice(0, PROBE_LEARNERS);
    const submitters = learners.slice(PROBE_LEARNERS);
    const baseUrl = instance.baseUrl;
    const phases: Record<string, PhaseFigures> = {};
    // Other work on the machine takes CPU from the server: each phase's load average says how much.
    const loadAverages: Record<string, number> = {};
    const run = async (name: string, request: Omit<DriverRequest, "baseUrl" | "retryEvery">) => {
      phases[name] = await driver.run({ baseUrl, retryEvery: RETRY_EVERY, ...request });
      loadAverages[name] = loadavg()[0];
      console.log(kindLines(`${name} (load average after it ${loadAverages[name].toFixed(1)})`, phases[name]).join("\n"));
      return phases[name];
    };
    const rate = settings.rate > 0 ? { requestsPerSecond: settings.rate } : {};
    const burstRate = settings.burstRate > 0 ? { requestsPerSecond: settings.burstRate } : {};
    // A fresh server loads each route's code on its first request: a few learners, one request at a
    // time, load it without leaving a queue behind for the measured phase.
    const warmUp = { learners: probe, seconds: WARM_UP_SECONDS, mode: "mix" } as const;
    // The two ways of grading take turns, each on a freshly started server, so that the other
    // work on the machine weighs on both alike.
    const burstRound = async (label: string, appEnv: Record<string, string>): Promise<BurstFigures> => {
      await instance.stopPart("app");
      await instance.startPart("app", appEnv);
      await run(`${label}: warm-up`, warmUp);
      const alone = await run(`${label}: workbench alone`, { learners: probe, seconds: settings.burstSeconds, mode: "pages" });
      const burst = await run(`${label}: workbench during burst`, { learners: submitters, seconds: settings.burstSeconds, mode: "submits", probe, ...burstRate });
      return { alone: alone.kinds.page?.p95 ?? null, burst: burst.kinds.page?.p95 ?? null, submitsPerSecond: (burst.kinds.submit?.count ?? 0) / burst.seconds };
    };

    console.log("Phases:");
    await run("warm-up", warmUp);
    const mix = await run("mix", { learners, seconds: settings.seconds, mode: "mix", ...rate });
    const threads = gradingThreadCount();
    const pooledRounds: BurstFigures[] = [];
    const inlineRounds: BurstFigures[] = [];
    for (let round = 1; round <= settings.burstRounds; round++) {
      pooledRounds.push(await burstRound(`round ${round}, grading threads (${threads})`, behindBalancer));
      inlineRounds.push(await burstRound(`round ${round}, request thread (reference)`, { ...behindBalancer, GRADING_THREADS: "0" }));
    }
    const pooled = meanOf(pooledRounds);
    const inline = meanOf(inlineRounds);

    const stored = await countBenchAttempts();
    await closeBenchDatabase();
    const expected = Object.values(phases).reduce((sum, p) => sum + p.firstTimeStored, 0);
    const retries = mix.kinds.retry;
    const allPhases = Object.values(phases);
    const diverged = allPhases.reduce((sum, p) => sum + p.retriesDiverged, 0);
    const fiveXX = allPhases.reduce((sum, p) => sum + count5xx(p), 0);
    const mixP95s = Object.values(mix.kinds).map((k) => k!.p95 ?? Infinity);
    const targets = {
      no5xx: fiveXX === 0,
      mixP95Under300: mixP95s.every((p) => p < TARGET_P95_MS),
      storedEqualsFirstTime2xx: stored === expected,
      retriesStoredOnce: diverged === 0 && (retries?.statuses["200"] ?? 0) === mix.retriesReplayed,
      workbenchP95DuringBurstUnder300: pooled.burst !== null && pooled.burst < TARGET_P95_MS,
    };

    const report = [
      "",
      ...kindLines(`Mix (${paceOf(settings.rate)}; load average ${load.toFixed(1)} before, ${loadAverages.mix.toFixed(1)} after)`, mix),
      `  non-2xx: ${JSON.stringify(nonSuccess(mix))}; 5xx in all phases: ${fiveXX}`,
      `  resends: ${retries?.count ?? 0}, replayed with the stored attempt: ${mix.retriesReplayed}, answered with another attempt: ${diverged}`,
      `  first-time submissions unanswered at the window's end, lost, timed out or answered 5xx: ${mix.unanswered}, settled by resending their key: ${mix.settledByRetry}`,
      "",
      `Stored attempts ${stored}, first-time 2xx answers in all phases ${expected}: ${stored === expected ? "equal" : "NOT equal"}`,
      "",
      `Workbench p95 (mean of ${settings.burstRounds} rounds), alone and during a grading burst (${paceOf(settings.burstRate).replace("requests", "submissions")}):`,
      `  grading threads (${threads}):     alone ${ms(pooled.alone)}, burst ${ms(pooled.burst)} (${ratio(pooled.burst, pooled.alone)}), ${pooled.submitsPerSecond.toFixed(1)} submissions/s`,
      `  request thread (reference): alone ${ms(inline.alone)}, burst ${ms(inline.burst)} (${ratio(inline.burst, inline.alone)}), ${inline.submitsPerSecond.toFixed(1)} submissions/s`,
      `  during the burst, request thread / grading threads: ${ratio(inline.burst, pooled.burst)}`,
      "",
      "Targets:",
      `  zero 5xx:                              ${yes(targets.no5xx)}`,
      `  p95 under ${TARGET_P95_MS} ms, each kind in the mix:  ${yes(targets.mixP95Under300)} (${Object.entries(mix.kinds).map(([kind, k]) => `${kind} ${ms(k!.p95)}`).join(", ")})`,
      `  stored attempts = first-time 2xx:      ${yes(targets.storedEqualsFirstTime2xx)}`,
      `  resends stored once:                   ${yes(targets.retriesStoredOnce)}`,
      `  workbench p95 under ${TARGET_P95_MS} ms in a burst: ${yes(targets.workbenchP95DuringBurstUnder300)}`,
    ];
    console.log(report.join("\n"));
    const file = path.join(import.meta.dirname, "..", ".data", "bench-load.json");
    const json = { settings, machine: { cores: availableParallelism(), loadAverageAtStart: load, loadAverageAfterPhase: loadAverages }, gradingThreads: threads, phases, stored, firstTime2xx: expected, burst: { pooled, inline, pooledRounds, inlineRounds }, targets };
    writeFileSync(file, `${JSON.stringify(json, null, 2)}\n`);
    console.log(`\nFigures written to ${path.relative(process.cwd(), file)}`);
  } finally {
    driver.stop();
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
