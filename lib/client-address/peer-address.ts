import { randomBytes, timingSafeEqual } from "node:crypto";
import { subscribe } from "node:diagnostics_channel";
import type { IncomingMessage } from "node:http";
import type { Socket } from "node:net";

// Next.js gives route handlers, server actions and proxy.ts no way to the connection's address:
// NextRequest.ip went in Next 15, and `next start` writes the socket's address into
// X-Forwarded-For only when the client sent none, so a client that sends one hides it. Node
// announces every request its HTTP server parses on the `http.server.request.start` diagnostics
// channel, with the socket, before any listener sees the request; instrumentation.ts subscribes
// when the server process starts, and the subscriber writes the socket's address into a header
// of our own, replacing whatever a client sent under that name.
//
// The server accepts connections a moment before instrumentation.ts runs, so a request that
// arrived in that moment carries no stamp, or one a client made up. The stamp therefore starts
// with a key made at random in this process, which no client can know: without it, the request
// has no known peer (readPeerAddress answers null).

export const peerHeader = "x-edgewise-peer";
const keySlot = Symbol.for("edgewise.peer-address-key");
const startedSlot = Symbol.for("edgewise.peer-address-stamping");

type Slots = { [keySlot]?: string; [startedSlot]?: true };

// Route bundles and instrumentation.ts are separate bundles of one process: they meet on globalThis.
function processKey(): string {
  const slots = globalThis as Slots;
  return (slots[keySlot] ??= randomBytes(24).toString("base64url"));
}

/** The header value that says "this request came over a connection from `address`". */
export function peerStamp(address: string): string {
  return `${processKey()} ${address}`;
}

/** Stamps every request this process's HTTP server receives from now on with its socket's address. */
export function startStampingPeerAddresses(): void {
  const slots = globalThis as Slots;
  if (slots[startedSlot]) return;
  slots[startedSlot] = true;
  subscribe("http.server.request.start", (message) => {
    const { request, socket } = message as { request: IncomingMessage; socket: Socket };
    request.headers[peerHeader] = peerStamp(socket.remoteAddress ?? "");
  });
}

/** The address of the connection the request came over, or null when the request carries no valid stamp. */
export function readPeerAddress(headers: Headers): string | null {
  const value = headers.get(peerHeader);
  const separator = value?.indexOf(" ") ?? -1;
  if (!value || separator < 0) return null;
  const expected = Buffer.from(processKey());
  const given = Buffer.from(value.slice(0, separator));
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  return value.slice(separator + 1) || null;
}

