// Homeowner invitations against the real database (issue: companies could probe which e-mail
// addresses have accounts — linking answered 422 "cannot be linked" for an address with an account
// anywhere and 200 for a new one, which then belonged to that company for good).
//
// What is checked: the manager's answer — its status, its body, the rows it writes and the SQL it
// runs — is the same for a new address, this company's homeowner, this company's technician,
// another company's homeowner and another company's manager; nothing is linked until the person
// confirms from the e-mailed link; another company's account is neither joined nor named to the
// manager; tokens are stored hashed, work once, expire, and die when withdrawn or sent again.
//
// Timing: instead of timing requests (noisy on a shared machine), the test records every SQL
// statement the invite runs through the app's own database handle (a Kysely log hook, as
// zone-check-save-cost.test.ts does) and requires the same statements, in the same order, for
// every kind of address — and that none of them reads `users` or `memberships`. Equal work is
// what makes the response time independent of the address.
import { createHash } from "node:crypto";
import { Kysely, PostgresDialect, sql } from "kysely";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

import type { Database } from "@/db/schema";
import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";
import { verifyPassword } from "@/lib/auth/password";
import { AppError } from "@/lib/http/app-error";
import { acceptInvitation, INVITATION_MESSAGES } from "@/lib/invitations/mutations";
import { listPendingInvitations, viewInvitation } from "@/lib/invitations/queries";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { invitationTokenFor } from "../helpers/invitations";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
vi.mock("next/headers", () => ({
  headers: async () => new Headers({ "x-forwarded-for": "198.51.100.78" }),
  cookies: async () => ({ get: () => undefined }),
}));

const statements: string[] = [];
let recording = false;
const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
const counted = new Kysely<Database>({
  dialect: new PostgresDialect({ pool }),
  log: (event) => {
    if (recording && event.level === "query") statements.push(event.query.sql);
  },
});
const globalForDb = globalThis as unknown as { swardDb?: Kysely<Database> };

let main: TestCompany;
let other: TestCompany;
let manager: Actor;
let propertyId: string; // a property of main with none of the people below linked
let otherOwnerEmail: string; // a homeowner of the other company

const HEADERS = { origin: "http://localhost:3000", "content-type": "application/json" };
const withParams = (params: Record<string, string>) => ({ params: Promise.resolve(params) });

async function routes() {
  return {
    list: await import("@/app/api/v1/properties/[propertyId]/invitations/route"),
    one: await import("@/app/api/v1/properties/[propertyId]/invitations/[invitationId]/route"),
    resend:
      await import("@/app/api/v1/properties/[propertyId]/invitations/[invitationId]/resend/route"),
  };
}

async function invite(email: string, name = "Pat Lee", as: Actor = manager, property = propertyId) {
  current = as;
  const { list } = await routes();
  const res = await list.POST(
    new Request("http://localhost/api", {
      method: "POST",
      headers: HEADERS,
      body: JSON.stringify({ email, name }),
    }),
    withParams({ propertyId: property }),
  );
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}

const invitationsTo = (email: string, property = propertyId) =>
  testDb()
    .selectFrom("homeowner_invitations")
    .selectAll()
    .where("email", "=", email)
    .where("property_id", "=", property)
    .orderBy("created_at")
    .execute();

const linked = async (userEmail: string, property = propertyId) =>
  Boolean(
    await testDb()
      .selectFrom("property_homeowners as ph")
      .innerJoin("users", "users.id", "ph.user_id")
      .select("ph.user_id")
      .where("users.email", "=", userEmail)
      .where("ph.property_id", "=", property)
      .executeTakeFirst(),
  );

async function refusal(p: Promise<unknown>): Promise<AppError> {
  try {
    await p;
  } catch (err) {
    if (err instanceof AppError) return err;
    throw err;
  }
  throw new Error("expected a refusal");
}

beforeAll(async () => {
  [main, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  manager = await main.actor("manager");
  const free = await testDb()
    .selectFrom("properties")
    .select("id")
    .where("company_id", "=", main.companyId)
    .where("archived_at", "is", null)
    .where((eb) =>
      eb.not(
        eb.exists(
          eb
            .selectFrom("property_homeowners")
            .select("user_id")
            .whereRef("property_homeowners.property_id", "=", "properties.id"),
        ),
      ),
    )
    .orderBy("name")
    .executeTakeFirst();
  propertyId = free?.id ?? main.propertyIds["kowalczyk"]!;
  // The other company gets a homeowner of its own, through its own invitation.
  otherOwnerEmail = `other-owner-${main.companyId.slice(0, 6)}@test.sward.test`;
  const otherManager = await other.actor("manager");
  expect(
    (await invite(otherOwnerEmail, "Ingrid Aaland", otherManager, other.propertyIds["aaland"]!))
      .status,
  ).toBe(201);
  await acceptInvitation(await invitationTokenFor(testDb(), otherOwnerEmail), {
    password: "another-company-homeowner-pass",
  });
  globalForDb.swardDb = counted;
});
afterAll(async () => {
  delete globalForDb.swardDb;
  await counted.destroy();
});

describe("inviting: the same answer and the same work for every address", () => {
  it("a new address, this company's homeowner and technician, another company's homeowner and manager", async () => {
    const addresses = {
      new: `new-neighbour-${main.companyId.slice(0, 6)}@test.sward.test`,
      ownHomeowner: main.emails["owner1"]!,
      ownTechnician: main.emails["tech1"]!,
      otherHomeowner: otherOwnerEmail,
      otherManager: other.emails["manager"]!,
    };
    const usersBefore = await testDb()
      .selectFrom("users")
      .select((eb) => eb.fn.countAll<number>().as("n"))
      .executeTakeFirstOrThrow();
    const seen: Record<string, unknown> = {};
    for (const [kind, email] of Object.entries(addresses)) {
      statements.length = 0;
      recording = true;
      const { status, body } = await invite(email);
      recording = false;
      const inv = body.invitation as Record<string, unknown>;
      const rows = await invitationsTo(email);
      const mail = await testDb()
        .selectFrom("mail_outbox")
        .select(["kind", "subject", "text_body", "html_body", "status"])
        .where("to_address", "=", email)
        .where("kind", "=", "homeowner_invitation")
        .where("company_id", "=", main.companyId)
        .execute();
      const audit = await testDb()
        .selectFrom("audit_events")
        .select(["entity", "action", "changes"])
        .where("company_id", "=", main.companyId)
        .where("entity_id", "=", propertyId)
        .where("action", "=", "invite_homeowner")
        .where(sql<boolean>`changes ->> 'invitation' like ${`%${email}%`}`)
        .execute();
      const mask = (s: string) =>
        s.replace(/token=[0-9a-f]{64}/g, "token=…").replaceAll(email, "<address>");
      seen[kind] = {
        status,
        keys: Object.keys(body),
        invitation: {
          ...inv,
          id: typeof inv.id,
          email: inv.email === email,
          sentAt: typeof inv.sentAt,
          expiresAt: typeof inv.expiresAt,
        },
        rows: rows.map((r) => ({
          pending: r.accepted_at === null && r.revoked_at === null,
          sends: r.send_count,
          hashLength: r.token_hash.length,
        })),
        mail: mail.map((m) => ({
          ...m,
          text_body: mask(m.text_body),
          html_body: mask(m.html_body),
        })),
        audit: audit.length,
        statements: [...statements],
      };
      expect(statements.length).toBeGreaterThan(0);
      for (const s of statements) expect(s).not.toMatch(/"users"|"memberships"/);
    }
    const [first, ...rest] = Object.values(seen);
    for (const [i, s] of rest.entries())
      expect(s, `${Object.keys(seen)[i + 1]} differs from a new address`).toEqual(first);
    expect(first).toMatchObject({ status: 201, keys: ["invitation"], audit: 1 });
    console.log(
      `invitations: ${Object.keys(addresses).length} kinds of address → the same status, body, rows, e-mail and ${(first as { statements: string[] }).statements.length} SQL statements (none reads users or memberships)`,
    );
    // Nothing was linked, no account was made or joined.
    for (const email of Object.values(addresses)) expect(await linked(email)).toBe(false);
    const usersAfter = await testDb()
      .selectFrom("users")
      .select((eb) => eb.fn.countAll<number>().as("n"))
      .executeTakeFirstOrThrow();
    expect(usersAfter.n).toBe(usersBefore.n);
  });

  it("the token is stored hashed (sha256 of the token and AUTH_SECRET), never as sent", async () => {
    const email = `hashed-${main.companyId.slice(0, 6)}@test.sward.test`;
    await invite(email);
    const token = await invitationTokenFor(testDb(), email);
    const [row] = await invitationsTo(email);
    expect(row!.token_hash).not.toContain(token);
    expect(row!.token_hash).toBe(
      createHash("sha256").update(`${token}${process.env.AUTH_SECRET}`).digest("hex"),
    );
    expect(row!.expires_at.getTime() - Date.now()).toBeGreaterThan(6.9 * 86_400_000);
  });

  it("is for managers of the property's company: technicians 403, homeowners 403, another company 404", async () => {
    const email = `scope-${main.companyId.slice(0, 6)}@test.sward.test`;
    expect((await invite(email, "N", await main.actor("tech1"))).status).toBe(403);
    expect((await invite(email, "N", await main.actor("owner1"))).status).toBe(403);
    expect((await invite(email, "N", await other.actor("manager"))).status).toBe(404);
    expect(await invitationsTo(email)).toEqual([]);
  });
});

describe("accepting", () => {
  it("a new address: a password that meets the policy makes a homeowner account of this company, then links", async () => {
    const email = `accept-new-${main.companyId.slice(0, 6)}@test.sward.test`;
    await invite(email, "Rosa Delgado");
    const token = await invitationTokenFor(testDb(), email);
    expect(await viewInvitation(token)).toMatchObject({ state: "pending", account: "new" });
    // Too short (lib/auth/password.ts: 15 characters): refused, nothing written, still pending.
    const short = await refusal(acceptInvitation(token, { password: "short-pass" }));
    expect(short.code).toBe("invalid_input");
    expect(short.fieldErrors?.password?.[0]).toMatch(/at least 15 characters/);
    expect(await refusal(acceptInvitation(token, {}))).toMatchObject({ code: "invalid_input" });
    expect((await invitationsTo(email))[0]!.accepted_at).toBeNull();
    expect(await linked(email)).toBe(false);

    const accepted = await acceptInvitation(token, {
      name: "Rosa Delgado-Ruiz",
      password: "three unrelated garden words",
    });
    expect(accepted.createdAccount).toBe(true);
    const user = await testDb()
      .selectFrom("users")
      .innerJoin("memberships", "memberships.user_id", "users.id")
      .select([
        "users.name",
        "users.password_hash",
        "users.email_verified",
        "memberships.company_id",
        "memberships.role",
      ])
      .where("users.email", "=", email)
      .executeTakeFirstOrThrow();
    expect(user).toMatchObject({
      name: "Rosa Delgado-Ruiz",
      company_id: main.companyId,
      role: "homeowner",
    });
    expect(user.email_verified).toBeInstanceOf(Date);
    expect(await verifyPassword(user.password_hash!, "three unrelated garden words")).toBe(true);
    expect(await linked(email)).toBe(true);
    const [row] = await invitationsTo(email);
    expect(row!.accepted_at).toBeInstanceOf(Date);
    expect(row!.accepted_user_id).toBe(accepted.userId);
    // Audited: the link, by the person who accepted, with the address and the invitation.
    const audit = await testDb()
      .selectFrom("audit_events")
      .select(["actor_id", "action", "changes"])
      .where("entity_id", "=", propertyId)
      .where("action", "=", "link_homeowner")
      .where("actor_id", "=", accepted.userId)
      .executeTakeFirstOrThrow();
    expect(audit.changes).toMatchObject({
      homeowner: { from: null, to: email },
      invitation: { from: row!.id, to: "new account" },
    });
    // Off the manager's pending list.
    expect((await listPendingInvitations(manager, propertyId)).map((i) => i.email)).not.toContain(
      email,
    );
  });

  it("this company's homeowner: linked on confirmation, no new account, password untouched", async () => {
    const email = main.emails["owner2"]!;
    const before = await testDb()
      .selectFrom("users")
      .select(["id", "password_hash"])
      .where("email", "=", email)
      .executeTakeFirstOrThrow();
    await invite(email, "Samir Haddad");
    expect(await linked(email)).toBe(false); // not before confirming
    const token = await invitationTokenFor(testDb(), email);
    expect(await viewInvitation(token)).toMatchObject({ state: "pending", account: "homeowner" });
    const accepted = await acceptInvitation(token, { password: "ignored-for-existing-accounts" });
    expect(accepted).toMatchObject({ createdAccount: false, userId: before.id });
    expect(await linked(email)).toBe(true);
    const after = await testDb()
      .selectFrom("users")
      .select(["id", "password_hash"])
      .where("email", "=", email)
      .executeTakeFirstOrThrow();
    expect(after).toEqual(before);
  });

  it("another company's homeowner or manager, or this company's technician: neither joined nor linked, the invitation stays pending as if ignored", async () => {
    for (const email of [otherOwnerEmail, other.emails["manager"]!, main.emails["tech1"]!]) {
      const token = await invitationTokenFor(testDb(), email);
      expect(await viewInvitation(token)).toMatchObject({
        state: "pending",
        account: "unavailable",
      });
      const membershipBefore = await testDb()
        .selectFrom("memberships")
        .innerJoin("users", "users.id", "memberships.user_id")
        .select(["memberships.company_id", "memberships.role"])
        .where("users.email", "=", email)
        .executeTakeFirstOrThrow();
      const err = await refusal(acceptInvitation(token, { password: "a password long enough" }));
      expect(err.code).toBe("conflict");
      expect(err.message).toBe(INVITATION_MESSAGES.unavailable);
      expect(await linked(email)).toBe(false);
      const membershipAfter = await testDb()
        .selectFrom("memberships")
        .innerJoin("users", "users.id", "memberships.user_id")
        .select(["memberships.company_id", "memberships.role"])
        .where("users.email", "=", email)
        .executeTakeFirstOrThrow();
      expect(membershipAfter).toEqual(membershipBefore);
      const [row] = await invitationsTo(email);
      expect(row).toMatchObject({ accepted_at: null, revoked_at: null, accepted_user_id: null });
      // What the manager sees is what an ignored invitation looks like.
      const pending = (await listPendingInvitations(manager, propertyId)).find(
        (i) => i.email === email,
      );
      expect(pending).toMatchObject({ email, isExpired: false, sendCount: 1 });
    }
  });

  it("an unknown token, a malformed one: the same plain refusal", async () => {
    for (const token of ["0".repeat(64), "f".repeat(64)]) {
      expect(await viewInvitation(token)).toEqual({ state: "unknown" });
      const err = await refusal(acceptInvitation(token, { password: "a password long enough" }));
      expect(err).toMatchObject({ code: "not_found", message: INVITATION_MESSAGES.unusable });
    }
    expect(await viewInvitation("not-a-token")).toEqual({ state: "unknown" });
  });
});

describe("tokens: single use, expiry, withdrawal, sending again", () => {
  it("works once, even when confirmed five times at the same moment", async () => {
    const email = `race-${main.companyId.slice(0, 6)}@test.sward.test`;
    await invite(email);
    const token = await invitationTokenFor(testDb(), email);
    const results = await Promise.allSettled(
      Array.from({ length: 5 }, () =>
        acceptInvitation(token, { password: "five clicks at one moment" }),
      ),
    );
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    for (const r of results.filter((x) => x.status === "rejected"))
      expect((r as PromiseRejectedResult).reason).toMatchObject({
        message: INVITATION_MESSAGES.unusable,
      });
    expect(await viewInvitation(token)).toMatchObject({ state: "accepted" });
    const users = await testDb()
      .selectFrom("users")
      .select("id")
      .where("email", "=", email)
      .execute();
    expect(users).toHaveLength(1);
    // Used: a later confirmation finds nothing.
    expect(
      await refusal(acceptInvitation(token, { password: "five clicks at one moment" })),
    ).toMatchObject({ code: "not_found" });
  });

  it("expired: refused, shown as expired; the manager sees it marked and can send it again", async () => {
    const email = `expired-${main.companyId.slice(0, 6)}@test.sward.test`;
    const { body } = await invite(email);
    const id = (body.invitation as { id: string }).id;
    const token = await invitationTokenFor(testDb(), email);
    await testDb()
      .updateTable("homeowner_invitations")
      .set({ expires_at: new Date(Date.now() - 60_000) })
      .where("id", "=", id)
      .execute();
    expect(await viewInvitation(token)).toMatchObject({ state: "expired" });
    expect(
      await refusal(acceptInvitation(token, { password: "an expired link's password" })),
    ).toMatchObject({ code: "not_found", message: INVITATION_MESSAGES.unusable });
    expect(await linked(email)).toBe(false);
    const listed = (await listPendingInvitations(manager, propertyId)).find((i) => i.id === id);
    expect(listed?.isExpired).toBe(true);

    current = manager;
    const { resend } = await routes();
    const res = await resend.POST(
      new Request("http://localhost/api", { method: "POST", headers: HEADERS }),
      withParams({ propertyId, invitationId: id }),
    );
    expect(res.status).toBe(200);
    const resent = ((await res.json()) as { invitation: { isExpired: boolean; sendCount: number } })
      .invitation;
    expect(resent).toMatchObject({ isExpired: false, sendCount: 2 });
    const fresh = await invitationTokenFor(testDb(), email);
    expect(fresh).not.toBe(token);
    expect(await viewInvitation(token)).toEqual({ state: "unknown" }); // the old link is dead
    expect((await acceptInvitation(fresh, { password: "the new link's password" })).email).toBe(
      email,
    );
  });

  it("withdrawn: the link stops working at once; withdrawing twice or another company's is 404", async () => {
    const email = `revoked-${main.companyId.slice(0, 6)}@test.sward.test`;
    const { body } = await invite(email);
    const id = (body.invitation as { id: string }).id;
    const token = await invitationTokenFor(testDb(), email);
    const { one } = await routes();
    const del = (as: Actor) => {
      current = as;
      return one.DELETE(
        new Request("http://localhost/api", { method: "DELETE", headers: HEADERS }),
        withParams({ propertyId, invitationId: id }),
      );
    };
    expect((await del(await other.actor("manager"))).status).toBe(404);
    expect((await del(await main.actor("tech1"))).status).toBe(403);
    expect((await del(manager)).status).toBe(200);
    expect((await del(manager)).status).toBe(404);
    expect(await viewInvitation(token)).toMatchObject({ state: "revoked" });
    expect(
      await refusal(acceptInvitation(token, { password: "a withdrawn link's password" })),
    ).toMatchObject({ code: "not_found" });
    expect(await linked(email)).toBe(false);
    const actions = await testDb()
      .selectFrom("audit_events")
      .select("action")
      .where("entity_id", "=", propertyId)
      .where(sql<boolean>`changes ->> 'invitation' like ${`%${id}%`}`)
      .orderBy("created_at")
      .execute();
    expect(actions.map((a) => a.action)).toEqual(["invite_homeowner", "revoke_invitation"]);
  });

  it("inviting the same address again replaces the link: one pending invitation, the old link dead", async () => {
    const email = `twice-${main.companyId.slice(0, 6)}@test.sward.test`;
    await invite(email, "First Name");
    const first = await invitationTokenFor(testDb(), email);
    await new Promise((r) => setTimeout(r, 5)); // the outbox rows' created_at differ
    await invite(email, "Second Name");
    const second = await invitationTokenFor(testDb(), email);
    expect(second).not.toBe(first);
    const rows = await invitationsTo(email);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ name: "Second Name", send_count: 2 });
    expect(await viewInvitation(first)).toEqual({ state: "unknown" });
    expect(await viewInvitation(second)).toMatchObject({ state: "pending" });
  });
});

describe("the pending list (GET /api/v1/properties/:id/invitations)", () => {
  it("managers of the company see pending ones only; technicians 403; another company 404", async () => {
    const { list } = await routes();
    const get = async (as: Actor, property = propertyId) => {
      current = as;
      return list.GET(new Request("http://localhost/api"), withParams({ propertyId: property }));
    };
    const res = await get(manager);
    expect(res.status).toBe(200);
    const { invitations } = (await res.json()) as { invitations: { email: string }[] };
    const emails = invitations.map((i) => i.email);
    expect(emails).toContain(main.emails["tech1"]);
    expect(emails).not.toContain(main.emails["owner2"]); // accepted
    expect(emails.some((e) => e.startsWith("revoked-"))).toBe(false); // withdrawn
    expect((await get(await main.actor("tech1"))).status).toBe(403);
    expect((await get(await other.actor("manager"))).status).toBe(404);
  });
});

describe("the confirmation action", () => {
  it("an unusable token is an error state in words; an existing account goes on to sign in", async () => {
    const { acceptInvitationAction } = await import("@/lib/invitations/actions");
    current = null;
    const form = (fields: Record<string, string>) => {
      const f = new FormData();
      for (const [k, v] of Object.entries(fields)) f.set(k, v);
      return f;
    };
    const state = await acceptInvitationAction(
      { name: "" },
      form({ token: "0".repeat(64), name: "X", password: "a password long enough" }),
    );
    expect(state.error).toBe(INVITATION_MESSAGES.unusable);

    const email = main.emails["owner3"]!;
    await invite(email, "Elena Brandvold");
    const token = await invitationTokenFor(testDb(), email);
    current = null;
    const redirect = await acceptInvitationAction({ name: "" }, form({ token })).then(
      () => null,
      (err: unknown) => err as { digest?: string },
    );
    expect(redirect?.digest).toMatch(/NEXT_REDIRECT.*\/sign-in\?callbackUrl=%2Fmy-lawn/);
    expect(await linked(email)).toBe(true);
  });
});
