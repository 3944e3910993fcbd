// The one same-origin check for redirects (lib/http/redirect.ts), as a property: whatever a
// request carries, the Location Sward sends resolves — with the WHATWG URL parser browsers use
// (https://url.spec.whatwg.org/, which Node's URL implements) — to Sward's own origin, and is a
// value the Fetch standard's Headers accept (no CR/LF/NUL: https://fetch.spec.whatwg.org/#header-value).
// The hostile alphabet comes from the ways browsers reinterpret a path: tabs and newlines are
// dropped, "\" reads as "/", "//" starts a host, "user@" is userinfo, dot segments collapse
// ("/.//x" → "//x"), percent-encoded and Unicode look-alike slashes, and control characters that
// make Node refuse a header.
import fc from "fast-check";
import { describe, expect, it } from "vitest";

import { authRedirect, sameOriginPath } from "@/lib/http/redirect";

const SITE = "https://home.sward.test";
const PAGE = `${SITE}/sign-in?callbackUrl=x`;

/** What a browser does with a Location header on PAGE: the origin it would go to, or null when the header could not even be sent. */
function browserDestination(location: string): string | null {
  try {
    const h = new Headers({ location });
    if (h.get("location") !== location) return null; // trimmed or changed: not what was checked
  } catch {
    return null;
  }
  return new URL(location, PAGE).origin;
}

const TOKENS = [
  "/",
  "//",
  "\\",
  "\t",
  "\n",
  "\r",
  "\0",
  "\f",
  "\v",
  "\u0085",
  "\u2028",
  "\u2029",
  " ",
  "\u00a0",
  "\u200b",
  "\ufeff",
  "%09",
  "%0a",
  "%0D",
  "%00",
  "%2f",
  "%2F",
  "%5c",
  "%5C",
  "%2e",
  "%2e%2e",
  "%252f",
  ".",
  "..",
  "@",
  ":",
  "user:pass@",
  "evil.example",
  "evil.example:443",
  "localhost",
  "127.0.0.1",
  "[::1]",
  "http:",
  "https:",
  "javascript:",
  "data:",
  "\uff0f", // fullwidth solidus
  "\u2215", // division slash
  "\u2044", // fraction slash
  "\uff3c", // fullwidth reverse solidus
  "\ufe68", // small reverse solidus
  "\u3002", // ideographic full stop (reads as "." in host names)
  "?",
  "#",
  "&",
  "=",
  "my-lawn",
  "reports",
];

const hostile = fc
  .array(fc.constantFrom(...TOKENS), { minLength: 1, maxLength: 10 })
  .map((parts) => parts.join(""));
/** What Next hands a page after decoding the query string once more (e.g. "%09" → tab). */
const decodedOnce = hostile.map((s) => {
  try {
    return decodeURIComponent(s);
  } catch {
    return s;
  }
});

const KNOWN = [
  "/\t/evil.example/phish",
  "/%09/evil.example/phish",
  "/\t\\evil.example/phish",
  "/\n/x",
  "/\r/x",
  "/\0/x",
  "/\f/x",
  "/\u2028/x",
  "//evil.example",
  "/\\evil.example",
  "\\/evil.example",
  "/\\/evil.example",
  "/.//evil.example",
  "/..//evil.example",
  "/%2e%2e//evil.example",
  "/%2e//evil.example",
  "https://evil.example/",
  "http:evil.example",
  "http:/evil.example",
  "javascript:alert(1)",
  "//user@evil.example",
  "/@evil.example",
  " //evil.example",
  "\t//evil.example",
  "/\uff0f/evil.example",
];

// Figures for README (Reliability and security): how many payloads the property tests tried.
const RUNS = { hostile: 20_000, decoded: 10_000, unicode: 10_000, auth: 10_000, safe: 2_000 };

describe("sameOriginPath: the redirect check", () => {
  it(`never yields a Location that leaves the site (${KNOWN.length} known payloads)`, () => {
    for (const payload of KNOWN) {
      const out = sameOriginPath(payload);
      if (out !== undefined) expect(browserDestination(out), JSON.stringify(payload)).toBe(SITE);
    }
    // The ones the finding named are refused outright, not rewritten.
    for (const payload of [
      "/\t/evil.example/phish",
      "/\n/x",
      "/\r/x",
      "/\0/x",
      "/\f/x",
      "/\u2028/x",
    ])
      expect(sameOriginPath(payload)).toBeUndefined();
  });

  it(`hostile alphabet (${RUNS.hostile} runs): same origin or refused`, () => {
    fc.assert(
      fc.property(hostile, (s) => {
        const out = sameOriginPath(s);
        return out === undefined || browserDestination(out) === SITE;
      }),
      { numRuns: RUNS.hostile },
    );
  });

  it(`the same alphabet decoded once more (${RUNS.decoded} runs)`, () => {
    fc.assert(
      fc.property(decodedOnce, (s) => {
        const out = sameOriginPath(s);
        return out === undefined || browserDestination(out) === SITE;
      }),
      { numRuns: RUNS.decoded },
    );
  });

  it(`any Unicode string, with or without a leading "/" (${RUNS.unicode} runs)`, () => {
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 40 }), fc.boolean(), (s, slash) => {
        const out = sameOriginPath(slash ? `/${s}` : s);
        return out === undefined || browserDestination(out) === SITE;
      }),
      { numRuns: RUNS.unicode },
    );
  });

  it(`ordinary paths of the site come back unchanged (${RUNS.safe} runs)`, () => {
    const segment = fc.stringMatching(/^[a-z0-9-]{1,12}$/);
    const path = fc
      .tuple(
        fc.array(segment, { minLength: 0, maxLength: 4 }),
        fc.option(fc.stringMatching(/^[a-z]{1,6}=[a-z0-9]{1,6}$/), { nil: undefined }),
      )
      .map(([segs, q]) => `/${segs.join("/")}${q ? `?${q}` : ""}`);
    fc.assert(
      fc.property(path, (p) => sameOriginPath(p) === p),
      { numRuns: RUNS.safe },
    );
    expect(sameOriginPath("/my-lawn/reports/11111111-1111-4111-8111-111111111111")).toBe(
      "/my-lawn/reports/11111111-1111-4111-8111-111111111111",
    );
    expect(sameOriginPath("/book?status=due#list")).toBe("/book?status=due#list");
  });

  it("refuses what is not a path: empty, too long, not a string", () => {
    expect(sameOriginPath(undefined)).toBeUndefined();
    expect(sameOriginPath("")).toBeUndefined();
    expect(sameOriginPath(42)).toBeUndefined();
    expect(sameOriginPath(`/${"a".repeat(2000)}`)).toBeUndefined();
  });
});

describe("authRedirect: Auth.js's redirect callback", () => {
  it(`relative or absolute, hostile or not (${RUNS.auth} runs): always on the base origin`, () => {
    const absolute = fc
      .tuple(fc.constantFrom(SITE, "https://evil.example", "http://home.sward.test", ""), hostile)
      .map(([o, p]) => `${o}${p}`);
    fc.assert(
      fc.property(fc.oneof(hostile, decodedOnce, absolute), (url) => {
        const out = authRedirect({ url, baseUrl: SITE });
        return new URL(out).origin === SITE && !/[\u0000-\u001f\u007f-\u009f]/.test(out);
      }),
      { numRuns: RUNS.auth },
    );
    expect(authRedirect({ url: "/my-lawn", baseUrl: SITE })).toBe(`${SITE}/my-lawn`);
    expect(authRedirect({ url: `${SITE}/today?x=1`, baseUrl: SITE })).toBe(`${SITE}/today?x=1`);
    expect(authRedirect({ url: "/\t/evil.example/phish", baseUrl: SITE })).toBe(SITE);
    expect(authRedirect({ url: "https://evil.example/my-lawn", baseUrl: SITE })).toBe(SITE);
  });
});
