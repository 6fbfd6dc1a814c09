// A private copy of Edgewise (production build, own database cluster, own mail sink and upload
// fake) for the load benchmark and the fault tests, which must be free to overload it or pull
// its database away without touching the demo or the shared test run. Each part can be stopped
// and started again on its own, as the fault tests need. Several app servers can share the one
// database behind a local load balancer, as replicas of a deployment do.
import { execFile, spawn, type ChildProcess } from "node:child_process";
import { openSync, readFileSync } from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import { waitForPort } from "./ports";

const root = path.resolve(import.meta.dirname, "..");
const dataDir = path.join(root, ".data");
const run = promisify(execFile);

/** "app" when the instance has one server; "app-1", "app-2"… when several share its database. */
export type AppServerPart = "app" | `app-${number}`;
export type InstancePart = AppServerPart | "balancer" | "mail" | "uploads";

export type AppInstance = {
  /** The app's address: its one server, or the load balancer in front of several. */
  baseUrl: string;
  /** Each app server and its own address, bypassing the balancer. */
  servers: { part: AppServerPart; url: string }[];
  /** The environment the app runs with (DATABASE_URL, MAIL_SINK_URL, UPLOAD_FAKE_DIR, …). */
  env: Record<string, string>;
  stopDatabase(): Promise<void>;
  startDatabase(): Promise<void>;
  stopPart(part: InstancePart): Promise<void>;
  /** Ends a part at once (SIGKILL), as a crash or a lost machine would: nothing under way is finished. */
  killPart(part: InstancePart): Promise<void>;
  /** `appEnv`, for app servers only: extra environment for this start instead of the options' one. */
  startPart(part: InstancePart, appEnv?: Record<string, string>): Promise<void>;
  /** The running part's process id, which is also its process group's (what it spawned included). */
  pidOf(part: InstancePart): number | undefined;
  /** Stops every process of the instance, its database cluster included. */
  stop(): Promise<void>;
};

export type AppInstanceOptions = {
  /** Names the cluster (.data/pg-NAME), database, logs and upload folder. */
  name: string;
  /**
   * Ports used: BASE+1 database, BASE+2 app, BASE+25/26 mail sink, BASE+30/31 upload fake; with
   * several servers, BASE+2 is the load balancer and the servers listen on BASE+3, BASE+4…
   */
  portBase: number;
  /** `next start` servers on the one database, behind a load balancer (haproxy) when more than one. Default 1. */
  servers?: number;
  /** Build the app first when .next is missing or older than the sources (benchmarks); tests use the suite's build. */
  build?: boolean;
  /** Extra environment for the app servers only. */
  appEnv?: Record<string, string>;
};

type PartCommand = { command: string; args: string[]; port: number };

function partCommand(part: InstancePart, env: Record<string, string>): PartCommand {
  const node = (script: string, args: string[], port: string) => ({ command: process.execPath, args: [path.join(root, script), ...args], port: Number(port) });
  if (part === "mail") return node("scripts/mail-sink.mjs", [], env.SMTP_PORT);
  if (part === "uploads") return node("scripts/upload-fake.mjs", [], env.UPLOAD_FAKE_PORT);
  if (part === "balancer") return { command: "/usr/sbin/haproxy", args: ["-f", env.BALANCER_CONFIG, "-db"], port: Number(env.APP_PORT) };
  const port = serverPorts(env)[part === "app" ? 0 : Number(part.slice("app-".length)) - 1];
  if (port === undefined) throw new Error(`The instance has no app server ${part}.`);
  // Behind the balancer a server must not close a kept-alive connection the balancer is about to
  // reuse (Node does after 5 s idle): haproxy then drops the client's connection without an answer.
  const keepAlive = env.BALANCER_CONFIG ? ["--keepAliveTimeout", String(balancedKeepAliveMs)] : [];
  return node("node_modules/next/dist/bin/next", ["start", "-H", "127.0.0.1", "-p", port, ...keepAlive], port);
}

/** Longer than haproxy keeps an idle server connection (it closes half its idle ones every 5 s). */
const balancedKeepAliveMs = 65_000;

const serverPorts = (env: Record<string, string>) => env.APP_SERVER_PORTS.split(",");
const isAppServer = (part: InstancePart): part is AppServerPart => part.startsWith("app");

export async function startAppInstance(options: AppInstanceOptions): Promise<AppInstance> {
  const { name, portBase } = options;
  const flags = [...(options.build ? ["--build"] : []), "--servers", String(options.servers ?? 1)];
  await run("bash", [path.join(root, "scripts/app-instance.sh"), name, String(portBase), ...flags], { cwd: root, maxBuffer: 16 * 1024 * 1024 });
  const env = readEnvFile(path.join(dataDir, `instance-${name}.env`));
  const processEnv: NodeJS.ProcessEnv = { ...process.env, ...env };
  const children = new Map<InstancePart, ChildProcess>();

  const postgres = (command: "up" | "stop") =>
    run("bash", [path.join(root, "scripts/postgres.sh"), command], { cwd: root, env: processEnv }).then(() => undefined);

  const serverParts: AppServerPart[] = serverPorts(env).length === 1 ? ["app"] : serverPorts(env).map((_, i) => `app-${i + 1}` as const);

  async function startPart(part: InstancePart, appEnv = options.appEnv): Promise<void> {
    const { command, args, port } = partCommand(part, env);
    const partEnv: NodeJS.ProcessEnv = isAppServer(part) ? { ...processEnv, NODE_ENV: "production", ...appEnv } : processEnv;
    const log = openSync(path.join(dataDir, `instance-${name}-${part}.log`), "a");
    // Own process group, so stopping the part also stops whatever it spawned.
    const child = spawn(command, args, { cwd: root, env: partEnv, detached: true, stdio: ["ignore", log, log] });
    children.set(part, child);
    await waitForPort(port, child, `${part} of instance ${name}`);
  }

  async function signalPart(part: InstancePart, signal: NodeJS.Signals): Promise<void> {
    const child = children.get(part);
    children.delete(part);
    if (!child || child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise((resolve) => child.once("exit", resolve));
    process.kill(-child.pid!, signal);
    await exited;
  }
  const stopPart = (part: InstancePart) => signalPart(part, "SIGTERM");

  const instance: AppInstance = {
    baseUrl: env.APP_URL,
    servers: serverParts.map((part) => ({ part, url: `http://127.0.0.1:${partCommand(part, env).port}` })),
    env,
    stopDatabase: () => postgres("stop"),
    startDatabase: () => postgres("up"),
    stopPart,
    killPart: (part) => signalPart(part, "SIGKILL"),
    startPart,
    pidOf: (part) => children.get(part)?.pid,
    async stop() {
      await Promise.all([...children.keys()].map(stopPart));
      await postgres("stop");
    },
  };
  try {
    await startPart("mail");
    await startPart("uploads");
    await Promise.all(serverParts.map((part) => startPart(part)));
    if (env.BALANCER_CONFIG) await startPart("balancer");
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
