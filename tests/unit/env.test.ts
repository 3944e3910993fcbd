// Configuration fails fast with a message naming what is wrong.
import { describe, expect, it } from "vitest";

import { parseServerEnv } from "@/lib/env";

const good = {
  DATABASE_URL: "postgres://postgres@127.0.0.1:54329/sward",
  AUTH_SECRET: "x".repeat(32),
};

describe("parseServerEnv", () => {
  it("accepts a minimal configuration and fills defaults", () => {
    const env = parseServerEnv(good);
    expect(env).toMatchObject({
      NODE_ENV: "development",
      SIGN_IN_MAX_PER_ACCOUNT: 5,
      SIGN_IN_MAX_PER_ADDRESS: 20,
      SIGN_IN_WINDOW_MINUTES: 15,
    });
  });

  it("names each missing or malformed value", () => {
    expect(() => parseServerEnv({})).toThrow(
      /DATABASE_URL is required[\s\S]*AUTH_SECRET is required/,
    );
    expect(() => parseServerEnv({ ...good, DATABASE_URL: "mysql://x" })).toThrow(
      /DATABASE_URL must be a postgres/,
    );
    expect(() => parseServerEnv({ ...good, AUTH_SECRET: "short" })).toThrow(
      /AUTH_SECRET must be at least 32/,
    );
    expect(() => parseServerEnv({ ...good, SIGN_IN_MAX_PER_ACCOUNT: "-1" })).toThrow(
      /SIGN_IN_MAX_PER_ACCOUNT/,
    );
  });
});
