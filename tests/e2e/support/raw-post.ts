import { request } from "node:http";
import { baseUrl } from "./browser";

// POSTs over a plain socket, for what fetch cannot send: a body in chunks without a length, a
// declared length the body never reaches, a body that stops and waits. The answer is read as soon
// as it comes, whether or not the body has been sent in full.

export type RawPost = {
  path: string;
  headers?: Record<string, string>;
  body?: Uint8Array;
  /** Chunked transfer (no Content-Length) in pieces of 16 kB; otherwise the body's own length is declared. */
  chunked?: boolean;
  /** Declares this length but sends only `body`, then waits with the connection open. */
  declaredLength?: number;
  /** The loopback address to connect from (uniqueLoopbackAddress), so the post has a client address of its own. */
  from?: string;
};

export type RawReply = { status: number; headers: Record<string, string | string[] | undefined>; text: string; bodyFinished: boolean };

export function rawPost(post: RawPost): Promise<RawReply> {
  const body = post.body ?? new Uint8Array();
  const length = post.declaredLength ?? (post.chunked ? undefined : body.byteLength);
  return new Promise((resolve, reject) => {
    let bodyFinished = false;
    let answered = false;
    const sent = request(
      `${baseUrl}${post.path}`,
      {
        method: "POST",
        // A connection of its own: one left with an unsent body must never carry the next request.
        agent: false,
        localAddress: post.from,
        headers: { origin: baseUrl, ...post.headers, ...(length === undefined ? { "transfer-encoding": "chunked" } : { "content-length": String(length) }) },
      },
      (response) => {
        answered = true;
        const chunks: Buffer[] = [];
        response.on("data", (chunk: Buffer) => chunks.push(chunk));
        response.on("end", () => {
          resolve({ status: response.statusCode!, headers: response.headers, text: Buffer.concat(chunks).toString("utf8"), bodyFinished });
          // A stalled upload is given up once its answer is in.
          sent.destroy();
        });
      },
    );
    // A server may close the connection on an upload it refused; the answer it sent first still counts.
    sent.on("error", (error) => (answered ? undefined : reject(error)));
    for (let at = 0; at < body.byteLength; at += 16 * 1024) sent.write(body.subarray(at, at + 16 * 1024));
    if (post.declaredLength === undefined) sent.end(() => (bodyFinished = true));
  });
}
