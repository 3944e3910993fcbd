// Sign-in and sessions against the real database: Argon2id verification, same answer for
// unknown e-mails, throttling per account and per address, and an actor that is re-read from
// the database on every request (disable, role change and sign-out apply at once).
import { sql } from "kysely";
import { beforeAll, describe, expect, it } from "vitest";

import { demoCompany } from "@/fixtures/demo/scenario";
import { seedCompany } from "@/fixtures/demo/seed-scenario";
import type { Actor } from "@/lib/auth/actor";
import { checkCredentials } from "@/lib/auth/credentials";
import { createAuthSession, deleteAuthSession } from "@/lib/auth/mutations";
import { findActorBySession } from "@/lib/auth/queries";
import { findHomeowner } from "@/lib/auth/sign-in-link";
import { unlinkHomeowner } from "@/lib/properties/mutations";

import { createTestCompany, TEST_PASSWORD, testDb, type TestCompany } from "../helpers/factories";

let company: TestCompany;

/** Puts a property–homeowner link back as the seed writes it. */
async function linkAgain(manager: Actor, propertyId: string, userId: string): Promise<void> {
  await testDb()
    .insertInto("property_homeowners")
    .values({ property_id: propertyId, user_id: userId, company_id: manager.companyId })
    .execute();
}
let address = 0;
/** A fresh client address per test, so per-address counts do not leak between tests. */
const nextAddress = () => `198.51.100.${++address}`; // RFC 5737 documentation range

beforeAll(async () => {
  company = await createTestCompany();
});

describe("checkCredentials", () => {
  it("accepts the right password, case-insensitive e-mail", async () => {
    const result = await checkCredentials({
      email: company.emails.tech1!.toUpperCase(),
      password: TEST_PASSWORD,
      address: nextAddress(),
    });
    expect(result).toEqual({ ok: true, userId: company.userIds.tech1 });
  });

  it("answers a wrong password and an unknown e-mail identically", async () => {
    const wrong = await checkCredentials({
      email: company.emails.tech2!,
      password: "nope-nope-nope",
      address: nextAddress(),
    });
    const unknown = await checkCredentials({
      email: "ghost@test.sward.test",
      password: TEST_PASSWORD,
      address: nextAddress(),
    });
    expect(wrong).toEqual({ ok: false, reason: "invalid" });
    expect(unknown).toEqual(wrong);
  });

  it("refuses a disabled account with the same answer", async () => {
    const c = await createTestCompany();
    await testDb()
      .updateTable("users")
      .set({ disabled_at: new Date() })
      .where("id", "=", c.userIds.owner2!)
      .execute();
    expect(
      await checkCredentials({
        email: c.emails.owner2!,
        password: TEST_PASSWORD,
        address: nextAddress(),
      }),
    ).toEqual({ ok: false, reason: "invalid" });
  });

  it("wrong passwords from one address lock that address out of the account after 5, not its owner", async () => {
    const c = await createTestCompany();
    const email = c.emails.owner3!;
    const guesser = nextAddress();
    const outcomes: string[] = [];
    for (let i = 0; i < 20; i++) {
      const r = await checkCredentials({ email, password: "wrong-guess-" + i, address: guesser });
      outcomes.push(r.ok ? "ok" : r.reason);
    }
    expect(outcomes.indexOf("throttled")).toBe(5); // SIGN_IN_MAX_PER_ACCOUNT in vitest.config.ts
    expect(outcomes.slice(5).every((o) => o === "throttled")).toBe(true);
    // Even the right password, from the guesser's address:
    expect(await checkCredentials({ email, password: TEST_PASSWORD, address: guesser })).toEqual({
      ok: false,
      reason: "throttled",
    });
    // The owner, from their own address, is not locked out.
    expect(
      await checkCredentials({ email, password: TEST_PASSWORD, address: nextAddress() }),
    ).toEqual({ ok: true, userId: c.userIds.owner3 });
  });

  it("100 wrong passwords for one account, each from a new address: refused after 50 account-wide, except from an address that signed in before", async () => {
    const c = await createTestCompany();
    const email = c.emails.owner3!;
    const home = nextAddress();
    expect((await checkCredentials({ email, password: TEST_PASSWORD, address: home })).ok).toBe(
      true,
    );
    const outcomes: string[] = [];
    for (let i = 0; i < 100; i++) {
      const r = await checkCredentials({
        email,
        password: "wrong-guess-" + i,
        address: nextAddress(),
      });
      outcomes.push(r.ok ? "ok" : r.reason);
    }
    const throttledFrom = outcomes.indexOf("throttled");
    expect(throttledFrom).toBe(50); // SIGN_IN_MAX_PER_ACCOUNT_ALL_ADDRESSES (default)
    expect(outcomes.slice(throttledFrom).every((o) => o === "throttled")).toBe(true);
    expect(outcomes).not.toContain("ok");
    // A new address is refused even with the right password; the owner's known address is not.
    expect(
      await checkCredentials({ email, password: TEST_PASSWORD, address: nextAddress() }),
    ).toEqual({ ok: false, reason: "throttled" });
    expect(await checkCredentials({ email, password: TEST_PASSWORD, address: home })).toEqual({
      ok: true,
      userId: c.userIds.owner3,
    });
    console.log(
      `throttle: 100 wrong passwords for one account (each from a new address): refused from attempt ${throttledFrom + 1} on; ${outcomes.filter((o) => o === "throttled").length} of 100 throttled, 0 accepted; the owner's known address still signs in`,
    );
  });

  it("throttles an unknown e-mail the same way (no hint that it does not exist)", async () => {
    const outcomes: string[] = [];
    const from = nextAddress();
    for (let i = 0; i < 6; i++) {
      const r = await checkCredentials({
        email: "nobody-here@test.sward.test",
        password: "x-" + i,
        address: from,
      });
      outcomes.push(r.ok ? "ok" : r.reason);
    }
    expect(outcomes.at(-1)).toBe("throttled");
    expect(outcomes.indexOf("throttled")).toBe(5);
  });

  it("100 wrong passwords from one address across 100 accounts: throttled after 20", async () => {
    const from = nextAddress();
    const outcomes: string[] = [];
    for (let i = 0; i < 100; i++) {
      const r = await checkCredentials({
        email: `spray-${i}@test.sward.test`,
        password: "x",
        address: from,
      });
      outcomes.push(r.ok ? "ok" : r.reason);
    }
    const throttledFrom = outcomes.indexOf("throttled");
    expect(throttledFrom).toBe(20); // SIGN_IN_MAX_PER_ADDRESS in vitest.config.ts
    expect(outcomes.slice(throttledFrom).every((o) => o === "throttled")).toBe(true);
    // The right password from that address is refused too; another address is unaffected.
    expect(
      await checkCredentials({
        email: company.emails.manager!,
        password: TEST_PASSWORD,
        address: from,
      }),
    ).toEqual({ ok: false, reason: "throttled" });
    expect(
      await checkCredentials({
        email: company.emails.manager!,
        password: TEST_PASSWORD,
        address: nextAddress(),
      }),
    ).toMatchObject({ ok: true });
    console.log(
      `throttle: 100 wrong passwords from one address across 100 e-mails: refused from attempt ${throttledFrom + 1} on; ${outcomes.filter((o) => o === "throttled").length} of 100 throttled`,
    );
  });

  it("failures older than the window no longer count", async () => {
    const c = await createTestCompany();
    const email = c.emails.tech2!;
    const from = nextAddress();
    for (let i = 0; i < 5; i++) await checkCredentials({ email, password: "bad", address: from });
    expect(await checkCredentials({ email, password: TEST_PASSWORD, address: from })).toEqual({
      ok: false,
      reason: "throttled",
    });
    await testDb()
      .updateTable("sign_in_attempts")
      .set({ attempted_at: sql<Date>`now() - interval '16 minutes'` })
      .where("email_key", "=", email)
      .execute();
    expect(await checkCredentials({ email, password: TEST_PASSWORD, address: from })).toMatchObject(
      { ok: true },
    );
  });

  it("timing does not reveal whether an e-mail exists", async () => {
    const time = async (email: string) => {
      const t = performance.now();
      await checkCredentials({ email, password: "wrong-password", address: nextAddress() });
      return performance.now() - t;
    };
    const known: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 16; i++) {
      const c = i % 2 ? company.emails.tech1! : company.emails.manager!;
      known.push(await time(c));
      unknown.push(await time(`unknown-${i}@test.sward.test`));
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
    const gap = Math.abs(median(known) - median(unknown));
    console.log(
      `timing: wrong password for an existing e-mail, median ${median(known).toFixed(1)} ms; for an unknown e-mail ${median(unknown).toFixed(1)} ms; median gap ${gap.toFixed(1)} ms (16 each)`,
    );
    // Both paths run one Argon2id verification (~tens of ms); a missing account must not be a fast path.
    expect(median(unknown)).toBeGreaterThan(median(known) * 0.5);
  });
});

describe("sessions and the actor", () => {
  it("resolves the actor with company and role from the database", async () => {
    const actor = await findActorBySession(await createAuthSession(company.userIds.tech1!, 60));
    expect(actor).toMatchObject({
      userId: company.userIds.tech1,
      companyId: company.companyId,
      role: "technician",
      companyName: company.scenario.name,
    });
  });

  it("a changed role applies on the next lookup", async () => {
    const c = await createTestCompany();
    const sid = await createAuthSession(c.userIds.tech2!, 60);
    expect((await findActorBySession(sid))?.role).toBe("technician");
    await testDb()
      .updateTable("memberships")
      .set({ role: "manager" })
      .where("user_id", "=", c.userIds.tech2!)
      .execute();
    expect((await findActorBySession(sid))?.role).toBe("manager");
  });

  it("a homeowner removed from every property can no longer sign in, by password or link, and their session ends", async () => {
    const c = await createTestCompany();
    const owner = c.userIds.owner1!;
    const sid = await createAuthSession(owner, 60);
    const signIn = () =>
      checkCredentials({
        email: c.emails.owner1!,
        password: TEST_PASSWORD,
        address: nextAddress(),
      });
    expect(await signIn()).toEqual({ ok: true, userId: owner });
    expect(await findHomeowner(c.emails.owner1!)).toBeDefined();

    const manager = await c.actor("manager");
    const linked = await testDb()
      .selectFrom("property_homeowners")
      .select("property_id")
      .where("user_id", "=", owner)
      .execute();
    expect(linked.length).toBeGreaterThan(0);
    for (const { property_id } of linked) await unlinkHomeowner(manager, property_id, owner);

    expect(await signIn()).toEqual({ ok: false, reason: "invalid" });
    expect(await findHomeowner(c.emails.owner1!)).toBeUndefined();
    expect(await findActorBySession(sid)).toBeUndefined();

    // Linked again, the same account works again.
    await linkAgain(manager, linked[0]!.property_id, owner);
    expect(await signIn()).toEqual({ ok: true, userId: owner });
  });

  it("a disabled user, a deleted (signed-out) session and an expired session resolve to nobody", async () => {
    const c = await createTestCompany();
    const disabledSid = await createAuthSession(c.userIds.owner1!, 60);
    await testDb()
      .updateTable("users")
      .set({ disabled_at: new Date() })
      .where("id", "=", c.userIds.owner1!)
      .execute();
    expect(await findActorBySession(disabledSid)).toBeUndefined();

    const signedOut = await createAuthSession(c.userIds.manager!, 60);
    await deleteAuthSession(signedOut);
    expect(await findActorBySession(signedOut)).toBeUndefined();

    const expired = await createAuthSession(c.userIds.tech1!, 60);
    await testDb()
      .updateTable("auth_sessions")
      .set({ expires_at: new Date(Date.now() - 1000) })
      .where("id", "=", expired)
      .execute();
    expect(await findActorBySession(expired)).toBeUndefined();
  });

  it("stores Argon2id hashes at or above the OWASP minimum (19 MiB, t=2, p=1)", async () => {
    // Source: OWASP Password Storage Cheat Sheet, Argon2id minimum configuration.
    const row = await testDb()
      .selectFrom("users")
      .select("password_hash")
      .where("id", "=", company.userIds.manager!)
      .executeTakeFirstOrThrow();
    const match = /^\$argon2id\$v=19\$m=(\d+),t=(\d+),p=(\d+)\$/.exec(row.password_hash ?? "");
    expect(match).not.toBeNull();
    const [, m, t, p] = match!.map(Number);
    expect(m).toBeGreaterThanOrEqual(19_456);
    expect(t).toBeGreaterThanOrEqual(2);
    expect(p).toBeGreaterThanOrEqual(1);
    console.log(`passwords: argon2id m=${m} KiB, t=${t}, p=${p} (OWASP minimum m=19456, t=2, p=1)`);
  });
});

describe("setting a password", () => {
  it("the seed refuses a password under 15 characters (NIST SP 800-63B-4 §3.1.1.2) and writes nothing", async () => {
    const slug = `t-short-${address}-${Date.now()}`;
    const scenario = {
      ...demoCompany,
      slug,
      people: demoCompany.people.map((p) => ({ ...p, email: `${p.key}.${slug}@test.sward.test` })),
    };
    await expect(seedCompany(testDb(), scenario, "fourteen-chars")).rejects.toMatchObject({
      code: "invalid_input",
      message:
        "Choose a password of at least 15 characters. A few unrelated words make a good one.",
    });
    const written = await testDb()
      .selectFrom("companies")
      .select("id")
      .where("slug", "=", slug)
      .execute();
    expect(written).toEqual([]);
  });
});
