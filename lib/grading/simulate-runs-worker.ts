// One grading thread of grading-pool.ts: simulates one submission at a time, so the server's
// request thread never waits on the simulator.
import { parentPort } from "node:worker_threads";
import { simulateJob, type SimulationJob, type SimulationReply } from "./simulation-job";

parentPort!.on("message", (job: SimulationJob) => {
  let reply: SimulationReply;
  try {
    reply = { runs: simulateJob(job) };
  } catch (error) {
    reply = { error: error instanceof Error ? (error.stack ?? error.message) : String(error) };
  }
  parentPort!.postMessage(reply);
});
