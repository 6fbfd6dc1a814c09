/**
 * Replicas benchmark: two `next start` servers of the production build on one PostgreSQL behind a
 * local load balancer (haproxy, round robin), as scripts/app-instance.ts starts them, driven over
 * 127.0.0.1 by the load benchmark's traffic driver (autocannon, in a child process). Each phase
 * runs against one server directly (the reference, same process, same database) and against the
 * two behind the balancer:
 *
 * 1. Paced mix: REPLICAS_LEARNERS learners (default 200) submitting lab attempts (every 3rd a
 *    resend with the same idempotency key) and loading their workbench, REPLICAS_RATE requests a
 *    second in all (default 20), for REPLICAS_SECONDS (default 30): latency percentiles.
 * 2. Capacity: REPLICAS_CAPACITY_LEARNERS learners (default 100), each sending as soon as
 *    answered, for REPLICAS_CAPACITY_SECONDS (default 20): answers a second.
 * 3. A server killed under load: the paced mix through the balancer, and a third of the way in one
 *    server is killed (SIGKILL). Prints the requests that failed and when, against the kill; a
 *    submission without an answer or answered 5xx is sent again with its key (as the workbench
 *    does); every first-time submission answered 2xx must be stored, and nothing twice.
 *
 * Nothing here fails a build; figures also go to .data/bench-replicas.json.
 * Run: npm run bench:replicas   (REPLICAS_PORT_BASE moves the instance's ports, default 58100)
 */
import { writeFileSync } from "node:fs";
import { availableParallelism, loadavg } from "node:os";
import path from "node:path";
import { startAppInstance } from "./app-instance";
import { startDriver } from "./bench-load/driver-process";
import { count5xx, envNumber, kindLines, ratio } from "./bench-load/figures";
import type { DriverRequest, PhaseFigures } from "./bench-load/protocol";

const RETRY_EVERY = 3;
const WARM_UP_SECONDS = 5;

const settings = {
  seconds: envNumber("REPLICAS_SECONDS", 30),
  learners: envNumber("REPLICAS_LEARNERS", 200),
  rate: envNumber("REPLICAS_RATE", 20),
  capacityLearners: envNumber("REPLICAS_CAPACITY_LEARNERS", 100),
  capacitySeconds: envNumber("REPLICAS_CAPACITY_SECONDS", 20),
  portBase: envNumber("REPLICAS_PORT_BASE", 58100),
};

/** What the kill phase's failures say, in ms after the kill. */
function failureWindow(figures: PhaseFigures, killedAt: number) {
  const offsets = figures.failures.map((failure) => failure.atMs - killedAt);
  const byStatus: Record<string, number> = {};
  for (const failure of figures.failures) {
    const status = failure.status === null ? "no answer" : String(failure.status);
    byStatus[status] = (byStatus[status] ?? 0) + 1;
  }
  return {
    count: figures.failures.length,
    byStatus,
    beforeKill: offsets.filter((offset) => offset < 0).length,
    firstMs: offsets.length > 0 ? Math.min(...offsets) : null,
    lastMs: offsets.length > 0 ? Math.max(...offsets) : null,
  };
}

async function main(): Promise<void> {
  const load = loadavg()[0];
  console.log(`Replicas benchmark: 2 servers behind haproxy on one database; ${availableParallelism()} cores, load average ${load.toFixed(2)}`);
  console.log("Starting the private instance (build if stale, fresh database, two servers and the balancer)…");
  // The servers take each learner's own address (sent by the driver) from X-Forwarded-For, as
  // behind the balancer of a deployment, so rate limits count per learner.
  const instance = await startAppInstance({ name: "replicas", portBase: settings.portBase, servers: 2, build: true, appEnv: { TRUSTED_PROXIES: "127.0.0.1" } });
  const driver = startDriver();
  try {
    Object.assign(process.env, instance.env);
    // Imported only now: the app's modules read DATABASE_URL and APP_URL of the instance on first use.
    const { createBenchLearners, countBenchAttempts, closeBenchDatabase } = await import("./bench-load/learners");
    const learners = await createBenchLearners(Math.max(settings.learners, settings.capacityLearners));
    const mixLearners = learners.slice(0, settings.learners);
    const capacityLearners = learners.slice(0, settings.capacityLearners);
    const oneServer = instance.servers[0]!;
    const balancer = instance.baseUrl;
    const phases: Record<string, PhaseFigures> = {};
    const loadAverages: Record<string, number> = {};
    const run = async (name: string, request: Omit<DriverRequest, "retryEvery">) => {
      phases[name] = await driver.run({ retryEvery: RETRY_EVERY, ...request });
      loadAverages[name] = loadavg()[0];
      console.log(kindLines(`${name} (load average after it ${loadAverages[name].toFixed(1)})`, phases[name]).join("\n"));
      return phases[name];
    };
    const paced = { learners: mixLearners, seconds: settings.seconds, mode: "mix", requestsPerSecond: settings.rate } as const;
    const capacity = { learners: capacityLearners, seconds: settings.capacitySeconds, mode: "mix" } as const;

    console.log("Phases:");
    // A fresh server loads each route's code on its first request; round robin warms both.
    await run("warm-up through the balancer", { baseUrl: balancer, learners: learners.slice(0, 4), seconds: WARM_UP_SECONDS, mode: "mix" });
    const pacedOne = await run("paced mix, one server (reference)", { baseUrl: oneServer.url, ...paced });
    const pacedTwo = await run("paced mix, two servers behind the balancer", { baseUrl: balancer, ...paced });
    const capacityOne = await run("capacity, one server (reference)", { baseUrl: oneServer.url, ...capacity });
    const capacityTwo = await run("capacity, two servers behind the balancer", { baseUrl: balancer, ...capacity });

    const killAfterMs = (settings.seconds * 1000) / 3;
    let killedAt = 0;
    const killing = new Promise<void>((resolve) =>
      setTimeout(() => {
        killedAt = Date.now();
        void instance.killPart(oneServer.part).then(resolve);
      }, killAfterMs),
    );
    const killPhase = await run(`paced mix through the balancer, ${oneServer.part} killed after ${(killAfterMs / 1000).toFixed(0)} s`, { baseUrl: balancer, ...paced });
    await killing;
    const failures = failureWindow(killPhase, killedAt);

    const stored = await countBenchAttempts();
    await closeBenchDatabase();
    const firstTime2xx = Object.values(phases).reduce((sum, p) => sum + p.firstTimeStored, 0);
    const unsettled = Object.values(phases).reduce((sum, p) => sum + p.unsettled, 0);
    const diverged = Object.values(phases).reduce((sum, p) => sum + p.retriesDiverged, 0);
    const percentiles = (figures: PhaseFigures, kind: "submit" | "page") => {
      const k = figures.kinds[kind];
      return k ? `${Math.round(k.p50 ?? 0)} / ${Math.round(k.p95 ?? 0)} / ${Math.round(k.p99 ?? 0)} ms` : "—";
    };

    const report = [
      "",
      `Paced mix (${settings.learners} learners, ${settings.rate} requests/s, ${settings.seconds} s):`,
      `  one server:  ${pacedOne.throughput.toFixed(1)} answers/s; submit p50/p95/p99 ${percentiles(pacedOne, "submit")}; workbench ${percentiles(pacedOne, "page")}; 5xx ${count5xx(pacedOne)}`,
      `  two servers: ${pacedTwo.throughput.toFixed(1)} answers/s; submit p50/p95/p99 ${percentiles(pacedTwo, "submit")}; workbench ${percentiles(pacedTwo, "page")}; 5xx ${count5xx(pacedTwo)}`,
      `  submit p95 two / one: ${ratio(pacedTwo.kinds.submit?.p95 ?? null, pacedOne.kinds.submit?.p95 ?? null)}`,
      `Capacity (${settings.capacityLearners} learners back to back, ${settings.capacitySeconds} s):`,
      `  one server:  ${capacityOne.throughput.toFixed(1)} answers/s; submit p95 ${Math.round(capacityOne.kinds.submit?.p95 ?? 0)} ms; 5xx ${count5xx(capacityOne)}`,
      `  two servers: ${capacityTwo.throughput.toFixed(1)} answers/s; submit p95 ${Math.round(capacityTwo.kinds.submit?.p95 ?? 0)} ms; 5xx ${count5xx(capacityTwo)}`,
      `  answers/s two / one: ${ratio(capacityTwo.throughput, capacityOne.throughput)} (${availableParallelism()} cores for both servers, the database and the driver)`,
      `${oneServer.part} killed ${(killAfterMs / 1000).toFixed(0)} s into ${settings.seconds} s of the paced mix through the balancer:`,
      `  ${killPhase.throughput.toFixed(1)} answers/s; submit p50/p95/p99 ${percentiles(killPhase, "submit")}; workbench ${percentiles(killPhase, "page")}`,
      `  failed requests: ${failures.count} ${JSON.stringify(failures.byStatus)}, ${failures.beforeKill} before the kill` +
        (failures.count > 0 ? `; answered ${failures.firstMs} to ${failures.lastMs} ms after the kill` : ""),
      `  submissions without an answer or answered 5xx, sent again with their key: ${killPhase.unanswered}, stored or replayed: ${killPhase.settledByRetry}`,
      "",
      `Stored attempts ${stored}, first-time submissions answered 2xx (all phases, resends of lost ones included) ${firstTime2xx}: ${stored === firstTime2xx ? "equal" : "NOT equal"}; unsettled ${unsettled}; resends answered with another attempt ${diverged}`,
    ];
    console.log(report.join("\n"));
    const file = path.join(import.meta.dirname, "..", ".data", "bench-replicas.json");
    const json = { settings, machine: { cores: availableParallelism(), loadAverageAtStart: load, loadAverageAfterPhase: loadAverages }, phases, killedAt, failures, stored, firstTime2xx };
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
