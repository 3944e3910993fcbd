// State changes that race, sent at once through the real route handlers: finishing a visit while
// applications and photos-free writes arrive, several managers resolving one alert, and a
// property reassigned while its visit is being finished. Each case states the invariant that
// must hold whatever the interleaving; each runs several rounds.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { evaluateProperty } from "@/lib/after-write/sweep";
import type { Actor } from "@/lib/auth/actor";
import { listProducts } from "@/lib/products/queries";
import { saveZoneCheck, scheduleVisit, startVisit } from "@/lib/visits/mutations";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { doneCheck } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const finishRoute = await import("@/app/api/v1/visits/[visitId]/finish/route");
const applicationsRoute = await import("@/app/api/v1/visits/[visitId]/applications/route");
const zoneCheckRoute =
  await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/route");
const resolveRoute = await import("@/app/api/v1/alerts/[alertId]/resolve/route");
const propertyRoute = await import("@/app/api/v1/properties/[propertyId]/route");

let c: TestCompany;
beforeAll(async () => {
  c = await createTestCompany();
  // No rule set on the test lawns and no label limits on the products: these cases are about
  // order, not about legal limits (sixteen feedings of one zone, on top of the demo's history that
  // moves with the day the tests run, would reach the label's yearly maximum).
  await testDb()
    .updateTable("properties")
    .set({ rule_set_id: null })
    .where("company_id", "=", c.companyId)
    .execute();
  await testDb()
    .updateTable("products")
    .set({ label_max_rate: null, label_max_yearly: null, label_min_interval_days: null })
    .where("company_id", "=", c.companyId)
    .execute();
});

const json = (method: string, body: unknown) =>
  new Request("http://localhost/api", {
    method,
    body: JSON.stringify(body),
    headers: {
      origin: "http://localhost:3000",
      host: "localhost",
      "content-type": "application/json",
    },
  });
const ctx = (params: Record<string, string>) => ({ params: Promise.resolve(params) });

/** Sends each request as `who` (the session is read when the handler starts), all at once. */
function as(who: Actor, send: () => Promise<Response>): Promise<Response> {
  current = who;
  return send();
}

/** A visit of tech1 at the property, started, with every zone checked: ready to finish. */
async function readyVisit(propertyKey: string): Promise<{ visitId: string; zoneIds: string[] }> {
  const tech = await c.actor("tech1");
  const manager = await c.actor("manager");
  const visit = await scheduleVisit(manager, {
    id: randomUUID(),
    propertyId: c.propertyIds[propertyKey]!,
    scheduledFor: new Date().toISOString().slice(0, 10),
    technicianId: c.userIds["tech1"]!,
    plannedService: "inspection",
    stopOrder: 0,
    notes: "",
    confirmSameDay: true,
  });
  await startVisit(tech, visit.id, { latitude: null, longitude: null });
  const zones = await testDb()
    .selectFrom("zones")
    .select("id")
    .where("property_id", "=", c.propertyIds[propertyKey]!)
    .where("archived_at", "is", null)
    .execute();
  for (const z of zones) await saveZoneCheck(tech, visit.id, randomUUID(), doneCheck(z.id));
  return { visitId: visit.id, zoneIds: zones.map((z) => z.id) };
}

describe("finish vs write", () => {
  it("five finishes and four applications at once: no application is stored after the visit was finished", async () => {
    const tech = await c.actor("tech1");
    const feed = (await listProducts(tech)).find((p) => !p.isPesticide)!;
    let refusedTotal = 0;
    for (let round = 0; round < 4; round++) {
      const { visitId, zoneIds } = await readyVisit("oyelaran");
      const appIds = [0, 1, 2, 3].map(() => randomUUID());
      const sends = [
        ...[0, 1, 2, 3, 4].map(() =>
          as(tech, () => finishRoute.POST(json("POST", {}), ctx({ visitId }))),
        ),
        ...appIds.map((id) =>
          as(tech, () =>
            applicationsRoute.POST(
              json("POST", {
                id,
                zoneId: zoneIds[0],
                productId: feed.id,
                rateAmount: 1,
                rateUnit: "lb/1000ft2",
                windMph: null,
                temperatureF: null,
                isEstablishing: false,
                applicatorName: "",
                applicatorLicence: "",
                overrideReason: null,
              }),
              ctx({ visitId }),
            ),
          ),
        ),
        // A technician's zone-check edit too: after the finish it is refused, never applied.
        as(tech, () =>
          zoneCheckRoute.PUT(
            json("PUT", { ...doneCheck(zoneIds[0]!, { quality: 3 }), baseVersion: 1 }),
            ctx({ visitId, zoneCheckId: randomUUID() }),
          ),
        ),
      ];
      const results = await Promise.all(sends);
      for (const r of results.slice(0, 5)) expect(r.status).toBe(200);
      const appStatuses = results.slice(5, 9).map((r) => r.status);
      // 201 before the finish; after it 403 (a finished visit is locked for technicians) or 409
      // (finished while this one was being recorded).
      for (const s of appStatuses) expect([201, 403, 409]).toContain(s);
      refusedTotal += appStatuses.filter((s) => s !== 201).length;
      const visit = await testDb()
        .selectFrom("visits")
        .select(["status", "completed_at"])
        .where("id", "=", visitId)
        .executeTakeFirstOrThrow();
      expect(visit.status).toBe("completed");
      const stored = await testDb()
        .selectFrom("applications")
        .select(["id", "created_at"])
        .where("visit_id", "=", visitId)
        .execute();
      // Exactly the 201s are stored, and every one was recorded before the visit was finished.
      expect(stored.map((a) => a.id).sort()).toEqual(
        appIds.filter((_, i) => appStatuses[i] === 201).sort(),
      );
      for (const a of stored)
        expect(new Date(a.created_at).getTime()).toBeLessThanOrEqual(
          new Date(visit.completed_at!).getTime(),
        );
      // The finished visit's report mail was queued once for its homeowner.
      const mail = await testDb()
        .selectFrom("mail_outbox")
        .select("id")
        .where("dedupe_key", "like", `visit_report:${visitId}:%`)
        .execute();
      expect(mail).toHaveLength(1);
    }
    console.log(`finish vs write: ${refusedTotal} of 16 applications refused after the finish`);
  });
});

describe("resolve vs resolve", () => {
  it("three managers' resolves at once: one resolves it, the others get 409 and no note is lost silently", async () => {
    const manager = await c.actor("manager");
    for (let round = 0; round < 3; round++) {
      await testDb().deleteFrom("risk_alerts").where("company_id", "=", c.companyId).execute();
      await evaluateProperty(testDb(), c.companyId, c.propertyIds["haddad"]!, { provider: null });
      const alert = await testDb()
        .selectFrom("risk_alerts")
        .select("id")
        .where("company_id", "=", c.companyId)
        .where("status", "!=", "resolved")
        .executeTakeFirstOrThrow();
      const notes = ["Sprayed the drive edge", "Raised the mower", "Talked to the owner"];
      const results = await Promise.all(
        notes.map((note) =>
          as(manager, () => resolveRoute.POST(json("POST", { note }), ctx({ alertId: alert.id }))),
        ),
      );
      const statuses = results.map((r) => r.status).sort();
      expect(statuses).toEqual([200, 409, 409]);
      const winner = notes[results.findIndex((r) => r.status === 200)]!;
      for (const r of results.filter((x) => x.status === 409)) {
        const body = (await r.json()) as { error: { message: string } };
        expect(body.error.message).toMatch(/already resolved .*your note was not saved/i);
      }
      const events = await testDb()
        .selectFrom("risk_alert_events")
        .select(["note", "action"])
        .where("alert_id", "=", alert.id)
        .where("action", "=", "resolved")
        .execute();
      expect(events).toEqual([{ note: winner, action: "resolved" }]);
      // The winner's own retry is harmless: 200, nothing added.
      const retry = await as(manager, () =>
        resolveRoute.POST(json("POST", { note: winner }), ctx({ alertId: alert.id })),
      );
      expect(retry.status).toBe(200);
    }
  });
});

describe("reassign vs finish", () => {
  it("reassigning the lawn while its visit is finished: the finish answers 200 and the report e-mail is queued", async () => {
    const tech = await c.actor("tech1");
    const manager = await c.actor("manager");
    const propertyId = c.propertyIds["haddad"]!;
    for (let round = 0; round < 4; round++) {
      const { visitId } = await readyVisit("haddad");
      const row = await testDb()
        .selectFrom("properties")
        .selectAll()
        .where("id", "=", propertyId)
        .executeTakeFirstOrThrow();
      const body = {
        name: row.name,
        street: row.street,
        city: row.city,
        region: row.region,
        postalCode: row.postal_code,
        latitude: row.latitude === null ? null : Number(row.latitude),
        longitude: row.longitude === null ? null : Number(row.longitude),
        timeZone: row.time_zone,
        ruleSetId: null,
        technicianId: round % 2 === 0 ? c.userIds["tech2"]! : c.userIds["tech1"]!,
        notes: row.notes,
      };
      // Reassign first in half the rounds, at the same time in the others.
      const reassign = () =>
        as(manager, () => propertyRoute.PUT(json("PUT", body), ctx({ propertyId })));
      const finish = () => as(tech, () => finishRoute.POST(json("POST", {}), ctx({ visitId })));
      const [a, b] =
        round < 2 ? [await reassign(), await finish()] : await Promise.all([reassign(), finish()]);
      expect(a.status, await a.clone().text()).toBe(200);
      expect(b.status, await b.clone().text()).toBe(200);
      const mail = await testDb()
        .selectFrom("mail_outbox")
        .select(["to_address"])
        .where("dedupe_key", "like", `visit_report:${visitId}:%`)
        .execute();
      expect(mail.map((m) => m.to_address)).toEqual([c.emails["owner2"]]);
    }
  });
});
