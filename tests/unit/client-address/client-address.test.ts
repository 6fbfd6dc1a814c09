import { describe, expect, it } from "vitest";
import { compileTrustedProxies, resolveClientAddress, unverifiedAddress } from "@/lib/client-address/client-address";
import { peerHeader, peerStamp, readPeerAddress } from "@/lib/client-address/peer-address";

const nobody = compileTrustedProxies([]);
const balancer = compileTrustedProxies(["10.0.0.0/8", "::1"]);

describe("the client address", () => {
  it("is the connection's peer when no proxy is trusted, whatever X-Forwarded-For says", () => {
    expect(resolveClientAddress({ peer: "203.0.113.9", forwardedFor: "198.51.100.1", trusted: nobody })).toBe("203.0.113.9");
    expect(resolveClientAddress({ peer: "203.0.113.9", forwardedFor: null, trusted: nobody })).toBe("203.0.113.9");
  });

  it("behind trusted proxies, is the first address from the right that is not one of them", () => {
    // The client wrote the two leftmost entries itself; the balancers appended the rest.
    const forwardedFor = "192.0.2.66, 198.51.100.1, 203.0.113.9, 10.1.1.1";
    expect(resolveClientAddress({ peer: "10.2.2.2", forwardedFor, trusted: balancer })).toBe("203.0.113.9");
    expect(resolveClientAddress({ peer: "::1", forwardedFor: "203.0.113.4", trusted: balancer })).toBe("203.0.113.4");
  });

  it("is the peer when the peer is not a trusted proxy, even with an X-Forwarded-For", () => {
    expect(resolveClientAddress({ peer: "203.0.113.9", forwardedFor: "10.1.1.1, 198.51.100.1", trusted: balancer })).toBe("203.0.113.9");
  });

  it("is the farthest proxy when every hop is trusted", () => {
    expect(resolveClientAddress({ peer: "10.2.2.2", forwardedFor: "10.3.3.3", trusted: balancer })).toBe("10.3.3.3");
  });

  it("takes IPv4 clients of a dual-stack server as IPv4, and IPv6 clients by their /64", () => {
    expect(resolveClientAddress({ peer: "::ffff:203.0.113.9", forwardedFor: null, trusted: nobody })).toBe("203.0.113.9");
    const one = resolveClientAddress({ peer: "2001:db8:1:2:aaaa::1", forwardedFor: null, trusted: nobody });
    const neighbour = resolveClientAddress({ peer: "2001:db8:1:2:ffff:1:2:3", forwardedFor: null, trusted: nobody });
    expect(one).toBe("2001:db8:1:2::/64");
    expect(neighbour).toBe(one);
    expect(resolveClientAddress({ peer: "2001:db8:1:3::1", forwardedFor: null, trusted: nobody })).not.toBe(one);
  });

  it("is the shared unverified address without a known peer, or when a trusted proxy forwarded something that is no address", () => {
    expect(resolveClientAddress({ peer: null, forwardedFor: "203.0.113.9", trusted: balancer })).toBe(unverifiedAddress);
    expect(resolveClientAddress({ peer: "10.2.2.2", forwardedFor: "not-an-address", trusted: balancer })).toBe(unverifiedAddress);
  });
});

describe("the peer-address stamp", () => {
  it("is read back only with this process's key, so a client cannot send one of its own", () => {
    expect(readPeerAddress(new Headers({ [peerHeader]: peerStamp("203.0.113.9") }))).toBe("203.0.113.9");
    const [key] = peerStamp("x").split(" ");
    const forged = `${key!.slice(0, -1)}${key!.endsWith("A") ? "B" : "A"} 198.51.100.1`;
    expect(readPeerAddress(new Headers({ [peerHeader]: forged }))).toBeNull();
    expect(readPeerAddress(new Headers({ [peerHeader]: "198.51.100.1" }))).toBeNull();
    expect(readPeerAddress(new Headers())).toBeNull();
  });
});
