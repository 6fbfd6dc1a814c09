import { randomInt } from "node:crypto";
import { Agent, fetch as undiciFetch } from "undici";

// The whole of 127.0.0.0/8 is this machine, so a test can connect to the server from an address
// of its own, which the server sees as the connection's peer: as if from another computer.

/** A loopback address other than 127.0.0.1, different (almost surely) for every call. */
export function uniqueLoopbackAddress(): string {
  return `127.${randomInt(1, 255)}.${randomInt(0, 256)}.${randomInt(1, 255)}`;
}

/** fetch over a connection made from `localAddress`; the connection is closed once the body is read. */
export async function fetchFrom(localAddress: string, url: string, init: RequestInit = {}): Promise<Response> {
  const agent = new Agent({ connect: { localAddress } });
  try {
    const response = await undiciFetch(url, { ...(init as Parameters<typeof undiciFetch>[1]), dispatcher: agent });
    const body = await response.arrayBuffer();
    return new Response(response.status === 204 || response.status === 304 ? null : body, {
      status: response.status,
      statusText: response.statusText,
      headers: response.headers as unknown as Headers,
    });
  } finally {
    await agent.close();
  }
}
