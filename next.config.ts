import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // Native modules stay outside the server bundle.
  serverExternalPackages: ["@node-rs/argon2", "pg", "pino"],
  poweredByHeader: false,
  typedRoutes: false,
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
