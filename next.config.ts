import { withSerwist } from "@serwist/turbopack";
import type { NextConfig } from "next";
import createNextIntlPlugin from "next-intl/plugin";

import {
  COMMON_SECURITY_HEADERS,
  RESOURCE_CONTENT_SECURITY_POLICY,
  SERVICE_WORKER_CONTENT_SECURITY_POLICY,
} from "./lib/http/security-headers";

const nextConfig: NextConfig = {
  // Native modules stay outside the server bundle.
  serverExternalPackages: ["@node-rs/argon2", "pg", "pino"],
  poweredByHeader: false,
  typedRoutes: false,
  // Pages renamed for the glossary: bookmarks and links in e-mails already sent keep working (the
  // query string goes along). A manager's old /properties bookmark is sent to /book by that page.
  async redirects() {
    return [
      { source: "/alerts", destination: "/risk-alerts", permanent: true },
      {
        source: "/my-lawn/visits/:visitId",
        destination: "/my-lawn/reports/:visitId",
        permanent: true,
      },
    ];
  },
  // Every response: lib/http/security-headers.ts. Pages get their nonce-based policy from
  // proxy.ts; JSON, CSV, photos and static files a policy under which nothing runs.
  async headers() {
    return [
      { source: "/:path*", headers: [...COMMON_SECURITY_HEADERS] },
      {
        source: "/api/:path*",
        headers: [{ key: "Content-Security-Policy", value: RESOURCE_CONTENT_SECURITY_POLICY }],
      },
      // The service worker (app/sw.ts): the browser checks it for a new version on every visit.
      {
        source: "/serwist/:path*",
        headers: [
          { key: "Content-Security-Policy", value: SERVICE_WORKER_CONTENT_SECURITY_POLICY },
          { key: "Cache-Control", value: "no-cache" },
        ],
      },
      {
        source: "/_next/static/:path*",
        headers: [{ key: "Content-Security-Policy", value: RESOURCE_CONTENT_SECURITY_POLICY }],
      },
    ];
  },
};

// Words and formats in the company's locale (lib/i18n/, next-intl without locale routing).
// The service worker is bundled by esbuild (app/serwist/[path]/route.ts), kept outside the bundle.
export default createNextIntlPlugin("./lib/auth/request-locale.ts")(withSerwist(nextConfig));
