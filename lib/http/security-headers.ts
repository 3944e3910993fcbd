// The response headers that tell browsers what a Sward page may do (pure; used by proxy.ts for
// every page and by next.config.ts for everything else). Checked for every page type by
// tests/e2e/security-headers.test.ts.
//
// Content-Security-Policy for pages: scripts only with this response's nonce (Next puts it on its
// own inline and bundle scripts when the request carries the policy — proxy.ts) and what those
// load ('strict-dynamic'); no plugins, no <base>, forms and frames only to this site, never framed.
// Styles keep 'unsafe-inline': React's style attributes need it, and CSS cannot run script.
// The map (MapLibre GL) fetches its style, tiles and images from the map service's origin
// (`mapOrigin`, from MAP_STYLE_URL) and runs its worker from a blob: URL (worker-src).

/** The origin of the map service's style URL, or null when unset or not an http(s) URL. */
export function mapServiceOrigin(styleUrl: string | undefined): string | null {
  if (!styleUrl) return null;
  try {
    const url = new URL(styleUrl);
    return url.protocol === "https:" || url.protocol === "http:" ? url.origin : null;
  } catch {
    return null;
  }
}

export function pageContentSecurityPolicy(
  nonce: string,
  options: { isDev: boolean; mapOrigin?: string | null },
): string {
  const map = options.mapOrigin ? ` ${options.mapOrigin}` : "";
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${options.isDev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    `img-src 'self' blob: data:${map}`,
    "font-src 'self'",
    `connect-src 'self'${map}`,
    "worker-src 'self' blob:",
    "manifest-src 'self'",
    "media-src 'self' blob:",
    "frame-src 'self'",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

/**
 * The service worker's own script (/serwist/sw.js): a worker's policy is the one its script is
 * served with. It fetches and stores this site's pages and data, and loads nothing else.
 */
export const SERVICE_WORKER_CONTENT_SECURITY_POLICY =
  "default-src 'none'; connect-src 'self'; frame-ancestors 'none'";

/** JSON, CSV, photos and static files: nothing in them may run or be framed. */
export const RESOURCE_CONTENT_SECURITY_POLICY = "default-src 'none'; frame-ancestors 'none'";

/**
 * Powerful features: geolocation for this site only (a property's and a visit's position), the
 * camera for this site (photo capture); everything else off for every origin.
 */
const PERMISSIONS_POLICY = [
  "geolocation=(self)",
  "camera=(self)",
  "microphone=()",
  "display-capture=()",
  "payment=()",
  "usb=()",
  "serial=()",
  "hid=()",
  "bluetooth=()",
  "midi=()",
  "accelerometer=()",
  "gyroscope=()",
  "magnetometer=()",
  "browsing-topics=()",
].join(", ");

/** Sent with every response (next.config.ts). */
export const COMMON_SECURITY_HEADERS: readonly { key: string; value: string }[] = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "same-origin" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Permissions-Policy", value: PERMISSIONS_POLICY },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
  { key: "Cross-Origin-Resource-Policy", value: "same-origin" },
  { key: "X-Permitted-Cross-Domain-Policies", value: "none" },
];

/** HSTS, only where the app is served over https (two years, subdomains: RFC 6797 §6.1). */
export const STRICT_TRANSPORT_SECURITY = "max-age=63072000; includeSubDomains";
