// Runs scripts/upload-fake.mjs as a child process, the way the start and test scripts do, and
// keeps its log so a test can wait for the line a request leaves behind.
import { spawn, spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";

const script = fileURLToPath(new URL("../../../scripts/upload-fake.mjs", import.meta.url));

export type UploadFakeSettings = { token: string; dir: string; port?: number };

export type RunningUploadFake = {
  url: string;
  log: () => string;
  waitForLog: (pattern: RegExp) => Promise<void>;
  stop: () => Promise<void>;
};

// A private fake listens on its one port only: the API port exported for the suite's own fake
// (scripts/local-services.sh) is already taken by it.
function environment({ token, dir, port = 0 }: UploadFakeSettings) {
  return { ...process.env, UPLOADTHING_TOKEN: token, UPLOAD_FAKE_DIR: dir, UPLOAD_FAKE_PORT: String(port), UPLOAD_FAKE_API_PORT: "" };
}

export function startUploadFake(settings: UploadFakeSettings): Promise<RunningUploadFake> {
  const child = spawn(process.execPath, [script], { env: environment(settings), stdio: ["ignore", "pipe", "pipe"] });
  let output = "";
  const listeners = new Set<() => void>();
  const collect = (chunk: Buffer) => {
    output += chunk.toString();
    for (const notify of listeners) notify();
  };
  child.stdout.on("data", collect);
  child.stderr.on("data", collect);

  const waitForLog = (pattern: RegExp, ms = 10_000) =>
    new Promise<RegExpMatchArray>((resolve, reject) => {
      const check = () => {
        const match = pattern.exec(output);
        if (!match) return;
        listeners.delete(check);
        clearTimeout(timer);
        resolve(match);
      };
      const timer = setTimeout(() => {
        listeners.delete(check);
        reject(new Error(`upload fake never logged ${pattern}; its log so far:\n${output}`));
      }, ms);
      listeners.add(check);
      check();
    });

  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  return Promise.race([
    waitForLog(/listening on (http:\/\/127\.0\.0\.1:\d+)/),
    exited.then(() => Promise.reject(new Error(`upload fake exited during start:\n${output}`))),
  ]).then((match) => ({
    url: match[1],
    log: () => output,
    waitForLog: async (pattern: RegExp) => void (await waitForLog(pattern)),
    stop: async () => {
      if (child.exitCode === null) child.kill("SIGTERM");
      await exited;
    },
  }));
}

export function runUploadFakeUntilExit(settings: UploadFakeSettings) {
  const result = spawnSync(process.execPath, [script], { env: environment(settings), encoding: "utf8", timeout: 10_000 });
  return { status: result.status, stderr: result.stderr };
}
