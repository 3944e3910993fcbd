// The client address settled at the edge (lib/http/edge-address.mjs): with no trusted proxy the
// socket's peer whatever X-Forwarded-For says; behind n proxies that each append what they saw
// (RFC 7239 §5.2 describes the same chain for Forwarded), the entry n hops left of the peer.
import fc from "fast-check";
import { describe, expect, it } from "vitest";

import {
  clientAddressOf,
  settleForwardedHeaders,
  trustedProxyCount,
} from "@/lib/http/edge-address.mjs";

describe("clientAddressOf", () => {
  it("no proxy: the socket's peer, whatever the client put in X-Forwarded-For", () => {
    fc.assert(
      fc.property(fc.array(fc.ipV4(), { maxLength: 5 }), fc.ipV4(), (spoofed, peer) => {
        expect(clientAddressOf(spoofed.join(", "), peer, 0)).toBe(peer);
        expect(clientAddressOf(spoofed, peer, 0)).toBe(peer);
      }),
    );
  });

  it("n trusted proxies: what the outermost trusted proxy saw, never an entry the client wrote", () => {
    // client wrote "6.6.6.6"; proxy A saw the client at 203.0.113.7; proxy B saw A at 10.0.0.2;
    // the app's socket sees B at 10.0.0.3.
    expect(clientAddressOf("6.6.6.6, 203.0.113.7, 10.0.0.2", "10.0.0.3", 2)).toBe("203.0.113.7");
    expect(clientAddressOf("6.6.6.6, 203.0.113.7", "10.0.0.2", 1)).toBe("203.0.113.7");
    // Fewer hops than configured (a request that skipped the proxy): the left-most it has.
    expect(clientAddressOf(undefined, "192.0.2.9", 2)).toBe("192.0.2.9");
  });

  it("settles the headers in place: one address, and no forwarded host/proto without a proxy", () => {
    const req = {
      headers: {
        "x-forwarded-for": "1.2.3.4, 5.6.7.8",
        "x-forwarded-host": "evil.example",
        "x-forwarded-proto": "https",
        forwarded: "host=evil.example",
        host: "localhost:3000",
      } as Record<string, string | undefined>,
      socket: { remoteAddress: "127.0.0.1" },
    };
    settleForwardedHeaders(req, 0);
    expect(req.headers).toEqual({ "x-forwarded-for": "127.0.0.1", host: "localhost:3000" });
  });

  it("TRUSTED_PROXY_COUNT: a whole number from 0 to 10", () => {
    expect(trustedProxyCount(undefined)).toBe(0);
    expect(trustedProxyCount("2")).toBe(2);
    for (const bad of ["-1", "1.5", "eleven", "11"]) expect(() => trustedProxyCount(bad)).toThrow();
  });
});
