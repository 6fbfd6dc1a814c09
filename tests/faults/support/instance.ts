import { startAppInstance, type AppInstance, type AppInstanceOptions } from "@/scripts/app-instance";

// Every fault test file runs its own copy of Edgewise (cluster, mail sink, upload fake, production
// server) so it can pull parts away without touching the shared test run. The files run one after
// another and reuse one name and port range (FAULTS_PORT_BASE, set by scripts/test.sh).

// What this process's own database helpers, mail-sink reader and upload settings must point at.
const sharedSettings = ["DATABASE_URL", "APP_URL", "MAIL_SINK_URL", "MAIL_SINK_TOKEN", "UPLOADTHING_TOKEN", "UPLOADTHING_INGEST_URL", "UPLOADTHING_API_URL", "UPLOAD_FAKE_DIR"];

export async function startFaultInstance(options: Pick<AppInstanceOptions, "appEnv" | "servers"> = {}): Promise<AppInstance> {
  // The suite's own cluster trades durability for speed; a cluster made for fault tests must not,
  // or "no acknowledged write is lost" would not mean much.
  delete process.env.PG_EXTRA_CONF;
  const instance = await startAppInstance({ name: "faults", portBase: Number(process.env.FAULTS_PORT_BASE ?? 59000), ...options });
  for (const key of sharedSettings) process.env[key] = instance.env[key];
  return instance;
}

/** Polls the health route until the app reaches its database again. */
export async function waitUntilHealthy(baseUrl: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const response = await fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(5_000) }).catch(() => null);
    if (response?.status === 200) return;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`The app at ${baseUrl} did not report a healthy database within ${timeoutMs / 1000} s.`);
}

/** What a stack trace or a framework's raw error page looks like in a body sent to a browser. */
export const stackTracePattern = /\n\s+at |node_modules|webpack-internal|Error: |ECONNREFUSED|\bpg\b.*error/i;
