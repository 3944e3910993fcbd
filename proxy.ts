// Runs only for server-action posts (requests carrying a Next-Action header). Next.js refuses an
// action whose Origin does not match the host by throwing, which answers 500; this answers the
// same refusal as the route handlers do — 403 with a JSON error — before any action code runs.
// Not a security boundary of its own: every action is still checked by lib/auth/guard.ts.
import { NextResponse, type NextRequest } from "next/server";

import { isSameSiteWrite } from "@/lib/http/origin";

export function proxy(request: NextRequest): NextResponse {
  if (request.method === "POST" && !isSameSiteWrite(request.headers)) {
    return NextResponse.json(
      { error: { code: "forbidden", message: "Cross-site requests are refused." } },
      { status: 403, headers: { "Cache-Control": "no-store" } },
    );
  }
  return NextResponse.next();
}

export const config = {
  matcher: [{ source: "/:path*", has: [{ type: "header", key: "next-action" }] }],
};
