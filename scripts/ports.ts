import type { ChildProcess } from "node:child_process";
import { connect } from "node:net";

/** Whether something accepts TCP connections on 127.0.0.1:`port` right now. */
export function acceptsConnections(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = connect({ host: "127.0.0.1", port });
    socket.once("connect", () => {
      socket.destroy();
      resolve(true);
    });
    socket.once("error", () => resolve(false));
  });
}

/** Waits until `child` listens on 127.0.0.1:`port`; fails at once if it exits first. */
export async function waitForPort(port: number, child: ChildProcess, what: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`The ${what} exited with code ${child.exitCode} before listening on port ${port}.`);
    if (await acceptsConnections(port)) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`The ${what} did not listen on 127.0.0.1:${port} within ${timeoutMs / 1000} s.`);
}
