// Same-site checks shared by the route guard (lib/auth/guard.ts) and the proxy (proxy.ts).

/** The host an Origin header names, or null for none, "null" (sandboxed or privacy-sensitive contexts) and anything unparsable. */
function originHost(origin: string | null): string | null {
  if (!origin) return null;
  try {
    return new URL(origin).host || null;
  } catch {
    return null;
  }
}

/**
 * True for a write this site's own pages sent: Fetch Metadata, when the browser sends it, says
 * same-origin (or "none": typed by the user), and the Origin names the host the request was sent
 * to (behind a proxy, the forwarded host). No Origin at all is refused: browsers send it on writes.
 */
export function isSameSiteWrite(headers: Headers): boolean {
  const site = headers.get("sec-fetch-site");
  if (site && site !== "same-origin" && site !== "none") return false;
  const host = headers.get("x-forwarded-host") ?? headers.get("host");
  return Boolean(host) && originHost(headers.get("origin")) === host;
}
