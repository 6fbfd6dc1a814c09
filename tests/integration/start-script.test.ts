/**
 * `npm start`'s own failures, run for real: a taken port and a machine without apt-get each end
 * in one plain sentence and a failing exit status (so a wrapper or CI sees the failure), not in a
 * stack trace or a silent success.
 */
import { spawnSync } from "node:child_process";
import { createServer, type Server } from "node:net";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

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
