/**
 * The hostile benchmark's attackers, in a child process of scripts/bench-hostile.ts so that their
 * sending never runs on the event loop that times the normal submissions. Each attacker sends
 * oversized and malformed bodies to its route, one after another, until told to stop, and the
 * tallies go back to the parent: per kind of body, the statuses answered and the errors met.
 */
import { request as httpRequest, type IncomingMessage } from "node:http";
import type { AttackerReply, AttackerRequest, AttackTarget, Tally } from "./protocol";

const CHUNK_BYTES = 64 * 1024;
const stoppedMessage = "stopped";
const REQUEST_TIMEOUT_MS = 120_000;

type Body = { kind: string; contentType: string; bytes: Buffer } | { kind: string; contentType: string; chunkedBytes: number };

/** `size` bytes of padding inside a JSON string. */
const padding = (size: number) => Buffer.alloc(size, "x");

const bodiesByRoute = new Map<AttackTarget["route"], Body[]>();

/** The bodies sent to a route, made once and shared by its attackers. */
function bodiesFor(target: AttackTarget, bodyBytes: number): Body[] {
  const made = bodiesByRoute.get(target.route);
  if (made) return made;
  const json = "application/json";
  const bigJson = Buffer.concat([Buffer.from('{"choices":{"main":{"seriesResistance":150}},"idempotencyKey":"00000000-0000-4000-8000-000000000000","pad":"'), padding(bodyBytes), Buffer.from('"}')]);
  const truncated = bigJson.subarray(0, bigJson.length - 2);
  const bodies: Body[] = [
    { kind: "json", contentType: json, bytes: bigJson },
    { kind: "truncated json", contentType: json, bytes: truncated },
    { kind: "chunked", contentType: json, chunkedBytes: 2 * bodyBytes },
  ];
  if (target.route === "grading") {
    // Every key unknown: a reply that lists each offending key would be larger than the body.
    const keys: string[] = [];
    for (let length = 2, i = 0; length < bodyBytes; i++) {
      const entry = `"k${i}":0`;
      keys.push(entry);
      length += entry.length + 1;
    }
    bodies.push({ kind: "unknown keys", contentType: json, bytes: Buffer.from(`{${keys.join(",")}}`) });
  } else {
    bodies.push({ kind: "multipart without boundary", contentType: "multipart/form-data", bytes: padding(bodyBytes) });
  }
  bodiesByRoute.set(target.route, bodies);
  return bodies;
}

function pathOf(target: AttackTarget): string {
  return target.route === "grading" ? `/api/labs/${target.labSlug}/attempts` : "/api/uploadthing?actionType=upload&slug=benchPhoto";
}

/** Sends one body; resolves with the status, or the error that ended the exchange first. */
function send(baseUrl: URL, target: AttackTarget, body: Body, live: Set<() => void>, tally: Tally): Promise<void> {
  return new Promise((resolve) => {
    let settled = false;
    const finish = (outcome: { status: number } | { error: string }) => {
      if (settled) return;
      settled = true;
      live.delete(abort);
      // Cut off by the end of the run: neither an answer nor a failure.
      if ("error" in outcome && outcome.error === stoppedMessage) return resolve();
      if ("status" in outcome) tally.statuses[outcome.status] = (tally.statuses[outcome.status] ?? 0) + 1;
      else tally.errors[outcome.error] = (tally.errors[outcome.error] ?? 0) + 1;
      tally.count += 1;
      resolve();
    };
    const headers: Record<string, string> = { "content-type": body.contentType, "x-forwarded-for": target.address };
    if (target.route === "grading") headers.cookie = target.cookie;
    if ("bytes" in body) headers["content-length"] = String(body.bytes.length);
    const request = httpRequest({ host: baseUrl.hostname, port: baseUrl.port, path: pathOf(target), method: "POST", headers, agent: false, timeout: REQUEST_TIMEOUT_MS });
    const abort = () => request.destroy(new Error(stoppedMessage));
    live.add(abort);
    request.on("response", (response: IncomingMessage) => {
      response.on("data", (chunk: Buffer) => (tally.bytesReceived += chunk.length));
      response.on("end", () => finish({ status: response.statusCode ?? 0 }));
      response.on("error", () => finish({ status: response.statusCode ?? 0 }));
    });
    request.on("timeout", () => request.destroy(new Error("timed out")));
    request.on("error", (error: NodeJS.ErrnoException) => finish({ error: error.code ?? error.message }));

    if ("bytes" in body) {
      tally.bytesSent += body.bytes.length;
      request.end(body.bytes);
      return;
    }
    // No content-length: the body's size is known only as it streams.
    const chunk = padding(CHUNK_BYTES);
    let sent = 0;
    const pump = () => {
      while (!settled && sent < body.chunkedBytes) {
        sent += chunk.length;
        tally.bytesSent += chunk.length;
        if (!request.write(chunk)) return void request.once("drain", pump);
      }
      if (!settled) request.end();
    };
    request.write('{"pad":"');
    pump();
  });
}

const tallies: Record<string, Tally> = {};
const live = new Set<() => void>();
let stopping = false;

async function attack(baseUrl: URL, target: AttackTarget, bodyBytes: number): Promise<void> {
  const bodies = bodiesFor(target, bodyBytes);
  for (let turn = 0; !stopping; turn++) {
    const body = bodies[turn % bodies.length]!;
    const key = `${target.route}: ${body.kind}`;
    tallies[key] ??= { count: 0, statuses: {}, errors: {}, bytesSent: 0, bytesReceived: 0 };
    await send(baseUrl, target, body, live, tallies[key]);
  }
}

let attacks: Promise<void[]> | null = null;

process.on("message", (message: AttackerRequest) => {
  if (message.type === "start") {
    attacks = Promise.all(message.targets.map((target) => attack(new URL(message.baseUrl), target, message.bodyBytes)));
    process.send!({ type: "started" } satisfies AttackerReply);
    return;
  }
  stopping = true;
  for (const abort of live) abort();
  void attacks?.then(() => process.send!({ type: "stopped", tallies } satisfies AttackerReply));
});
