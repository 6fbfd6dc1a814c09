import "server-only";
import ipaddr from "ipaddr.js";
import { headers } from "next/headers";
import proxyAddr from "proxy-addr";
import { readTrustedProxies } from "@/lib/env";
import { readPeerAddress } from "./peer-address";

// The client behind a request, for rate limits. The connection's peer is the client unless it is
// one of TRUSTED_PROXIES; then X-Forwarded-For is read from the right, each trusted proxy having
// appended the address it saw, and the first address that is not a trusted proxy is the client.
// Entries left of it were written by the client and are never read. With TRUSTED_PROXIES empty
// (the default) X-Forwarded-For is ignored altogether.

/** The one address of requests whose connection is unknown (see peer-address.ts); they share its limits. */
export const unverifiedAddress = "unverified";

export type TrustedProxies = (address: string, hop: number) => boolean;

/** TRUSTED_PROXIES as proxy-addr's test: entries as in the README's configuration table. */
export const compileTrustedProxies = (entries: string[]): TrustedProxies => proxyAddr.compile(entries);

let configuredProxies: TrustedProxies | undefined;

export function resolveClientAddress(params: { peer: string | null; forwardedFor: string | null; trusted: TrustedProxies }): string {
  if (!params.peer) return unverifiedAddress;
  const request = {
    socket: { remoteAddress: params.peer },
    headers: { "x-forwarded-for": params.forwardedFor ?? "" },
  } as unknown as Parameters<typeof proxyAddr>[0];
  return limitKeyOf(proxyAddr(request, params.trusted));
}

export function clientAddressOf(requestHeaders: Headers): string {
  configuredProxies ??= compileTrustedProxies(readTrustedProxies());
  return resolveClientAddress({
    peer: readPeerAddress(requestHeaders),
    forwardedFor: requestHeaders.get("x-forwarded-for"),
    trusted: configuredProxies,
  });
}

/** For server actions and pages, which read the request through next/headers. */
export async function readClientAddress(): Promise<string> {
  return clientAddressOf(await headers());
}

/**
 * IPv4 addresses as they are (an IPv4 client of a dual-stack server included); IPv6 by their /64
 * network, since one subscriber is routinely given a whole /64 and could otherwise take a fresh
 * address, and a fresh limit, for every request.
 */
function limitKeyOf(address: string): string {
  if (!ipaddr.isValid(address)) return unverifiedAddress;
  const parsed = ipaddr.process(address);
  if (parsed.kind() === "ipv4") return parsed.toString();
  return `${ipaddr.IPv6.networkAddressFromCIDR(`${parsed.toString()}/64`).toString()}/64`;
}
