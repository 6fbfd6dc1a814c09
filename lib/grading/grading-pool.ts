import "server-only";
import { availableParallelism } from "node:os";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import type { GradedRun } from "./grade-runs";
import { simulateJob, type SimulationJob, type SimulationReply } from "./simulation-job";

// A submission's simulation takes from a few to some tens of milliseconds of CPU. On the request
// thread that would stall every page being served meanwhile, so it runs on a small pool of
// worker threads; the request thread only validates, queues and stores.

type Pending = { job: SimulationJob; resolve: (runs: GradedRun[]) => void; reject: (error: Error) => void };
type Thread = { worker: Worker; current: Pending | null; failure: Error | null };

/**
 * GRADING_THREADS sets the number of threads; 0 grades on the request thread (the load
 * benchmark's reference). By default one per core but one, and at least one: the remaining core
 * serves pages and runs the database.
 */
export function gradingThreadCount(env: Record<string, string | undefined> = process.env): number {
  const configured = env.GRADING_THREADS;
  if (configured !== undefined && configured !== "") {
    const count = Number(configured);
    if (!Number.isInteger(count) || count < 0) throw new Error(`GRADING_THREADS must be a whole number (0 grades on the request thread), not "${configured}".`);
    return count;
  }
  return Math.max(1, availableParallelism() - 1);
}

class GradingPool {
  private readonly threads: Thread[] = [];
  private readonly queue: Pending[] = [];

  constructor(private readonly size: number) {}

  run(job: SimulationJob): Promise<GradedRun[]> {
    return new Promise((resolve, reject) => {
      this.queue.push({ job, resolve, reject });
      this.dispatch();
    });
  }

  private dispatch(): void {
    while (this.queue.length > 0) {
      const thread = this.threads.find((t) => !t.current) ?? (this.threads.length < this.size ? this.spawn() : undefined);
      if (!thread) return;
      thread.current = this.queue.shift()!;
      // Referenced only while busy: an idle pool never keeps a script or test run alive.
      thread.worker.ref();
      thread.worker.postMessage(thread.current.job);
    }
  }

  private spawn(): Thread {
    const worker = startWorker();
    const thread: Thread = { worker, current: null, failure: null };
    worker.on("message", (reply: SimulationReply) => {
      const done = thread.current!;
      thread.current = null;
      worker.unref();
      if ("error" in reply) done.reject(new Error(`Grading failed on its thread: ${reply.error}`));
      else done.resolve(reply.runs);
      this.dispatch();
    });
    worker.on("error", (error) => {
      thread.failure = error;
    });
    // A thread that dies takes only its own submission with it; the next job starts a fresh one.
    worker.on("exit", (code) => {
      this.threads.splice(this.threads.indexOf(thread), 1);
      thread.current?.reject(thread.failure ?? new Error(`A grading thread stopped (exit code ${code}).`));
      thread.current = null;
      this.dispatch();
    });
    this.threads.push(thread);
    return thread;
  }
}

function startWorker(): Worker {
  if (process.env.VITEST) {
    // Tests run the TypeScript sources unbundled; Node 20 loads a TypeScript worker only once tsx
    // is registered inside it.
    const source = path.join(path.dirname(fileURLToPath(import.meta.url)), "simulate-runs-worker.ts");
    return new Worker(`import("tsx/esm/api").then((tsx) => { tsx.register(); return import(${JSON.stringify(pathToFileURL(source).href)}); });`, { eval: true });
  }
  // Next bundles the worker and its imports from this very expression, in `next build` and `next dev` alike.
  return new Worker(new URL("./simulate-runs-worker.ts", import.meta.url));
}

// One pool per server process; parked on globalThis so development reloads do not start more.
const globalForPool = globalThis as { edgewiseGradingPool?: GradingPool | null };

/** The graded runs of validated choices, simulated on a grading thread (or in place when GRADING_THREADS=0). */
export async function simulateOffThread(job: SimulationJob): Promise<GradedRun[]> {
  if (globalForPool.edgewiseGradingPool === undefined) {
    const size = gradingThreadCount();
    globalForPool.edgewiseGradingPool = size > 0 ? new GradingPool(size) : null;
  }
  return globalForPool.edgewiseGradingPool ? globalForPool.edgewiseGradingPool.run(job) : simulateJob(job);
}
