// Argon2id parameters against the OWASP Password Storage Cheat Sheet minimum
// (Argon2id, m = 19 MiB, t = 2, p = 1), read back from the PHC string the library writes.
// The minimum length against NIST SP 800-63B-4 (2025) §3.1.1.2: at least 15 characters for a
// password that is the only factor, each Unicode code point counted as one, no composition rules.
import { describe, expect, it } from "vitest";

import {
  ARGON2_PARAMS,
  hashPassword,
  MIN_PASSWORD_LENGTH,
  verifyPassword,
} from "@/lib/auth/password";

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

describe("the minimum password length (NIST SP 800-63B-4 §3.1.1.2, single-factor)", () => {
  it("is 15 characters", () => {
    expect(MIN_PASSWORD_LENGTH).toBe(15);
  });

  it("refuses 14 characters with a message in plain words, and accepts 15", async () => {
    await expect(hashPassword("mow-high-often")).rejects.toMatchObject({
      code: "invalid_input",
      message:
        "Choose a password of at least 15 characters. A few unrelated words make a good one.",
      fieldErrors: { password: [expect.stringContaining("at least 15 characters")] },
    });
    const h = await hashPassword("mow-high-often!");
    expect(await verifyPassword(h, "mow-high-often!")).toBe(true);
  });

  it("counts code points, not UTF-16 units: 14 emoji are too short, 15 are enough", async () => {
    expect("🌱".repeat(14).length).toBe(28);
    await expect(hashPassword("🌱".repeat(14))).rejects.toMatchObject({ code: "invalid_input" });
    await expect(hashPassword("🌱".repeat(15))).resolves.toMatch(/^\$argon2id\$/);
  });

  it("asks for no mix of character kinds: lower-case words and spaces are fine", async () => {
    await expect(hashPassword("rake the leaves first")).resolves.toMatch(/^\$argon2id\$/);
  });

  it("refuses an empty password and one of more than 1,024 characters", async () => {
    await expect(hashPassword("")).rejects.toMatchObject({ code: "invalid_input" });
    await expect(hashPassword("x".repeat(1025))).rejects.toMatchObject({
      message: "That password is too long.",
    });
  });
});
