// Sign-in throttling policy and the sign-in input schema.
import fc from "fast-check";
import { describe, expect, it } from "vitest";

import { signInSchema } from "@/lib/auth/schemas";
import { isThrottled, normaliseEmail } from "@/lib/auth/throttle";

const limits = { maxPerAccount: 5, maxPerAddress: 20, windowMinutes: 15 };

describe("isThrottled", () => {
  it("throttles exactly at the limits", () => {
    expect(isThrottled({ forAccount: 4, fromAddress: 19 }, limits)).toBe(false);
    expect(isThrottled({ forAccount: 5, fromAddress: 0 }, limits)).toBe(true);
    expect(isThrottled({ forAccount: 0, fromAddress: 20 }, limits)).toBe(true);
  });

  it("is monotone: more failures never un-throttle", () => {
    fc.assert(
      fc.property(fc.nat(100), fc.nat(100), fc.nat(10), fc.nat(10), (a, b, da, db) => {
        if (isThrottled({ forAccount: a, fromAddress: b }, limits)) {
          expect(isThrottled({ forAccount: a + da, fromAddress: b + db }, limits)).toBe(true);
        }
      }),
    );
  });
});

describe("normaliseEmail", () => {
  it("is idempotent and case-insensitive", () => {
    fc.assert(
      fc.property(fc.emailAddress(), (email) => {
        const n = normaliseEmail(`  ${email.toUpperCase()} `);
        expect(n).toBe(email.toLowerCase());
        expect(normaliseEmail(n)).toBe(n);
      }),
    );
  });
});

describe("signInSchema", () => {
  it("accepts an e-mail and password, trimming the e-mail", () => {
    expect(signInSchema.parse({ email: " tech1@demo.sward.test ", password: "x" })).toEqual({
      email: "tech1@demo.sward.test",
      password: "x",
    });
  });

  it("rejects missing, malformed and oversized values with a message per field", () => {
    const r = signInSchema.safeParse({ email: "not-an-email", password: "" });
    expect(r.success).toBe(false);
    expect(signInSchema.safeParse({ email: "a@b.test", password: "x".repeat(1025) }).success).toBe(
      false,
    );
    expect(signInSchema.safeParse({ email: ["a@b.test"], password: { $gt: "" } }).success).toBe(
      false,
    );
  });

  it("never throws on arbitrary input", () => {
    fc.assert(fc.property(fc.anything(), (value) => void signInSchema.safeParse(value)));
  });
});
