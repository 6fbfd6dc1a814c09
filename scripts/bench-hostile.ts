/**
 * Hostile-client benchmark: how much a learner's normal grading submission slows down while
 * HOSTILE_CLIENTS attackers (default 20) send oversized and malformed bodies to the upload route
 * (half of them, without a session) and to the grading route (the other half, signed in as
 * learners). The bodies, HOSTILE_BODY_MB each (default 10): JSON with a huge unknown field, the
 * same cut short, a chunked body of twice that size with no length given, and per route an object
 * of nothing but unknown keys (grading) or multipart without a boundary (upload).
 *
 * The production build runs on a private instance (scripts/app-instance.ts, one server, ports
 * HOSTILE_PORT_BASE+1…31, default 58200); the attackers run in a child process
 * (bench-hostile/attackers.ts), the normal submissions from this one: HOSTILE_SUBMISSIONS
 * (default 60, or as many as HOSTILE_MAX_SECONDS allows, default 120), one at a time with a pause
 * of HOSTILE_PAUSE_MS (default 250) between them, spread over 8 learners and the course's labs, first on the quiet server (the reference), then under
 * attack, then quiet again. Target (hardening issue, second round): p95 under attack at most 3×
 * the quiet p95. Printed, with the attackers' answers and the server's memory; never asserted.
 *
 * Run: npm run bench:hostile
 */
import { execFile, fork } from "node:child_process";
import { randomUUID } from "node:crypto";
import { availableParallelism, loadavg } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { startAppInstance, type AppInstance } from "./app-instance";
import { envNumber, ms, ratio } from "./bench-load/figures";
import type { BenchLearner } from "./bench-load/protocol";
import type { AttackerReply, AttackerRequest, AttackTarget, Tally } from "./bench-hostile/protocol";

const TARGET_RATIO = 3;
const NORMAL_LEARNERS = 8;
const WARM_UP_SUBMISSIONS = 8;
const RAMP_UP_MS = 3_000;

const settings = {
  clients: envNumber("HOSTILE_CLIENTS", 20),
  bodyMegabytes: envNumber("HOSTILE_BODY_MB", 10),
  submissions: envNumber("HOSTILE_SUBMISSIONS", 60),
  pauseMs: envNumber("HOSTILE_PAUSE_MS", 250),
  maxSeconds: envNumber("HOSTILE_MAX_SECONDS", 120),
  portBase: envNumber("HOSTILE_PORT_BASE", 58200),
};

/** `statuses`: answers by status, and "no answer" for exchanges the connection's failure ended. */
type Phase = { latencies: number[]; statuses: Record<string, number>; peakRssMb: number; seconds: number };

function percentile(values: number[], p: number): number | null {
  if (values.length === 0) return null;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

/** Resident memory of the app server and everything it spawned (its grading threads live in it). */
async function serverRssMb(instance: AppInstance): Promise<number> {
  const pid = instance.pidOf("app");
  if (pid === undefined) return 0;
  const { stdout } = await promisify(execFile)("ps", ["-o", "rss=", "-g", String(pid)]).catch(() => ({ stdout: "" }));
  return stdout.split("\n").reduce((sum, line) => sum + (Number(line.trim()) || 0), 0) / 1024;
}

/** One normal submission: the learner's lab's reference solution with right answers, timed to the last byte of the answer. */
async function submitNormally(baseUrl: string, learner: BenchLearner): Promise<{ ms: number; status: number | "no answer" }> {
  const started = performance.now();
  try {
    const response = await fetch(`${baseUrl}/api/labs/${learner.labSlug}/attempts`, {
      method: "POST",
      headers: { "content-type": "application/json", cookie: learner.cookie, "x-forwarded-for": learner.address },
      body: JSON.stringify({ choices: learner.passing, answers: learner.answers, idempotencyKey: randomUUID() }),
    });
    await response.arrayBuffer();
    return { ms: performance.now() - started, status: response.status };
  } catch {
    return { ms: performance.now() - started, status: "no answer" };
  }
}

async function measure(instance: AppInstance, learners: BenchLearner[], count: number): Promise<Phase> {
  const phase: Phase = { latencies: [], statuses: {}, peakRssMb: 0, seconds: 0 };
  const started = Date.now();
  const sampler = setInterval(() => void serverRssMb(instance).then((mb) => (phase.peakRssMb = Math.max(phase.peakRssMb, mb))), 500);
  try {
    for (let i = 0; i < count && Date.now() - started < settings.maxSeconds * 1000; i++) {
      const { ms: took, status } = await submitNormally(instance.baseUrl, learners[i % learners.length]!);
      phase.statuses[status] = (phase.statuses[status] ?? 0) + 1;
      if (status === 200 || status === 201) phase.latencies.push(took);
      await new Promise((resolve) => setTimeout(resolve, settings.pauseMs));
    }
  } finally {
    clearInterval(sampler);
  }
  phase.seconds = (Date.now() - started) / 1000;
  return phase;
}

function startAttackers() {
  const child = fork(path.join(import.meta.dirname, "bench-hostile/attackers.ts"), [], { execArgv: ["--import", "tsx"], stdio: "inherit" });
  const next = () => new Promise<AttackerReply>((resolve, reject) => {
    child.once("message", resolve);
    child.once("exit", (code) => reject(new Error(`The attackers exited (code ${code}).`)));
  });
  return {
    async start(request: Omit<Extract<AttackerRequest, { type: "start" }>, "type">): Promise<void> {
      const reply = next();
      child.send({ type: "start", ...request } satisfies AttackerRequest);
      await reply;
    },
    async stop(): Promise<Record<string, Tally>> {
      const reply = next();
      child.send({ type: "stop" } satisfies AttackerRequest);
      const stopped = await reply;
      child.kill();
      return stopped.type === "stopped" ? stopped.tallies : {};
    },
    kill: () => child.kill(),
  };
}

function phaseLine(name: string, phase: Phase): string {
  const statuses = Object.entries(phase.statuses).map(([status, count]) => `${status}×${count}`).join(" ");
  return `  ${name.padEnd(14)} ${String(phase.latencies.length).padStart(4)} answered 2xx  p50 ${ms(percentile(phase.latencies, 50)).padStart(8)}  p95 ${ms(percentile(phase.latencies, 95)).padStart(8)}  max ${ms(percentile(phase.latencies, 100)).padStart(8)}  (${statuses}; ${phase.seconds.toFixed(0)} s; server memory at most ${phase.peakRssMb.toFixed(0)} MB)`;
}

function tallyLines(tallies: Record<string, Tally>): string[] {
  return Object.entries(tallies).map(([kind, tally]) => {
    const answers = [...Object.entries(tally.statuses).map(([s, c]) => `${s}×${c}`), ...Object.entries(tally.errors).map(([e, c]) => `${e}×${c}`)].join(" ");
    return `  ${kind.padEnd(38)} ${String(tally.count).padStart(5)}  ${answers}; sent ${(tally.bytesSent / 1e6).toFixed(0)} MB, received ${(tally.bytesReceived / 1e6).toFixed(1)} MB`;
  });
}

async function main(): Promise<void> {
  const load = loadavg()[0];
  console.log(`Hostile-client benchmark: ${settings.clients} attackers, ${settings.bodyMegabytes} MB bodies; ${availableParallelism()} cores, load average ${load.toFixed(2)}`);
  console.log("Starting the private instance (build if stale, fresh database)…");
  // Every client has an address of its own (X-Forwarded-For, trusted from loopback as from a
  // deployment's balancer), so the normal learners never share a rate limit with an attacker.
  const instance = await startAppInstance({ name: "hostile", portBase: settings.portBase, build: true, appEnv: { TRUSTED_PROXIES: "127.0.0.1" } });
  const attackers = startAttackers();
  try {
    Object.assign(process.env, instance.env);
    // Imported only now: the app's modules read the instance's DATABASE_URL on first use.
    const { createBenchLearners, closeBenchDatabase } = await import("./bench-load/learners");
    const gradingAttackers = Math.floor(settings.clients / 2);
    const learners = await createBenchLearners(NORMAL_LEARNERS + gradingAttackers);
    await closeBenchDatabase();
    const normal = learners.slice(0, NORMAL_LEARNERS);
    const targets: AttackTarget[] = [
      ...learners.slice(NORMAL_LEARNERS).map((learner): AttackTarget => ({ route: "grading", address: learner.address, labSlug: learner.labSlug, cookie: learner.cookie })),
      // IPv6 documentation range (RFC 3849), apart from the learners' networks.
      ...Array.from({ length: settings.clients - gradingAttackers }, (_, i): AttackTarget => ({ route: "upload", address: `2001:db8:ffff:${(i + 1).toString(16)}::1` })),
    ];

    await measure(instance, normal, WARM_UP_SUBMISSIONS);
    console.log("Normal submissions, one at a time:");
    const quiet = await measure(instance, normal, settings.submissions);
    console.log(phaseLine("quiet", quiet));
    await attackers.start({ baseUrl: instance.baseUrl, targets, bodyBytes: settings.bodyMegabytes * 1024 * 1024 });
    await new Promise((resolve) => setTimeout(resolve, RAMP_UP_MS));
    const attacked = await measure(instance, normal, settings.submissions);
    const tallies = await attackers.stop();
    console.log(phaseLine("under attack", attacked));
    const after = await measure(instance, normal, settings.submissions);
    console.log(phaseLine("quiet again", after));

    const quietP95 = percentile(quiet.latencies, 95);
    const attackedP95 = percentile(attacked.latencies, 95);
    const met = quietP95 !== null && attackedP95 !== null && attackedP95 <= TARGET_RATIO * quietP95;
    console.log(
      [
        "",
        `Attackers' requests during the attack (${gradingAttackers} on grading, ${settings.clients - gradingAttackers} on uploads):`,
        ...tallyLines(tallies),
        "",
        `Normal submission p95: quiet ${ms(quietP95)}, under attack ${ms(attackedP95)}: ${ratio(attackedP95, quietP95)} (target at most ×${TARGET_RATIO}: ${met ? "met" : "NOT met"}); load average now ${loadavg()[0].toFixed(1)}`,
      ].join("\n"),
    );
  } finally {
    attackers.kill();
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
