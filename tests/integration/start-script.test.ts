/**
 * `npm start` run for real. Its failures — a taken port, a machine without apt-get — each end in
 * one plain sentence and a failing exit status (so a wrapper or CI sees the failure), not in a
 * stack trace or a silent success. And Ctrl-C stops everything it started: the database cluster,
 * the mail sink, the upload fake and the app server.
 */
import { spawn, spawnSync } from "node:child_process";
import { rm } from "node:fs/promises";
import { createServer, type Server } from "node:net";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { acceptsConnections } from "@/scripts/ports";

const root = path.resolve(import.meta.dirname, "../..");
let server: Server;
let takenPort: number;

beforeAll(async () => {
  server = createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  takenPort = (server.address() as { port: number }).port;
});

afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
});

function run(command: string, args: string[], env: Record<string, string>) {
  const result = spawnSync(command, args, { cwd: root, env: { ...process.env, ...env }, encoding: "utf8", timeout: 30_000 });
  return { status: result.status, output: `${result.stdout}${result.stderr}` };
}

describe("npm start's failures", () => {
  it("stops at once with a plain message and a failing status when the app's port is taken", () => {
    const { status, output } = run("bash", ["scripts/start.sh"], { PORT: String(takenPort) });
    expect(status).toBe(1);
    expect(output).toContain(`Error: port ${takenPort} on 127.0.0.1 is already taken`);
    expect(output).toContain("set PORT to use another");
    expect(output).not.toMatch(/\n\s+at .+:\d+:\d+/);
  });

  it("says which package to install by hand when apt-get is not there", () => {
    // A PATH holding bash and coreutils only: what a machine without Debian's package tools offers.
    const { status, output } = run("/bin/bash", ["-c", 'PATH=/nonexistent; source scripts/lib.sh; apt_install_package postgresql'], {});
    expect(status).toBe(1);
    expect(output).toContain("Error: postgresql is missing and apt-get is not available: install postgresql with your package manager.");
  });
});

/** Ports of a private run of `npm run dev`, clear of the demo's (540xx) and the tests' (550xx). */
const privateRun = (() => {
  const base = 56000 + Number(process.env.TEST_PORT_OFFSET ?? 0);
  return { base, pg: base + 1, app: base + 2, smtp: base + 25, mailList: base + 26, uploads: base + 30, uploadApi: base + 31 };
})();
const privateDataDir = path.join(root, ".data", "start-check");


describe("Ctrl-C on npm run dev", () => {
  it("stops the database, the local services and the app server it started, and exits cleanly", { timeout: 300_000 }, async () => {
    await rm(privateDataDir, { recursive: true, force: true });
    // Only what a person's shell would hold: none of this test run's own settings leak in.
    const env: Record<string, string> = {
      PATH: process.env.PATH!,
      HOME: process.env.HOME ?? root,
      EDGEWISE_DATA_DIR: privateDataDir,
      PORT: String(privateRun.app),
      PGPORT: String(privateRun.pg),
      LOCAL_SERVICES_PORT_BASE: String(privateRun.base),
    };
    // NODE_ENV stays unset, as in a shell, though Next's types declare it always present.
    const child = spawn("bash", ["scripts/start.sh", "--dev"], { cwd: root, env: env as NodeJS.ProcessEnv, detached: true, stdio: ["ignore", "pipe", "pipe"] });
    let output = "";
    child.stdout.on("data", (chunk) => (output += chunk));
    child.stderr.on("data", (chunk) => (output += chunk));
    const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
    try {
      const ports = [privateRun.pg, privateRun.smtp, privateRun.mailList, privateRun.uploads, privateRun.uploadApi, privateRun.app];
      const deadline = Date.now() + 240_000;
      while (!(await Promise.all(ports.map(acceptsConnections))).every(Boolean)) {
        if (child.exitCode !== null) throw new Error(`npm run dev stopped early:\n${output}`);
        if (Date.now() > deadline) throw new Error(`npm run dev did not open every port in time:\n${output}`);
        await new Promise((resolve) => setTimeout(resolve, 500));
      }
      expect(output).toContain(`Starting the dev server on http://127.0.0.1:${privateRun.app}`);
      expect(output).toContain("Seeding the demo school");

      // What a terminal does on Ctrl-C: SIGINT to the foreground process group.
      process.kill(-child.pid!, "SIGINT");
      expect(await exited).toBe(0);
      expect(await Promise.all(ports.map(acceptsConnections))).toEqual(ports.map(() => false));
      expect(output).not.toMatch(/\n\s+at .+:\d+:\d+/);
    } finally {
      if (child.exitCode === null) process.kill(-child.pid!, "SIGKILL");
      spawnSync("bash", ["scripts/postgres.sh", "stop"], { cwd: root, env: { ...process.env, EDGEWISE_DATA_DIR: privateDataDir, PGDATA: path.join(privateDataDir, "pg"), PGPORT: String(privateRun.pg) } });
      await rm(privateDataDir, { recursive: true, force: true });
    }
  });
});
