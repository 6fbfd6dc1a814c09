/**
 * The cohort page as an instructor's browser gets it: `next start` (the production build) on the
 * benchmark's database, GET /cohorts/<id> with a session cookie, timed from request to the last
 * byte of the server-rendered response. Needs process.env.DATABASE_URL to be the benchmark's
 * database before it is imported.
 */
import { execFileSync, spawn } from "node:child_process";
import { openSync } from "node:fs";
import path from "node:path";
import { createSession } from "@/lib/auth/session-store";
import { waitForPort } from "../ports";

const root = path.resolve(import.meta.dirname, "../..");

export type PageTimes = { times: number[]; bytes: number; cellsShown: boolean };

/**
 * Times `runs` page loads after `warmUp` untimed ones. `lastLearner` is a name the page must hold,
 * so a short or error page is never timed as the grid.
 */
export async function timeCohortPage(params: { port: number; cohortId: string; instructorId: string; lastLearner: string; warmUp: number; runs: number }): Promise<PageTimes> {
  execFileSync("bash", ["-c", "source scripts/lib.sh && ensure_production_build"], { cwd: root, stdio: ["ignore", "inherit", "inherit"] });
  const appUrl = `http://127.0.0.1:${params.port}`;
  // The session cookie made here must be the one the server expects for this origin.
  process.env.APP_URL = appUrl;
  const log = openSync(path.join(root, ".data/bench-gradebook-app.log"), "w");
  const server = spawn(process.execPath, [path.join(root, "node_modules/next/dist/bin/next"), "start", "-H", "127.0.0.1", "-p", String(params.port)], {
    cwd: root,
    // The page sends no mail; the mail settings only satisfy the app's start-up check.
    env: { ...process.env, NODE_ENV: "production", APP_URL: appUrl, SMTP_HOST: "127.0.0.1", SMTP_PORT: "9", MAIL_FROM: "Edgewise <bench@edgewise.example.test>", MAIL_SINK_URL: "" },
    detached: true,
    stdio: ["ignore", log, log],
  });
  try {
    await waitForPort(params.port, server, "cohort page's server (log: .data/bench-gradebook-app.log)");
    const cookie = await createSession(params.instructorId);
    const load = async () => {
      const response = await fetch(`${appUrl}/cohorts/${params.cohortId}`, { headers: { cookie: `${cookie.name}=${cookie.value}` } });
      const body = await response.text();
      if (response.status !== 200) throw new Error(`The cohort page answered ${response.status}.`);
      return body;
    };
    for (let i = 0; i < params.warmUp; i += 1) await load();
    const times: number[] = [];
    let body = "";
    for (let i = 0; i < params.runs; i += 1) {
      const started = performance.now();
      body = await load();
      times.push(performance.now() - started);
    }
    return { times, bytes: Buffer.byteLength(body), cellsShown: body.includes(params.lastLearner) };
  } finally {
    if (server.exitCode === null) process.kill(-server.pid!, "SIGTERM");
  }
}
