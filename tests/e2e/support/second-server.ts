import { spawn } from "node:child_process";
import { once } from "node:events";
import { createServer, type AddressInfo } from "node:net";

async function freePort(): Promise<number> {
  const server = createServer().listen(0, "127.0.0.1");
  await once(server, "listening");
  const { port } = server.address() as AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

/**
 * A second `next start` of the same build on the same database, with settings of its own
 * (APP_URL, TRUSTED_PROXIES…) over the test run's; stopped by the caller.
 */
export async function startProductionServer(settings: Record<string, string>): Promise<{ origin: string; stop: () => Promise<void> }> {
  const port = await freePort();
  const child = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...process.env, NODE_ENV: "production", ...settings },
    stdio: "ignore",
  });
  const exited = once(child, "exit");
  const origin = `http://127.0.0.1:${port}`;
  const stop = async () => {
    if (child.exitCode === null) child.kill("SIGTERM");
    await exited;
  };
  for (const deadline = Date.now() + 60_000; Date.now() < deadline; await new Promise((r) => setTimeout(r, 250))) {
    if (child.exitCode !== null) throw new Error(`next start exited with ${child.exitCode}`);
    const ready = await fetch(`${origin}/sign-in`, { redirect: "manual" }).then(() => true, () => false);
    if (ready) return { origin, stop };
  }
  await stop();
  throw new Error("next start did not answer within 60 s");
}
