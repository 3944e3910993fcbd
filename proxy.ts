// Runs before every page and every server-action post (not for /api, static files or prefetches;
// the service worker or icons; those get their headers from next.config.ts).
//  - Pages: a fresh nonce and the Content-Security-Policy built on it, set on the request (Next
//    reads the policy there and puts the nonce on its own scripts) and on the response; HSTS where
//    the app is served over https.
//  - Server actions: Next refuses an action whose Origin does not match the host by throwing, which
//    answers 500; this answers the same refusal as the route handlers do — 403 with a JSON error —
//    before any action code runs. Not a security boundary of its own: every action is still
//    checked by lib/auth/guard.ts.
import { NextResponse, type NextRequest } from "next/server";

import { isSameSiteWrite } from "@/lib/http/origin";
import {
  mapServiceOrigin,
  pageContentSecurityPolicy,
  STRICT_TRANSPORT_SECURITY,
} from "@/lib/http/security-headers";

function newNonce(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return btoa(String.fromCharCode(...bytes));
}

export function proxy(request: NextRequest): NextResponse {
  if (
    request.method === "POST" &&
    request.headers.has("next-action") &&
    !isSameSiteWrite(request.headers)
  ) {
    return NextResponse.json(
      { error: { code: "forbidden", message: "Cross-site requests are refused." } },
      { status: 403, headers: { "Cache-Control": "no-store" } },
    );
  }
  const nonce = newNonce();
  const policy = pageContentSecurityPolicy(nonce, {
    isDev: process.env.NODE_ENV === "development",
    mapOrigin: mapServiceOrigin(process.env.MAP_STYLE_URL),
  });
  const headers = new Headers(request.headers);
  headers.set("x-nonce", nonce);
  headers.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("Content-Security-Policy", policy);
  if (process.env.AUTH_URL?.startsWith("https:"))
    response.headers.set("Strict-Transport-Security", STRICT_TRANSPORT_SECURITY);
  return response;
}

export const config = {
  matcher: [
    { source: "/:path*", has: [{ type: "header", key: "next-action" }] },
    {
      source: "/((?!api/|_next/static|_next/image|icon.svg|robots.txt|serwist/|icons/).*)",
      missing: [
        { type: "header", key: "next-router-prefetch" },
        { type: "header", key: "purpose", value: "prefetch" },
      ],
    },
  ],
};
