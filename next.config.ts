import type { NextConfig } from "next";

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
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "same-origin" },
          { key: "X-Frame-Options", value: "DENY" },
        ],
      },
    ];
  },
};

export default nextConfig;
