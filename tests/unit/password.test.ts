// Argon2id parameters against the OWASP Password Storage Cheat Sheet minimum
// (Argon2id, m = 19 MiB, t = 2, p = 1), read back from the PHC string the library writes.
import { describe, expect, it } from "vitest";

import { ARGON2_PARAMS, hashPassword, verifyPassword } from "@/lib/auth/password";

describe("hashPassword", () => {
  it("writes an Argon2id PHC string with m ≥ 19456 KiB, t ≥ 2, p ≥ 1 and a random salt", async () => {
    const a = await hashPassword("correct horse battery staple");
    const b = await hashPassword("correct horse battery staple");
    const match = /^\$argon2id\$v=19\$m=(\d+),t=(\d+),p=(\d+)\$([A-Za-z0-9+/]+)\$/.exec(a);
    expect(match).not.toBeNull();
    expect(Number(match![1])).toBeGreaterThanOrEqual(19_456);
    expect(Number(match![2])).toBeGreaterThanOrEqual(2);
    expect(Number(match![3])).toBeGreaterThanOrEqual(1);
    expect(a).not.toBe(b); // salted
    expect(ARGON2_PARAMS.algorithm).toBe(2);
  });

  it("verifies the right password only, and never throws on a broken hash", async () => {
    const h = await hashPassword("mow-high-mow-often");
    expect(await verifyPassword(h, "mow-high-mow-often")).toBe(true);
    expect(await verifyPassword(h, "mow-high-mow-often ")).toBe(false);
    expect(await verifyPassword("not a hash", "x")).toBe(false);
  });
});
