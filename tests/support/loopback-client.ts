import { randomInt } from "node:crypto";
import { request as httpRequest } from "node:http";

// The whole of 127.0.0.0/8 is this machine, so a test can connect to the server from an address
// of its own, which the server sees as the connection's peer: as if from another computer.

/** A loopback address other than 127.0.0.1, different (almost surely) for every call. */
export function uniqueLoopbackAddress(): string {
  return `127.${randomInt(1, 255)}.${randomInt(0, 256)}.${randomInt(1, 255)}`;
}

const bodiless = new Set([204, 304]);

/**
 * fetch over a connection of its own made from `localAddress` (fetch itself cannot choose it).
 * The request is encoded as fetch would (a FormData as multipart with its boundary), and
 * redirects are returned, not followed.
 */
export async function fetchFrom(localAddress: string, url: string, init: RequestInit = {}): Promise<Response> {
  const prepared = new Request(url, init);
  const body = prepared.body ? Buffer.from(await prepared.arrayBuffer()) : undefined;
  const target = new URL(prepared.url);
  const headers = { ...Object.fromEntries(prepared.headers), ...(body ? { "content-length": String(body.length) } : {}) };
  return new Promise((resolve, reject) => {
    const sent = httpRequest(
      { host: target.hostname, port: target.port, path: `${target.pathname}${target.search}`, method: prepared.method, headers, localAddress, agent: false },
      (answer) => {
        const chunks: Buffer[] = [];
        answer.on("data", (chunk: Buffer) => chunks.push(chunk));
        answer.on("error", reject);
        answer.on("end", () => {
          const received = new Headers();
          for (let i = 0; i < answer.rawHeaders.length; i += 2) received.append(answer.rawHeaders[i]!, answer.rawHeaders[i + 1]!);
          const status = answer.statusCode ?? 0;
          resolve(new Response(bodiless.has(status) ? null : Buffer.concat(chunks), { status, headers: received }));
        });
      },
    );
    sent.on("error", reject);
    sent.end(body);
  });
}
