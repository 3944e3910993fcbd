// Configuration fails fast with a message naming what is wrong.
import { describe, expect, it } from "vitest";

import { appOrigin, parseServerEnv, parseServiceEnv } from "@/lib/env";

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

describe("the app's address (AUTH_URL) and the development inbox", () => {
  it("production needs AUTH_URL, for the web server and for the worker", () => {
    const prod = { ...good, NODE_ENV: "production" };
    expect(() => parseServerEnv(prod)).toThrow(/AUTH_URL is required in production/);
    expect(() => parseServiceEnv({ NODE_ENV: "production" })).toThrow(
      /AUTH_URL is required in production/,
    );
    expect(parseServerEnv({ ...prod, AUTH_URL: "https://lawns.example.com" }).AUTH_URL).toBe(
      "https://lawns.example.com",
    );
  });

  it("links are built from AUTH_URL (origin only), or localhost:$PORT outside production", () => {
    expect(appOrigin({ NODE_ENV: "production", AUTH_URL: "https://lawns.example.com/x/" })).toBe(
      "https://lawns.example.com",
    );
    expect(appOrigin({ NODE_ENV: "development", PORT: "3123" })).toBe("http://localhost:3123");
    expect(appOrigin({ NODE_ENV: "test" })).toBe("http://localhost:3000");
    expect(() => appOrigin({ NODE_ENV: "production" })).toThrow(/AUTH_URL is required/);
  });

  it("the development inbox is refused unless the app's address is loopback", () => {
    const inbox = { ...good, MAIL_INBOX_DIR: ".data/mail" };
    for (const url of ["http://localhost:3000", "http://127.0.0.1:3100", "http://[::1]:3000"])
      expect(
        parseServerEnv({ ...inbox, NODE_ENV: "production", AUTH_URL: url }).MAIL_INBOX_DIR,
      ).toBe(".data/mail");
    for (const url of [
      "https://lawns.example.com",
      "http://10.0.0.5:3000",
      "http://localhost.evil.example",
    ])
      expect(() => parseServerEnv({ ...inbox, NODE_ENV: "production", AUTH_URL: url })).toThrow(
        /MAIL_INBOX_DIR .* refused unless AUTH_URL is a loopback address/,
      );
    expect(() => parseServerEnv({ ...inbox, NODE_ENV: "production" })).toThrow(/AUTH_URL/);
  });
});
