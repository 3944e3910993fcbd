// Sign-in throttling policy and the sign-in input schema.
import fc from "fast-check";
import { describe, expect, it } from "vitest";

import { signInSchema } from "@/lib/auth/schemas";
import { isThrottled, normaliseEmail } from "@/lib/auth/throttle";

const limits = {
  maxPerAccount: 5,
  maxPerAddress: 20,
  maxPerAccountAllAddresses: 50,
  windowMinutes: 15,
};
const none = { forAccountFromAddress: 0, fromAddress: 0, forAccount: 0, isKnownAddress: false };

describe("isThrottled", () => {
  it("throttles exactly at the limits", () => {
    expect(
      isThrottled({ ...none, forAccountFromAddress: 4, fromAddress: 19, forAccount: 49 }, limits),
    ).toBe(false);
    expect(isThrottled({ ...none, forAccountFromAddress: 5 }, limits)).toBe(true);
    expect(isThrottled({ ...none, fromAddress: 20 }, limits)).toBe(true);
    expect(isThrottled({ ...none, forAccount: 50 }, limits)).toBe(true);
  });

  it("the account-wide limit spares an address that signed in to the account before; the others do not", () => {
    expect(isThrottled({ ...none, forAccount: 500, isKnownAddress: true }, limits)).toBe(false);
    expect(isThrottled({ ...none, forAccountFromAddress: 5, isKnownAddress: true }, limits)).toBe(
      true,
    );
    expect(isThrottled({ ...none, fromAddress: 20, isKnownAddress: true }, limits)).toBe(true);
  });

  it("is monotone: more failures never un-throttle", () => {
    fc.assert(
      fc.property(
        fc.nat(100),
        fc.nat(100),
        fc.nat(100),
        fc.boolean(),
        fc.nat(10),
        fc.nat(10),
        fc.nat(10),
        (p, a, t, known, dp, da, dt) => {
          const before = {
            forAccountFromAddress: p,
            fromAddress: a,
            forAccount: t,
            isKnownAddress: known,
          };
          if (isThrottled(before, limits)) {
            const after = {
              forAccountFromAddress: p + dp,
              fromAddress: a + da,
              forAccount: t + dt,
              isKnownAddress: known,
            };
            expect(isThrottled(after, limits)).toBe(true);
          }
        },
      ),
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
