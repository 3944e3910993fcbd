// Retries: a phone on a poor connection sends the same submission again before the first answer
// arrives. Every create that carries a client id — zone checks, applications, waterings, visits —
// and a photo (identified by its content) is sent 3× at once through its route handler, 20
// submissions of each kind: each must leave exactly one row, and every answer must be a success
// naming that one row.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it, vi } from "vitest";

import type { Actor } from "@/lib/auth/actor";
import { addDays, todayIn } from "@/lib/dates";
import { saveZoneCheck } from "@/lib/visits/mutations";
import { emptyZoneCheck } from "@/lib/visits/schemas";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { lawnImage } from "../helpers/images";
import { doneCheck } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const SUBMISSIONS = 20;
let c: TestCompany;
let propertyId: string;
let zoneIds: string[];
let productId: string;
const totals: Record<
  string,
  { submissions: number; rows: number; duplicates: number; failures: number }
> = {};

type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;
const send = (
  handler: Handler,
  method: string,
  params: Record<string, string>,
  body: unknown,
  type = "application/json",
) =>
  handler(
    new Request("http://localhost/api", {
      method,
      body:
        body instanceof Uint8Array
          ? new Blob([body as Uint8Array<ArrayBuffer>])
          : JSON.stringify(body),
      headers: { origin: "http://localhost:3000", host: "localhost", "content-type": type },
    }),
    { params: Promise.resolve(params) },
  );

async function newVisit(): Promise<string> {
  const manager = await c.actor("manager");
  const { scheduleVisit } = await import("@/lib/visits/mutations");
  const id = randomUUID();
  await scheduleVisit(manager, {
    id,
    propertyId,
    scheduledFor: todayIn("America/New_York"),
    technicianId: c.userIds["tech1"]!,
    plannedService: "inspection",
    stopOrder: 0,
    notes: "",
    confirmSameDay: true,
  });
  return id;
}

/** Sends one submission three times at once; returns the ids the answers name and whether all succeeded. */
async function thrice(make: () => Promise<Response>): Promise<{ ids: Set<string>; ok: boolean }> {
  const responses = await Promise.all([make(), make(), make()]);
  const bodies = (await Promise.all(responses.map((r) => r.json()))) as { id?: string }[];
  return {
    ids: new Set(bodies.map((b) => b.id ?? "")),
    ok: responses.every((r) => r.status >= 200 && r.status < 300),
  };
}

beforeAll(async () => {
  c = await createTestCompany();
  propertyId = c.propertyIds["oyelaran"]!;
  zoneIds = (
    await testDb()
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", propertyId)
      .orderBy("sort_order")
      .execute()
  ).map((z) => z.id);
  // Today may fall in the rule set's winter blackout for fertiliser; retries are what is tested here.
  await testDb()
    .updateTable("properties")
    .set({ rule_set_id: null })
    .where("id", "=", propertyId)
    .execute();
  productId = (
    await testDb()
      .selectFrom("products")
      .select("id")
      .where("company_id", "=", c.companyId)
      .where("is_pesticide", "=", false)
      .orderBy("name")
      .executeTakeFirstOrThrow()
  ).id;
  // Twenty applications of one product on one zone would run into the label's yearly maximum and
  // re-treatment interval (the demo's history counts too, and it moves with the day the tests
  // run): the label rules have their own tests; here the product carries none.
  await testDb()
    .updateTable("products")
    .set({ label_max_rate: null, label_max_yearly: null, label_min_interval_days: null })
    .where("id", "=", productId)
    .execute();
});

describe("a submission sent three times at once", () => {
  it("zone checks (PUT by client id): one row each", async () => {
    current = await c.actor("tech1");
    const route =
      (await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/route")) as unknown as Record<
        string,
        Handler
      >;
    const t = (totals["zone checks"] = { submissions: 0, rows: 0, duplicates: 0, failures: 0 });
    for (let i = 0; i < SUBMISSIONS; i++) {
      const visitId = await newVisit();
      const id = randomUUID();
      const result = await thrice(() =>
        send(route.PUT!, "PUT", { visitId, zoneCheckId: id }, doneCheck(zoneIds[0]!)),
      );
      const rows = await testDb()
        .selectFrom("zone_checks")
        .select("id")
        .where("visit_id", "=", visitId)
        .execute();
      t.submissions++;
      t.rows += rows.length;
      t.duplicates += Math.max(0, rows.length - 1);
      if (!result.ok || result.ids.size !== 1 || !result.ids.has(id)) t.failures++;
    }
    expect(t).toMatchObject({ rows: SUBMISSIONS, duplicates: 0, failures: 0 });
  });

  it("applications, waterings and visits (POST with the client's id): one row each", async () => {
    const tech = await c.actor("tech1");
    const manager = await c.actor("manager");
    const applications =
      (await import("@/app/api/v1/visits/[visitId]/applications/route")) as unknown as Record<
        string,
        Handler
      >;
    const waterings =
      (await import("@/app/api/v1/properties/[propertyId]/waterings/route")) as unknown as Record<
        string,
        Handler
      >;
    const visits = (await import("@/app/api/v1/visits/route")) as unknown as Record<
      string,
      Handler
    >;
    const kinds: [
      string,
      Actor,
      (id: string, visitId: string) => Promise<Response>,
      (id: string) => Promise<number>,
    ][] = [
      [
        "applications",
        tech,
        (id, visitId) =>
          send(
            applications.POST!,
            "POST",
            { visitId },
            {
              id,
              zoneId: zoneIds[0],
              productId,
              rateAmount: 0.5,
              rateUnit: "lb/1000ft2",
              windMph: null,
              temperatureF: null,
              isEstablishing: false,
              applicatorName: "",
              applicatorLicence: "",
              overrideReason: null,
            },
          ),
        async (id) =>
          (await testDb().selectFrom("applications").select("id").where("id", "=", id).execute())
            .length,
      ],
      [
        "waterings",
        tech,
        (id) =>
          send(
            waterings.POST!,
            "POST",
            { propertyId },
            {
              id,
              zoneId: null,
              wateredOn: addDays(todayIn("America/New_York"), -1),
              depthIn: 0.5,
              runMinutes: null,
              precipitationRateInPerHour: null,
              notes: "",
            },
          ),
        async (id) =>
          (await testDb().selectFrom("waterings").select("id").where("id", "=", id).execute())
            .length,
      ],
      [
        "visits",
        manager,
        (id) =>
          send(
            visits.POST!,
            "POST",
            {},
            {
              id,
              propertyId,
              scheduledFor: addDays(todayIn("America/New_York"), 30),
              technicianId: null,
              plannedService: "inspection",
              confirmSameDay: true, // 20 visits at one property on one day, on purpose
            },
          ),
        async (id) =>
          (await testDb().selectFrom("visits").select("id").where("id", "=", id).execute()).length,
      ],
    ];
    for (const [kind, actor, make, count] of kinds) {
      current = actor;
      const t = (totals[kind] = { submissions: 0, rows: 0, duplicates: 0, failures: 0 });
      for (let i = 0; i < SUBMISSIONS; i++) {
        const visitId = kind === "applications" ? await newVisit() : "";
        if (kind === "applications")
          await saveZoneCheck(tech, visitId, randomUUID(), emptyZoneCheck(zoneIds[0]!)); // the visit is under way
        const id = randomUUID();
        const result = await thrice(() => make(id, visitId));
        const rows = await count(id);
        t.submissions++;
        t.rows += rows;
        t.duplicates += Math.max(0, rows - 1);
        if (!result.ok || result.ids.size !== 1 || !result.ids.has(id)) t.failures++;
      }
      expect(t, kind).toMatchObject({ rows: SUBMISSIONS, duplicates: 0, failures: 0 });
    }
  });

  it("photos (the same bytes on the same check): one row and one set of files each", async () => {
    current = await c.actor("tech1");
    const route =
      (await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/photos/route")) as unknown as Record<
        string,
        Handler
      >;
    const t = (totals["photos"] = { submissions: 0, rows: 0, duplicates: 0, failures: 0 });
    const visitId = await newVisit();
    const tech = await c.actor("tech1");
    const check = await saveZoneCheck(tech, visitId, randomUUID(), emptyZoneCheck(zoneIds[0]!));
    for (let i = 0; i < SUBMISSIONS; i++) {
      const bytes = new Uint8Array(await lawnImage(160, 120, 0.1 + i / 100, "jpeg", 100 + i));
      const result = await thrice(() =>
        send(route.POST!, "POST", { visitId, zoneCheckId: check.id }, bytes, "image/jpeg"),
      );
      t.submissions++;
      if (!result.ok || result.ids.size !== 1) t.failures++;
    }
    const rows = await testDb()
      .selectFrom("photos")
      .select(["id", "content_hash"])
      .where("zone_check_id", "=", check.id)
      .execute();
    t.rows = rows.length;
    t.duplicates = rows.length - new Set(rows.map((r) => r.content_hash)).size;
    expect(t).toMatchObject({ rows: SUBMISSIONS, duplicates: 0, failures: 0 });
  });

  it("prints the totals", () => {
    const all = Object.values(totals);
    console.log(
      `retries: ${all.reduce((s, t) => s + t.submissions, 0)} submissions × 3 at once → duplicates ${all.reduce((s, t) => s + t.duplicates, 0)}, failed answers ${all.reduce((s, t) => s + t.failures, 0)} (${Object.entries(
        totals,
      )
        .map(([k, t]) => `${k} ${t.rows} rows of ${t.submissions}`)
        .join(", ")})`,
    );
    expect(all.reduce((s, t) => s + t.duplicates + t.failures, 0)).toBe(0);
  });
});
