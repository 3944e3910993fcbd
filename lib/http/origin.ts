// Same-site checks shared by the route guard (lib/auth/guard.ts) and the proxy (proxy.ts).
//
// The site is what the configuration says it is — never what a request says. The Host and
// X-Forwarded-Host headers are the client's to write (a script sends Host: evil.example with a
// matching Origin as easily as anything else), so neither takes part: the Origin of a write must
// be the origin of AUTH_URL, or — in development and tests only — a loopback origin on the port the
// server was started on (Next stores the port it listens on in process.env.PORT).

const LOOPBACK_HOSTS = ["localhost", "127.0.0.1", "[::1]"];

type OriginEnv = { NODE_ENV?: string; AUTH_URL?: string; PORT?: string };

/** The origin of a URL, or null for none, "null" (sandboxed or privacy-sensitive contexts) and anything unparsable or opaque. */
function originOf(value: string | null | undefined): string | null {
  if (!value) return null;
  try {
    const origin = new URL(value).origin;
    return origin === "null" ? null : origin;
  } catch {
    return null;
  }
}

/** The origins this site's own pages post from (see the comment at the top). */
export function siteOrigins(env: OriginEnv = process.env): Set<string> {
  const origins = new Set<string>();
  const configured = originOf(env.AUTH_URL);
  if (configured) origins.add(configured);
  if (env.NODE_ENV !== "production") {
    const port = env.PORT || "3000";
    for (const host of LOOPBACK_HOSTS) {
      const loopback = originOf(`http://${host}:${port}`);
      if (loopback) origins.add(loopback);
    }
  }
  return origins;
}

/**
 * True for a write this site's own pages sent: Fetch Metadata, when the browser sends it, says
 * same-origin (or "none": typed by the user), and the Origin is one of `siteOrigins()`. No Origin
 * at all is refused: browsers send it on writes.
 */
export function isSameSiteWrite(headers: Headers, env: OriginEnv = process.env): boolean {
  const site = headers.get("sec-fetch-site");
  if (site && site !== "same-origin" && site !== "none") return false;
  const origin = originOf(headers.get("origin"));
  return origin !== null && siteOrigins(env).has(origin);
}
