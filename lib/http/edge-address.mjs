// The client address, decided once at the edge of the process (loaded with `node --import` before
// Next starts; `npm start` and every harness that serves the app do so).
//
// Next fills X-Forwarded-For from the socket only when the request has none, so without a proxy
// in front whatever a client sends there was taken as its address: new values dodged the
// per-address throttle and spent other people's per-account allowance. Here the address is the
// socket's peer, or — behind TRUSTED_PROXY_COUNT proxies that each append the address they saw —
// the entry that many hops from the right. Every request then carries exactly that one address in
// X-Forwarded-For, and with no trusted proxy the X-Forwarded-Host/-Proto/-Port a client sent are
// dropped too, so Next and Auth.js see the Host the socket received.
import http from "node:http";

const FLAG = Symbol.for("sward.clientAddressAtEdge");

/** TRUSTED_PROXY_COUNT: a whole number ≥ 0 (default 0: no proxy in front). */
export function trustedProxyCount(value = process.env.TRUSTED_PROXY_COUNT) {
  if (value === undefined || value === "") return 0;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 0 || n > 10)
    throw new Error(`TRUSTED_PROXY_COUNT must be a whole number from 0 to 10 (got "${value}")`);
  return n;
}

/**
 * The client's address from the X-Forwarded-For entries a request carried (every header line,
 * left to right) and the socket's peer, trusting `proxies` hops. Pure.
 */
export function clientAddressOf(forwardedFor, peer, proxies) {
  const lines = Array.isArray(forwardedFor) ? forwardedFor : forwardedFor ? [forwardedFor] : [];
  const hops = lines
    .flatMap((l) => String(l).split(","))
    .map((h) => h.trim())
    .filter(Boolean);
  const chain = [...hops, peer || "unknown"];
  // With n trusted proxies the client is n hops left of the socket's peer; a request that came
  // through fewer hops than that (straight to the app) gives the left-most entry it has.
  return chain[Math.max(0, chain.length - 1 - proxies)].slice(0, 100);
}

/** Rewrites one request's forwarding headers in place (see the comment at the top). */
export function settleForwardedHeaders(req, proxies) {
  const address = clientAddressOf(
    req.headers["x-forwarded-for"],
    req.socket?.remoteAddress,
    proxies,
  );
  req.headers["x-forwarded-for"] = address;
  if (proxies === 0) {
    delete req.headers["x-forwarded-host"];
    delete req.headers["x-forwarded-proto"];
    delete req.headers["x-forwarded-port"];
    delete req.headers["forwarded"];
  }
}

if (!globalThis[FLAG]) {
  const proxies = trustedProxyCount();
  const emit = http.Server.prototype.emit;
  http.Server.prototype.emit = function emitWithClientAddress(event, ...args) {
    if (event === "request" && args[0]?.headers) settleForwardedHeaders(args[0], proxies);
    return emit.call(this, event, ...args);
  };
  globalThis[FLAG] = { proxies };
}
