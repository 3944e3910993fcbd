// The one same-origin check for every redirect Sward builds from something a request carried
// (?callbackUrl=, a form's redirectTo, Auth.js's callback URL and its cookie). Pure.
//
// Browsers resolve a Location header with the WHATWG URL parser, which silently drops tabs and
// newlines and reads "\" as "/" — so "/\t/evil.example" and "/\\evil.example" become
// "//evil.example", another host. A prefix test on the raw string cannot see that; this check
// refuses every control character outright (C0, DEL, C1, U+2028/U+2029 — none belongs in a path,
// and a raw one in a header makes Node throw, which answered 500), refuses backslashes, then
// resolves the rest with `new URL` against a stand-in origin and keeps it only when the origin did
// not change. What it returns is the parser's own serialisation (path, query, fragment; ASCII only),
// so the header carries exactly what was checked.

const PROBE_ORIGIN = "http://sward.invalid";
/** Longest path accepted; a longer one falls back to the landing page. */
const MAX_LENGTH = 2000;
// C0 controls, DEL, C1 controls, LINE/PARAGRAPH SEPARATOR, and any backslash.
const REFUSED = /[\u0000-\u001f\u007f-\u009f\u2028\u2029\\]/;

/**
 * A path on this site ("/my-lawn?x=1#y") built from `target`, or undefined when `target` is not
 * one: another origin, a protocol-relative or absolute URL, userinfo, control characters,
 * backslashes, anything unparsable. Callers fall back to a fixed page of their own.
 */
export function sameOriginPath(target: unknown): string | undefined {
  if (typeof target !== "string" || target.length === 0 || target.length > MAX_LENGTH)
    return undefined;
  if (REFUSED.test(target)) return undefined;
  // Only a path: "/" then not "/" (protocol-relative). Scheme-relative tricks ("http:/x",
  // "javascript:") and bare words never start with "/".
  if (!target.startsWith("/") || target.startsWith("//")) return undefined;
  let url: URL;
  try {
    url = new URL(target, PROBE_ORIGIN);
  } catch {
    return undefined;
  }
  if (url.origin !== PROBE_ORIGIN || url.username || url.password) return undefined;
  const path = `${url.pathname}${url.search}${url.hash}`;
  // The serialised form must itself still be a plain path (e.g. "/.//x" normalises to "//x").
  if (!path.startsWith("/") || path.startsWith("//")) return undefined;
  return path;
}

/**
 * Auth.js's redirect callback: a same-origin path (relative, or absolute on `baseUrl`) comes back
 * as an absolute URL on `baseUrl`; anything else goes to `baseUrl` itself.
 */
export function authRedirect({ url, baseUrl }: { url: string; baseUrl: string }): string {
  const base = new URL(baseUrl);
  let candidate: string | undefined;
  if (url.startsWith("/")) candidate = sameOriginPath(url);
  else if (!REFUSED.test(url)) {
    try {
      const absolute = new URL(url);
      if (absolute.origin === base.origin && !absolute.username && !absolute.password)
        candidate = sameOriginPath(`${absolute.pathname}${absolute.search}${absolute.hash}`);
    } catch {
      candidate = undefined;
    }
  }
  return candidate ? `${base.origin}${candidate}` : base.origin;
}
