// Three test projects: unit (pure code), integration (real PostgreSQL, freshly migrated), and
// e2e (Chromium against a production build). `npm test` runs them all through tests/harness/run-all.ts.
import path from "node:path";
import { defineConfig } from "vitest/config";

const root = path.dirname(new URL(import.meta.url).pathname);
const pgPort = process.env.SWARD_PG_PORT ?? "54329";

const shared = {
  resolve: {
    alias: {
      "@": root,
      "server-only": path.join(root, "tests/helpers/empty-module.ts"),
    },
  },
};

export default defineConfig({
  ...shared,
  test: {
    reporters: ["default"],
    projects: [
      {
        ...shared,
        test: {
          name: "unit",
          include: ["tests/unit/**/*.test.ts"],
          environment: "node",
          // Photo decoding and the supervisor child run for 1–2 s on an idle machine but passed
          // 5 s on one loaded to 15 runnable processes per core; a hang still fails.
          testTimeout: 30_000,
        },
      },
      {
        ...shared,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/helpers/integration-setup.ts"],
          // next-auth imports "next/server" without an extension; inlined, Vite resolves it.
          server: { deps: { inline: ["next-auth"] } },
          env: {
            NODE_ENV: "test",
            // The site the route guard accepts writes from (lib/http/origin.ts: the loopback origins
            // on this port) and links are built on; pinned so a developer's PORT changes nothing.
            PORT: "3000",
            DATABASE_URL: `postgres://postgres@127.0.0.1:${pgPort}/sward_test`,
            AUTH_SECRET: "integration-tests-only-secret-0123456789abcdef",
            SIGN_IN_MAX_PER_ACCOUNT: "5",
            SIGN_IN_MAX_PER_ADDRESS: "20",
            PHOTO_STORAGE: "local",
            PHOTO_DIR: "tests/.artifacts/photos-integration",
          },
          testTimeout: 20_000,
          hookTimeout: 60_000,
        },
      },
      {
        ...shared,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/helpers/e2e-setup.ts"],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
});
