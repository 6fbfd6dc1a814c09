// A private copy of Edgewise (production build, own database cluster, own mail sink and upload
// fake) for the load benchmark and the fault tests, which must be free to overload it or pull
// its database away without touching the demo or the shared test run. Each part can be stopped
// and started again on its own, as the fault tests need.
import { execFile, spawn, type ChildProcess } from "node:child_process";
import { openSync, readFileSync } from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import { waitForPort } from "./ports";

const root = path.resolve(import.meta.dirname, "..");
const dataDir = path.join(root, ".data");
const run = promisify(execFile);

export type InstancePart = "app" | "mail" | "uploads";

export type AppInstance = {
  baseUrl: string;
  /** The environment the app runs with (DATABASE_URL, MAIL_SINK_URL, UPLOAD_FAKE_DIR, …). */
  env: Record<string, string>;
  stopDatabase(): Promise<void>;
  startDatabase(): Promise<void>;
  stopPart(part: InstancePart): Promise<void>;
  /** `appEnv`, for the app only: extra environment for this start instead of the options' one. */
  startPart(part: InstancePart, appEnv?: Record<string, string>): Promise<void>;
  /** Stops every process of the instance, its database cluster included. */
  stop(): Promise<void>;
};

export type AppInstanceOptions = {
  /** Names the cluster (.data/pg-NAME), database, logs and upload folder. */
  name: string;
  /** Ports used: BASE+1 database, BASE+2 app, BASE+25/26 mail sink, BASE+30/31 upload fake. */
  portBase: number;
  /** Build the app first when .next is missing or older than the sources (benchmarks); tests use the suite's build. */
  build?: boolean;
  /** Extra environment for the app process only. */
  appEnv?: Record<string, string>;
};

const partCommands: Record<InstancePart, { args: string[]; port: (env: Record<string, string>) => number }> = {
  app: {
    args: [path.join(root, "node_modules/next/dist/bin/next"), "start", "-H", "127.0.0.1"],
    port: (env) => Number(env.APP_PORT),
  },
  mail: { args: [path.join(root, "scripts/mail-sink.mjs")], port: (env) => Number(env.SMTP_PORT) },
  uploads: { args: [path.join(root, "scripts/upload-fake.mjs")], port: (env) => Number(env.UPLOAD_FAKE_PORT) },
};

export async function startAppInstance(options: AppInstanceOptions): Promise<AppInstance> {
  const { name, portBase } = options;
  await run("bash", [path.join(root, "scripts/app-instance.sh"), name, String(portBase), ...(options.build ? ["--build"] : [])], {
    cwd: root,
    maxBuffer: 16 * 1024 * 1024,
  });
  const env = readEnvFile(path.join(dataDir, `instance-${name}.env`));
  const processEnv: NodeJS.ProcessEnv = { ...process.env, ...env };
  const children = new Map<InstancePart, ChildProcess>();

  const postgres = (command: "up" | "stop") =>
    run("bash", [path.join(root, "scripts/postgres.sh"), command], { cwd: root, env: processEnv }).then(() => undefined);

  async function startPart(part: InstancePart, appEnv = options.appEnv): Promise<void> {
    const { args, port } = partCommands[part];
    const partEnv: NodeJS.ProcessEnv = part === "app" ? { ...processEnv, NODE_ENV: "production", ...appEnv } : processEnv;
    const fullArgs = part === "app" ? [...args, "-p", env.APP_PORT] : args;
    const log = openSync(path.join(dataDir, `instance-${name}-${part}.log`), "a");
    // Own process group, so stopping the part also stops whatever it spawned.
    const child = spawn(process.execPath, fullArgs, { cwd: root, env: partEnv, detached: true, stdio: ["ignore", log, log] });
    children.set(part, child);
    await waitForPort(port(env), child, `${part} of instance ${name}`);
  }

  async function stopPart(part: InstancePart): Promise<void> {
    const child = children.get(part);
    children.delete(part);
    if (!child || child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise((resolve) => child.once("exit", resolve));
    process.kill(-child.pid!, "SIGTERM");
    await exited;
  }

  const instance: AppInstance = {
    baseUrl: env.APP_URL,
    env,
    stopDatabase: () => postgres("stop"),
    startDatabase: () => postgres("up"),
    stopPart,
    startPart,
    async stop() {
      await Promise.all([...children.keys()].map(stopPart));
      await postgres("stop");
    },
  };
  try {
    await startPart("mail");
    await startPart("uploads");
    await startPart("app");
  } catch (error) {
    await instance.stop();
    throw error;
  }
  return instance;
}

function readEnvFile(file: string): Record<string, string> {
  const entries = readFileSync(file, "utf8")
    .split("\n")
    .filter((line) => line.includes("="))
    .map((line) => [line.slice(0, line.indexOf("=")), line.slice(line.indexOf("=") + 1)] as const);
  return Object.fromEntries(entries);
}
