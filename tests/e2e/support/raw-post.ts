import { connect } from "node:net";
import { baseUrl } from "./browser";

// POSTs over a plain socket, for what fetch cannot send: a body in chunks without a length, a
// declared length the body never reaches, a body that stops and waits. The answer is read as soon
// as it comes, whether or not the body has been sent in full. A server that refuses a body closes
// the connection with the body's rest unread, which resets it: an answer still on its way to the
// client can be lost, and writing fails (EPIPE), which an HTTP client library reports as the
// request's failure. So the request is written and its answer read here by hand, and a large body
// waits a moment after the head for an early answer, as curl does before sending one.

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

const pieceBytes = 16 * 1024;
/** Bodies above this wait `earlyAnswerMs` after the head; a refusal by Content-Length alone comes in that time. */
const largeBodyBytes = 64 * 1024;
const earlyAnswerMs = 1000;

function* bodyPieces(body: Uint8Array, chunked: boolean): Generator<Uint8Array> {
  for (let at = 0; at < body.byteLength; at += pieceBytes) {
    const piece = body.subarray(at, at + pieceBytes);
    if (!chunked) yield piece;
    else yield Buffer.concat([Buffer.from(`${piece.byteLength.toString(16)}\r\n`), piece, Buffer.from("\r\n")]);
  }
  if (chunked) yield Buffer.from("0\r\n\r\n");
}

type Head = { status: number; headers: Record<string, string | string[]>; bodyStart: number };

function parseHead(received: Buffer): Head | null {
  const end = received.indexOf("\r\n\r\n");
  if (end < 0) return null;
  const [statusLine, ...lines] = received.subarray(0, end).toString("latin1").split("\r\n");
  const headers: Record<string, string | string[]> = {};
  for (const line of lines) {
    const colon = line.indexOf(":");
    const name = line.slice(0, colon).trim().toLowerCase();
    const value = line.slice(colon + 1).trim();
    const known = headers[name];
    headers[name] = known === undefined ? value : [...(Array.isArray(known) ? known : [known]), value];
  }
  return { status: Number(statusLine!.split(" ")[1]), headers, bodyStart: end + 4 };
}

/** The answer's body once it is complete: by its length, its chunks, or (neither) the connection's end. */
function completeBody(head: Head, received: Buffer, closed: boolean): Buffer | null {
  const rest = received.subarray(head.bodyStart);
  const length = head.headers["content-length"];
  if (typeof length === "string") return rest.byteLength >= Number(length) ? rest.subarray(0, Number(length)) : null;
  if (head.headers["transfer-encoding"] === "chunked") {
    const pieces: Buffer[] = [];
    for (let at = 0; ; ) {
      const lineEnd = rest.indexOf("\r\n", at);
      if (lineEnd < 0) return null;
      const size = parseInt(rest.subarray(at, lineEnd).toString("latin1"), 16);
      if (size === 0) return Buffer.concat(pieces);
      if (rest.byteLength < lineEnd + 2 + size + 2) return null;
      pieces.push(rest.subarray(lineEnd + 2, lineEnd + 2 + size));
      at = lineEnd + 2 + size + 2;
    }
  }
  return closed ? rest : null;
}

export function rawPost(post: RawPost): Promise<RawReply> {
  const body = post.body ?? new Uint8Array();
  const chunked = post.declaredLength === undefined && post.chunked === true;
  const length = post.declaredLength ?? (chunked ? undefined : body.byteLength);
  const url = new URL(post.path, baseUrl);
  const headers: Record<string, string> = {
    host: url.host,
    origin: baseUrl,
    ...post.headers,
    ...(length === undefined ? { "transfer-encoding": "chunked" } : { "content-length": String(length) }),
  };
  const head = [`POST ${url.pathname}${url.search} HTTP/1.1`, ...Object.entries(headers).map(([name, value]) => `${name}: ${value}`), "", ""].join("\r\n");

  // Each post has a connection of its own, so one left with an unsent body never carries another.
  // It is not asked to close: a server closing a connection at once would reset it over a body
  // it has not read, where keeping it open lets it read the rest and throw it away.
  return new Promise((resolve, reject) => {
    let received = Buffer.alloc(0);
    let bodyFinished = false;
    let settled = false;
    const socket = connect({ host: url.hostname, port: Number(url.port), localAddress: post.from });
    const settle = (closed: boolean) => {
      if (settled) return;
      const answer = parseHead(received);
      const text = answer && completeBody(answer, received, closed);
      if (answer && text) {
        settled = true;
        resolve({ status: answer.status, headers: answer.headers, text: text.toString("utf8"), bodyFinished });
        // A stalled upload is given up once its answer is in.
        socket.destroy();
      } else if (closed) {
        settled = true;
        reject(new Error(`The connection closed after ${received.byteLength} bytes, before a whole answer.`));
      }
    };
    socket.on("data", (data: Buffer) => {
      received = Buffer.concat([received, data]);
      settle(false);
    });
    socket.on("close", () => settle(true));
    // Writing into a connection the server has closed fails; its answer, if it sent one, still counts.
    socket.on("error", () => undefined);
    const writeBody = () => {
      if (settled) return;
      for (const piece of bodyPieces(body, chunked)) socket.write(piece);
      if (post.declaredLength === undefined) socket.write(Buffer.alloc(0), () => (bodyFinished = true));
    };
    socket.write(head);
    if (body.byteLength > largeBodyBytes) setTimeout(writeBody, earlyAnswerMs);
    else writeBody();
  });
}
