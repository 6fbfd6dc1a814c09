import { fork } from "node:child_process";
import path from "node:path";
import type { DriverReply, DriverRequest, PhaseFigures } from "./protocol";

/** The traffic driver (driver.ts) in a child process: one phase at a time, answered by its figures. */
export function startDriver() {
  const child = fork(path.join(import.meta.dirname, "driver.ts"), [], { execArgv: ["--import", "tsx"], stdio: "inherit" });
  return {
    run(request: DriverRequest): Promise<PhaseFigures> {
      return new Promise((resolve, reject) => {
        const onExit = (code: number | null) => reject(new Error(`The load driver exited (code ${code}) during a phase.`));
        child.once("exit", onExit);
        child.once("message", (reply: DriverReply) => {
          child.off("exit", onExit);
          if ("error" in reply) reject(new Error(`The load driver failed: ${reply.error}`));
          else resolve(reply.figures);
        });
        child.send(request);
      });
    },
    stop: () => child.kill(),
  };
}
