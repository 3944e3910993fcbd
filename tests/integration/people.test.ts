// The People page's writes through their route handlers, against the real database: staff
// invitations (the homeowner invitations' table, token and outbox), the e-mail already in use,
// resend and withdraw, a replayed link; role changes (never the last active manager, never
// yourself out of managing), disabling (sessions end, no sign-in, no link), applicator licenses
// and the pesticide applications they gate, moving properties between technicians; audit rows;
// another company's ids → 404.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";
import { createAuthSession } from "@/lib/auth/mutations";
import { verifyPassword } from "@/lib/auth/password";
import { findActorBySession, findSignInCandidate } from "@/lib/auth/queries";
import { addDays, todayIn } from "@/lib/dates";
import { AppError } from "@/lib/http/app-error";
import { acceptInvitation, INVITATION_MESSAGES } from "@/lib/invitations/mutations";
import { viewInvitation } from "@/lib/invitations/queries";
import { PEOPLE_MESSAGES } from "@/lib/people/mutations";
import { getPeopleDirectory } from "@/lib/people/queries";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const invitationsRoute = await import("@/app/api/v1/people/invitations/route");
const invitationRoute = await import("@/app/api/v1/people/invitations/[invitationId]/route");
const resendRoute = await import("@/app/api/v1/people/invitations/[invitationId]/resend/route");
const personRoute = await import("@/app/api/v1/people/[personId]/route");
const licenseRoute = await import("@/app/api/v1/people/[personId]/license/route");
const reassignRoute = await import("@/app/api/v1/people/reassign/route");
const applicationsRoute = await import("@/app/api/v1/visits/[visitId]/applications/route");

let c: TestCompany;
let other: TestCompany;
let manager: Actor;
let tech1: Actor;
let otherManager: Actor;
const today = todayIn("America/New_York"); // the demo company's time zone

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [manager, tech1, otherManager] = await Promise.all([
    c.actor("manager"),
    c.actor("tech1"),
    other.actor("manager"),
  ]);
});

interface Answer {
  status: number;
  body: {
    error?: { code: string; message: string; fieldErrors?: Record<string, string[]> };
  } & Record<string, unknown>;
}

type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;

async function call(
  as: Actor | null,
  handler: Handler,
  method: string,
  params: Record<string, string> = {},
  body?: unknown,
  url = "http://localhost/api",
): Promise<Answer> {
  current = as;
  const res = await handler(
    new Request(url, {
      method,
      headers: { origin: "http://localhost:3000", "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    }),
    { params: Promise.resolve(params) },
  );
  return { status: res.status, body: (await res.json()) as Answer["body"] };
}

const email = () => `new-${randomUUID().slice(0, 8)}@test.sward.test`;

async function latestToken(to: string): Promise<string> {
  const mail = await testDb()
    .selectFrom("mail_outbox")
    .select(["text_body", "kind", "subject"])
    .where("to_address", "=", to)
    .orderBy("created_at", "desc")
    .orderBy("id", "desc")
    .limit(1)
    .executeTakeFirstOrThrow();
  expect(mail.kind).toBe("staff_invitation");
  const token = mail.text_body.match(/\/invitation\?token=([0-9a-f]{64})/)?.[1];
  if (!token) throw new Error(`no invitation link in the e-mail to ${to}`);
  return token;
}

async function refusal(p: Promise<unknown>): Promise<AppError> {
  try {
    await p;
  } catch (err) {
    if (err instanceof AppError) return err;
    throw err;
  }
  throw new Error("expected a refusal");
}

const audits = (entityId: string) =>
  testDb()
    .selectFrom("audit_events")
    .select(["action", "actor_id", "changes", "entity"])
    .where("entity_id", "=", entityId)
    .orderBy("id")
    .execute();

const PASSWORD = "fifteen-chars-or-more";

describe("staff invitations", () => {
  it("invites a technician by e-mail (outbox, audit); the link sets a password and makes a technician account, once", async () => {
    const to = email();
    const sent = await call(
      manager,
      invitationsRoute.POST as Handler,
      "POST",
      {},
      {
        email: to.toUpperCase(),
        name: "Rowan Tull",
        role: "technician",
      },
    );
    expect(sent.status).toBe(201);
    const invitation = sent.body.invitation as { id: string; role: string; email: string };
    expect(invitation).toMatchObject({ role: "technician", email: to });
    expect((await audits(invitation.id)).map((a) => a.action)).toEqual(["invite_staff"]);
    const token = await latestToken(to);
    const view = await viewInvitation(token);
    expect(view).toMatchObject({ state: "pending", role: "technician", account: "new" });

    // A password that misses the policy is refused and the link still works.
    await expect(acceptInvitation(token, { password: "short" })).rejects.toThrow();
    const accepted = await acceptInvitation(token, { name: "Rowan Tull", password: PASSWORD });
    expect(accepted).toMatchObject({ role: "technician", createdAccount: true });
    const candidate = await findSignInCandidate(to);
    expect(candidate?.role).toBe("technician");
    const user = await testDb()
      .selectFrom("users")
      .select("password_hash")
      .where("id", "=", accepted.userId)
      .executeTakeFirstOrThrow();
    expect(await verifyPassword(user.password_hash!, PASSWORD)).toBe(true);
    expect((await audits(accepted.userId)).map((a) => a.action)).toEqual(["join_staff"]);

    // Replayed: the link is used up.
    const replay = await refusal(acceptInvitation(token, { password: PASSWORD }));
    expect(replay.code).toBe("not_found");
    expect(replay.message).toBe(INVITATION_MESSAGES.unusable);
  });

  it("refuses an e-mail already in use, in words, and writes nothing", async () => {
    const before = await testDb()
      .selectFrom("mail_outbox")
      .select((eb) => eb.fn.countAll<number>().as("n"))
      .executeTakeFirstOrThrow();
    const res = await call(
      manager,
      invitationsRoute.POST as Handler,
      "POST",
      {},
      {
        email: c.emails["tech2"],
        name: "Someone",
        role: "manager",
      },
    );
    expect(res.status).toBe(409);
    expect(res.body.error?.message).toBe(INVITATION_MESSAGES.emailInUse);
    expect(res.body.error?.fieldErrors?.email?.[0]).toBe(INVITATION_MESSAGES.emailInUse);
    const after = await testDb()
      .selectFrom("mail_outbox")
      .select((eb) => eb.fn.countAll<number>().as("n"))
      .executeTakeFirstOrThrow();
    expect(Number(after.n)).toBe(Number(before.n));
  });

  it("refuses a bad role and a bad address with the field named", async () => {
    const res = await call(
      manager,
      invitationsRoute.POST as Handler,
      "POST",
      {},
      {
        email: "not-an-address",
        name: "X",
        role: "homeowner",
      },
    );
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error?.fieldErrors ?? {}).sort()).toEqual(["email", "role"]);
  });

  it("sending again makes a new link (the old one stops working); withdrawing kills the link", async () => {
    const to = email();
    const sent = await call(
      manager,
      invitationsRoute.POST as Handler,
      "POST",
      {},
      {
        email: to,
        name: "Ada Quill",
        role: "manager",
      },
    );
    const id = (sent.body.invitation as { id: string }).id;
    const first = await latestToken(to);
    const again = await call(manager, resendRoute.POST as Handler, "POST", { invitationId: id });
    expect(again.status).toBe(200);
    expect((again.body.invitation as { sendCount: number }).sendCount).toBe(2);
    const second = await latestToken(to);
    expect(second).not.toBe(first);
    expect((await viewInvitation(first)).state).toBe("unknown");
    expect((await refusal(acceptInvitation(first, { password: PASSWORD }))).code).toBe("not_found");

    const gone = await call(manager, invitationRoute.DELETE as Handler, "DELETE", {
      invitationId: id,
    });
    expect(gone.status).toBe(200);
    expect((await viewInvitation(second)).state).toBe("revoked");
    expect((await refusal(acceptInvitation(second, { password: PASSWORD }))).code).toBe(
      "not_found",
    );
    expect((await audits(id)).map((a) => a.action)).toEqual([
      "invite_staff",
      "resend_invitation",
      "revoke_invitation",
    ]);
  });

  it("another company's invitation is not found; a technician may not invite", async () => {
    const sent = await call(
      otherManager,
      invitationsRoute.POST as Handler,
      "POST",
      {},
      {
        email: email(),
        name: "Not Yours",
        role: "technician",
      },
    );
    const id = (sent.body.invitation as { id: string }).id;
    expect(
      (await call(manager, resendRoute.POST as Handler, "POST", { invitationId: id })).status,
    ).toBe(404);
    expect(
      (await call(manager, invitationRoute.DELETE as Handler, "DELETE", { invitationId: id }))
        .status,
    ).toBe(404);
    expect(
      (
        await call(
          tech1,
          invitationsRoute.POST as Handler,
          "POST",
          {},
          {
            email: email(),
            name: "X",
            role: "technician",
          },
        )
      ).status,
    ).toBe(403);
  });

  it("the People page lists the invitation as invited with its expiry", async () => {
    const to = email();
    await call(
      manager,
      invitationsRoute.POST as Handler,
      "POST",
      {},
      {
        email: to,
        name: "Listed Person",
        role: "technician",
      },
    );
    const directory = await getPeopleDirectory(manager);
    const listed = directory.invitations.find((i) => i.email === to);
    expect(listed).toMatchObject({ role: "technician", property: null, isExpired: false });
    // INVITATION_DAYS is 7: the expiry is a week out.
    expect(new Date(listed!.expiresAt).getTime() - Date.now()).toBeGreaterThan(6.9 * 86_400_000);
  });
});

describe("roles and disabling", () => {
  it("never takes yourself out of managing", async () => {
    const own = await call(
      manager,
      personRoute.PATCH as Handler,
      "PATCH",
      {
        personId: manager.userId,
      },
      { role: "technician" },
    );
    expect(own.status).toBe(409);
    expect(own.body.error?.message).toBe(PEOPLE_MESSAGES.notYourself);
    const self = await call(
      manager,
      personRoute.PATCH as Handler,
      "PATCH",
      {
        personId: manager.userId,
      },
      { disabled: true },
    );
    expect(self.status).toBe(409);
    const still = await findActorBySession(manager.sessionId);
    expect(still?.role).toBe("manager");
  });

  it("never the last active manager: two managers demoting each other at once, one wins, one is refused", async () => {
    const fresh = await createTestCompany();
    const a = await fresh.actor("manager");
    const promoted = await call(
      a,
      personRoute.PATCH as Handler,
      "PATCH",
      {
        personId: fresh.userIds["tech2"]!,
      },
      { role: "manager" },
    );
    expect(promoted.status).toBe(200);
    const b = await fresh.actor("tech2");
    expect(b.role).toBe("manager");
    expect((await audits(b.userId)).at(-1)).toMatchObject({
      action: "change_role",
      changes: { role: { from: "technician", to: "manager" } },
    });
    // Both requests hold their (manager) actor; the locks decide.
    const { changePerson } = await import("@/lib/people/mutations");
    const outcomes = await Promise.allSettled([
      changePerson(a, b.userId, { role: "technician" }),
      changePerson(b, a.userId, { disabled: true }),
    ]);
    expect(outcomes.map((o) => o.status).sort()).toEqual(["fulfilled", "rejected"]);
    const refused = outcomes.find((o) => o.status === "rejected") as PromiseRejectedResult;
    expect(refused.reason).toMatchObject({
      code: "conflict",
      message: PEOPLE_MESSAGES.lastManager,
    });
    const active = await testDb()
      .selectFrom("memberships")
      .innerJoin("users", "users.id", "memberships.user_id")
      .select("users.id")
      .where("memberships.company_id", "=", fresh.companyId)
      .where("memberships.role", "=", "manager")
      .where("users.disabled_at", "is", null)
      .execute();
    expect(active).toHaveLength(1);
  });

  it("disabling ends the person's sessions at once; they cannot sign in; re-enabling lets them back", async () => {
    const fresh = await createTestCompany();
    const boss = await fresh.actor("manager");
    const tech = await fresh.actor("tech1");
    const second = await createAuthSession(tech.userId, 3600);
    const res = await call(
      boss,
      personRoute.PATCH as Handler,
      "PATCH",
      { personId: tech.userId },
      {
        disabled: true,
      },
    );
    expect(res.status).toBe(200);
    expect(res.body.person).toEqual({ role: "technician", isDisabled: true });
    expect(await findActorBySession(tech.sessionId)).toBeUndefined();
    expect(await findActorBySession(second)).toBeUndefined();
    const sessions = await testDb()
      .selectFrom("auth_sessions")
      .select("id")
      .where("user_id", "=", tech.userId)
      .execute();
    expect(sessions).toEqual([]);
    expect((await findSignInCandidate(fresh.emails["tech1"]!))?.isDisabled).toBe(true);
    const audit = (await audits(tech.userId)).at(-1)!;
    expect(audit).toMatchObject({
      action: "disable",
      actor_id: boss.userId,
      changes: { disabled: { from: false, to: true } },
    });

    const back = await call(
      boss,
      personRoute.PATCH as Handler,
      "PATCH",
      { personId: tech.userId },
      {
        disabled: false,
      },
    );
    expect(back.body.person).toEqual({ role: "technician", isDisabled: false });
    expect((await findSignInCandidate(fresh.emails["tech1"]!))?.isDisabled).toBe(false);
  });

  it("a disabled homeowner cannot use an invitation link", async () => {
    const fresh = await createTestCompany();
    const boss = await fresh.actor("manager");
    const owner = fresh.emails["owner2"]!;
    const propertyId = fresh.propertyIds["kowalczyk"]!;
    const { POST } = await import("@/app/api/v1/properties/[propertyId]/invitations/route");
    current = boss;
    await POST(
      new Request("http://localhost/api", {
        method: "POST",
        headers: { origin: "http://localhost:3000", "content-type": "application/json" },
        body: JSON.stringify({ email: owner, name: "Samir Haddad" }),
      }),
      { params: Promise.resolve({ propertyId }) },
    );
    await call(
      boss,
      personRoute.PATCH as Handler,
      "PATCH",
      {
        personId: fresh.userIds["owner2"]!,
      },
      { disabled: true },
    );
    const mail = await testDb()
      .selectFrom("mail_outbox")
      .select("text_body")
      .where("to_address", "=", owner)
      .where("kind", "=", "homeowner_invitation")
      .executeTakeFirstOrThrow();
    const token = mail.text_body.match(/token=([0-9a-f]{64})/)![1]!;
    expect((await refusal(acceptInvitation(token, {}))).code).toBe("conflict");
  });

  it("another company's person is not found; a homeowner's role is not a staff role", async () => {
    const res = await call(
      manager,
      personRoute.PATCH as Handler,
      "PATCH",
      {
        personId: other.userIds["manager"]!,
      },
      { disabled: true },
    );
    expect(res.status).toBe(404);
    const owner = await call(
      manager,
      personRoute.PATCH as Handler,
      "PATCH",
      {
        personId: c.userIds["owner1"]!,
      },
      { role: "technician" },
    );
    expect(owner.status).toBe(422);
    expect(owner.body.error?.fieldErrors?.role?.[0]).toBe(PEOPLE_MESSAGES.staffOnly);
    expect(
      (
        await call(
          tech1,
          personRoute.PATCH as Handler,
          "PATCH",
          {
            personId: c.userIds["tech2"]!,
          },
          { disabled: true },
        )
      ).status,
    ).toBe(403);
  });
});

describe("applicator licenses", () => {
  it("records a license (audited), refuses a bad date and a non-technician, 404 for another company", async () => {
    const fresh = await createTestCompany();
    const boss = await fresh.actor("manager");
    const techId = fresh.userIds["tech1"]!;
    const set = await call(
      boss,
      licenseRoute.PUT as Handler,
      "PUT",
      { personId: techId },
      {
        number: "NJ-TEST-5501",
        category: "3B Turf",
        expiresOn: "2027-06-30",
      },
    );
    expect(set.status).toBe(200);
    const row = await testDb()
      .selectFrom("users")
      .select(["license_number", "license_category", "license_expires_on"])
      .where("id", "=", techId)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({
      license_number: "NJ-TEST-5501",
      license_category: "3B Turf",
      license_expires_on: "2027-06-30",
    });
    expect((await audits(techId)).at(-1)?.action).toBe("set_license");

    const bad = await call(
      boss,
      licenseRoute.PUT as Handler,
      "PUT",
      { personId: techId },
      {
        number: "X",
        category: "",
        expiresOn: "06/30/2027",
      },
    );
    expect(bad.status).toBe(422);
    expect(bad.body.error?.fieldErrors?.expiresOn?.[0]).toBe(
      "Expiry date: a date like 2027-03-31.",
    );
    const noDate = await call(
      boss,
      licenseRoute.PUT as Handler,
      "PUT",
      { personId: techId },
      {
        number: "X",
        category: "",
        expiresOn: "",
      },
    );
    expect(noDate.status).toBe(422);
    expect(noDate.body.error?.fieldErrors?.expiresOn).toBeDefined();
    const manager = await call(
      boss,
      licenseRoute.PUT as Handler,
      "PUT",
      {
        personId: boss.userId,
      },
      { number: "X", category: "", expiresOn: "2027-01-01" },
    );
    expect(manager.status).toBe(422);
    const foreign = await call(
      boss,
      licenseRoute.PUT as Handler,
      "PUT",
      {
        personId: other.userIds["manager"]!,
      },
      { number: "X", category: "", expiresOn: "2027-01-01" },
    );
    expect(foreign.status).toBe(404);
    // Nothing already saved was lost by the refusals.
    const still = await testDb()
      .selectFrom("users")
      .select("license_number")
      .where("id", "=", techId)
      .executeTakeFirstOrThrow();
    expect(still.license_number).toBe("NJ-TEST-5501");
  });

  it("the demo's licenses: one good, one inside the 30-day warning (dates relative to the seeding day)", async () => {
    const directory = await getPeopleDirectory(manager);
    const byKey = (key: string) => directory.people.find((p) => p.id === c.userIds[key]);
    expect(byKey("tech1")?.license).toMatchObject({ standing: "valid", number: "DEMO-CA-10482" });
    expect(byKey("tech2")?.license).toMatchObject({
      standing: "expiring",
      number: "DEMO-CA-22107",
      expiresOn: addDays(today, 18),
      daysLeft: 18,
    });
  });

  describe("pesticide applications by a technician", () => {
    let fresh: TestCompany;
    let tech: Actor;
    let zones: string[];
    let pesticide: string;
    let visitId: string;

    beforeAll(async () => {
      fresh = await createTestCompany();
      tech = await fresh.actor("tech1");
      zones = (
        await testDb()
          .selectFrom("zones")
          .select("id")
          .where("property_id", "=", fresh.propertyIds["haddad"]!)
          .orderBy("sort_order")
          .execute()
      ).map((z) => z.id);
      pesticide = (
        await testDb()
          .selectFrom("products")
          .select("id")
          .where("company_id", "=", fresh.companyId)
          .where("name", "like", "Grubward%")
          .executeTakeFirstOrThrow()
      ).id;
      visitId = randomUUID();
      // A visit in June 2025, clear of the demo season's own applications.
      await testDb()
        .insertInto("visits")
        .values({
          id: visitId,
          company_id: fresh.companyId,
          property_id: fresh.propertyIds["haddad"]!,
          technician_id: tech.userId,
          scheduled_for: "2025-06-20",
          planned_service: "insect_control",
          status: "in_progress",
          started_at: new Date("2025-06-20T13:00:00Z"),
          started_by: tech.userId,
        })
        .execute();
    });

    const record = (zoneId: string, at: string) =>
      call(
        tech,
        applicationsRoute.POST as Handler,
        "POST",
        { visitId },
        {
          id: randomUUID(),
          zoneId,
          productId: pesticide,
          rateAmount: 2,
          rateUnit: "lb/1000ft2",
          windMph: 4,
          temperatureF: 70,
          isEstablishing: false,
          applicatorName: "Luis Arroyo",
          applicatorLicence: "DEMO-CA-10482",
          overrideReason: null,
          appliedAt: at,
        },
      );
    const setLicense = (expiresOn: string, number = "NJ-TEST-77") =>
      testDb()
        .updateTable("users")
        .set({
          license_number: number,
          license_category: "",
          license_expires_on: expiresOn || null,
        })
        .where("id", "=", tech.userId)
        .execute();

    it("refuses one after the license expired (422 naming the license and its expiry)", async () => {
      await setLicense("2025-06-19");
      const res = await record(zones[0]!, "2025-06-20T10:00:00-04:00");
      expect(res.status).toBe(422);
      expect(res.body.error?.message).toBe(
        "Applicator license NJ-TEST-77 expired on Thu, Jun 19, 2025.",
      );
      expect(res.body.error?.fieldErrors?.applicatorLicence?.[0]).toContain("NJ-TEST-77");
    });

    it("refuses one with no license on record", async () => {
      await setLicense("", "");
      const res = await record(zones[0]!, "2025-06-20T10:00:00-04:00");
      expect(res.status).toBe(422);
      expect(res.body.error?.fieldErrors?.applicatorLicence?.[0]).toMatch(/none is on record/);
    });

    it("accepts one on the license's last day", async () => {
      await setLicense("2025-06-20");
      const res = await record(zones[1]!, "2025-06-20T10:30:00-04:00");
      expect(res.status).toBe(201);
    });
  });
});

describe("moving properties between technicians", () => {
  it("counts, then moves the properties and their future scheduled stops, not finished visits", async () => {
    const fresh = await createTestCompany();
    const boss = await fresh.actor("manager");
    const from = fresh.userIds["tech1"]!;
    const to = fresh.userIds["tech2"]!;
    const owned = await testDb()
      .selectFrom("properties")
      .select("id")
      .where("company_id", "=", fresh.companyId)
      .where("technician_id", "=", from)
      .execute();
    expect(owned.length).toBeGreaterThan(0);
    const propertyId = owned[0]!.id;
    const future = randomUUID();
    const past = randomUUID();
    await testDb()
      .insertInto("visits")
      .values([
        {
          id: future,
          company_id: fresh.companyId,
          property_id: propertyId,
          technician_id: from,
          scheduled_for: addDays(today, 9),
          planned_service: "feeding_round",
        },
        {
          id: past,
          company_id: fresh.companyId,
          property_id: propertyId,
          technician_id: from,
          scheduled_for: addDays(today, -40),
          planned_service: "feeding_round",
          status: "completed",
          started_at: new Date(`${addDays(today, -40)}T13:00:00Z`),
          started_by: from,
          completed_at: new Date(`${addDays(today, -40)}T14:00:00Z`),
          completed_by: from,
        },
      ])
      .execute();
    const expectedStops = await testDb()
      .selectFrom("visits")
      .select((eb) => eb.fn.countAll<number>().as("n"))
      .where("technician_id", "=", from)
      .where("status", "=", "scheduled")
      .where("scheduled_for", ">=", today)
      .where(
        "property_id",
        "in",
        owned.map((p) => p.id),
      )
      .executeTakeFirstOrThrow();
    const count = await call(
      boss,
      reassignRoute.GET as Handler,
      "GET",
      {},
      undefined,
      `http://localhost/api/v1/people/reassign?from=${from}`,
    );
    expect(count.status).toBe(200);
    expect(count.body).toEqual({ properties: owned.length, stops: Number(expectedStops.n) });

    const same = await call(
      boss,
      reassignRoute.POST as Handler,
      "POST",
      {},
      {
        fromTechnicianId: from,
        toTechnicianId: from,
      },
    );
    expect(same.status).toBe(422);
    expect(same.body.error?.fieldErrors?.toTechnicianId?.[0]).toBe(PEOPLE_MESSAGES.sameTechnician);

    const moved = await call(
      boss,
      reassignRoute.POST as Handler,
      "POST",
      {},
      {
        fromTechnicianId: from,
        toTechnicianId: to,
      },
    );
    expect(moved.status).toBe(200);
    expect(moved.body).toEqual(count.body);
    const visits = await testDb()
      .selectFrom("visits")
      .select(["id", "technician_id"])
      .where("id", "in", [future, past])
      .execute();
    expect(Object.fromEntries(visits.map((v) => [v.id, v.technician_id]))).toEqual({
      [future]: to,
      [past]: from,
    });
    const left = await testDb()
      .selectFrom("properties")
      .select("id")
      .where("technician_id", "=", from)
      .execute();
    expect(left).toEqual([]);
    // The book row shows the new technician at once (after-write in the same transaction).
    const summary = await testDb()
      .selectFrom("properties")
      .select("technician_id")
      .where("id", "=", propertyId)
      .executeTakeFirstOrThrow();
    expect(summary.technician_id).toBe(to);
    expect((await audits(propertyId)).at(-1)).toMatchObject({
      action: "reassign_technician",
      changes: { technician: { from, to } },
    });
  });

  it("another company's technician is not found", async () => {
    const res = await call(
      manager,
      reassignRoute.POST as Handler,
      "POST",
      {},
      {
        fromTechnicianId: other.userIds["manager"]!,
        toTechnicianId: c.userIds["tech2"]!,
      },
    );
    expect(res.status).toBe(404);
    const count = await call(
      manager,
      reassignRoute.GET as Handler,
      "GET",
      {},
      undefined,
      `http://localhost/api/v1/people/reassign?from=${other.userIds["manager"]!}`,
    );
    expect(count.status).toBe(404);
  });
});
