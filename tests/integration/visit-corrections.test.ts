// Corrections of a visit, through the route handlers people hit: on a finished visit every create,
// edit and delete of a zone check, photo, application or watering is a manager's, needs a reason
// (422 without one) and writes an audit event in the same transaction as the change (a failing
// after-write step rolls both back); while the visit is open the entry's author (or a manager) may
// correct or delete it, another technician may not (403), another company cannot see it (404).
// Deleted photos' files leave storage unless another photo row shares them.
import { randomUUID } from "node:crypto";
import { existsSync } from "node:fs";
import path from "node:path";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";
import { listProducts } from "@/lib/products/queries";
import { saveZoneCheck } from "@/lib/visits/mutations";
import { listVisitAudit } from "@/lib/visits/queries";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { lawnImage } from "../helpers/images";
import { doneCheck } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
// The after-write step, made to fail on demand: the change and its audit event must go together.
let failAfterWrite = false;
vi.mock("@/lib/after-write", async (importOriginal) => {
  const real = await importOriginal<typeof import("@/lib/after-write")>();
  return {
    ...real,
    afterWrite: async (...args: Parameters<typeof real.afterWrite>) => {
      if (failAfterWrite) throw new Error("after-write failed on purpose");
      return real.afterWrite(...args);
    },
  };
});

const applicationsRoute = await import("@/app/api/v1/visits/[visitId]/applications/route");
const applicationRoute = await import("@/app/api/v1/applications/[applicationId]/route");
const zoneCheckRoute =
  await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/route");
const uploadRoute =
  await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/photos/route");
const photoRoute = await import("@/app/api/v1/photos/[photoId]/route");
const wateringsRoute = await import("@/app/api/v1/properties/[propertyId]/waterings/route");
const wateringRoute = await import("@/app/api/v1/waterings/[wateringId]/route");
const auditRoute = await import("@/app/api/v1/visits/[visitId]/audit/route");

const STORE = "tests/.artifacts/photos-integration";
let c: TestCompany;
let other: TestCompany;
let manager: Actor;
let tech1: Actor;
let tech2: Actor;
let owner: Actor;
let otherManager: Actor;
let productId: string;
let zones: { id: string; name: string }[];

const headers = { origin: "http://localhost:3000", host: "localhost" };
const json = (method: string, body?: unknown) =>
  new Request("http://localhost/api", {
    method,
    body: body === undefined ? undefined : JSON.stringify(body),
    headers: { ...headers, "content-type": "application/json" },
  });
const ctx = <P extends Record<string, string>>(params: P) => ({ params: Promise.resolve(params) });

async function as<T>(who: Actor, send: () => Promise<T>): Promise<T> {
  current = who;
  return send();
}

/** A visit at the Haddad residence, tech1's, started an hour ago (by tech2 when `sharedWith`: both reach it). */
async function openVisit(startedBy: "tech1" | "tech2" = "tech1"): Promise<string> {
  const id = randomUUID();
  await testDb()
    .insertInto("visits")
    .values({
      id,
      company_id: c.companyId,
      property_id: c.propertyIds["haddad"]!,
      technician_id: c.userIds["tech1"]!,
      scheduled_for: new Date().toISOString().slice(0, 10),
      planned_service: "inspection",
      status: "in_progress",
      started_at: new Date(Date.now() - 3_600_000),
      started_by: c.userIds[startedBy]!,
    })
    .execute();
  return id;
}

async function finish(visitId: string) {
  await testDb()
    .updateTable("visits")
    .set({ status: "completed", completed_at: new Date(), completed_by: c.userIds["tech1"]! })
    .where("id", "=", visitId)
    .execute();
}

const application = (overrides: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  zoneId: zones[0]!.id,
  productId,
  rateAmount: 3,
  rateUnit: "lb/1000ft2",
  windMph: 4,
  temperatureF: 60,
  isEstablishing: false,
  applicatorName: "",
  applicatorLicence: "",
  overrideReason: null,
  ...overrides,
});

const auditRows = (visitId: string) =>
  testDb()
    .selectFrom("audit_events")
    .selectAll()
    .where("visit_id", "=", visitId)
    .orderBy("id")
    .execute();

async function upload(visitId: string, zoneCheckId: string, seed: number, reason?: string) {
  const query = reason === undefined ? "" : `?correctionReason=${encodeURIComponent(reason)}`;
  return uploadRoute.POST(
    new Request(`http://localhost/api/x${query}`, {
      method: "POST",
      body: new Uint8Array(await lawnImage(320, 240, 0.2, "jpeg", seed)),
      headers: { ...headers, "content-type": "image/jpeg" },
    }),
    ctx({ visitId, zoneCheckId }),
  );
}

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [manager, tech1, tech2, owner, otherManager] = await Promise.all([
    c.actor("manager"),
    c.actor("tech1"),
    c.actor("tech2"),
    c.actor("owner2"),
    other.actor("manager"),
  ]);
  // No rule set: these cases are about who may correct what, not about legal limits (the
  // label still applies, and is what the correction's checks are shown with).
  await testDb()
    .updateTable("properties")
    .set({ rule_set_id: null })
    .where("company_id", "=", c.companyId)
    .execute();
  zones = await testDb()
    .selectFrom("zones")
    .select(["id", "name"])
    .where("property_id", "=", c.propertyIds["haddad"]!)
    .where("archived_at", "is", null)
    .orderBy("name")
    .execute();
  const products = await listProducts(manager);
  productId = products.find((p) => p.name.startsWith("Larkmoor Steadyfeed"))!.id;
});

// The label's reapplication interval would refuse the same product on the same zone twice: each
// case starts with no applications on the lawn.
beforeEach(async () => {
  await testDb().deleteFrom("applications").where("company_id", "=", c.companyId).execute();
});

describe("a manager's additions to a finished visit are in its trail", () => {
  it("an application, a zone check and a photo added after the finish each write an audit event with who and why", async () => {
    const visitId = await openVisit();
    const checkId = randomUUID();
    await saveZoneCheck(tech1, visitId, checkId, doneCheck(zones[0]!.id));
    await finish(visitId);
    expect(await auditRows(visitId)).toEqual([]);

    const body = application({ correctionReason: "sprayed at the stop, entered on paper" });
    const added = await as(manager, () =>
      applicationsRoute.POST(json("POST", body), ctx({ visitId })),
    );
    expect(added.status).toBe(201);
    const newCheck = randomUUID();
    const checked = await as(manager, () =>
      zoneCheckRoute.PUT(
        json("PUT", {
          ...doneCheck(zones[1]!.id),
          correctionReason: "zone was checked, not saved",
        }),
        ctx({ visitId, zoneCheckId: newCheck }),
      ),
    );
    expect(checked.status).toBe(200);
    const photo = await as(manager, () => upload(visitId, checkId, 71, "photo from the office"));
    expect(photo.status).toBe(201);

    const rows = await auditRows(visitId);
    expect(rows.map((r) => [r.entity, r.action, r.actor_id, r.reason])).toEqual([
      ["application", "add_after_finish", manager.userId, "sprayed at the stop, entered on paper"],
      ["zone_check", "add_after_finish", manager.userId, "zone was checked, not saved"],
      ["photo", "add_after_finish", manager.userId, "photo from the office"],
    ]);
    expect(rows[0]!.changes).toMatchObject({
      product: { from: null, to: expect.stringContaining("Larkmoor Steadyfeed") },
      rate: { from: null, to: { amount: 3, unit: "lb/1000ft2" } },
    });
    // The trail reads them in words, newest first, with the zone's name.
    const res = await as(manager, () => auditRoute.GET(json("GET"), ctx({ visitId })));
    const { items } = (await res.json()) as { items: { sentence: string; when: string }[] };
    expect(items.map((i) => i.sentence)).toEqual([
      `${zones[0]!.name} · photo — added by ${manager.name}: photo from the office`,
      `${zones[1]!.name} · zone check — added by ${manager.name}: zone was checked, not saved`,
      expect.stringMatching(
        new RegExp(
          `^${zones[0]!.name} · application of Larkmoor Steadyfeed.* at 3 lb / 1,000 ft² — added by ${manager.name}: sprayed at the stop, entered on paper$`,
        ),
      ),
    ]);
    expect(items[0]!.when).toMatch(/^[A-Z][a-z]{2} \d{1,2}, \d{4}, \d{1,2}:\d{2} [AP]M$/);
  });

  it("without a reason every write to a finished visit is 422 naming correctionReason, and nothing changes", async () => {
    const visitId = await openVisit();
    const checkId = randomUUID();
    await saveZoneCheck(tech1, visitId, checkId, doneCheck(zones[0]!.id));
    const app = application();
    const first = await as(tech1, () =>
      applicationsRoute.POST(json("POST", app), ctx({ visitId })),
    );
    expect(first.status, await first.clone().text()).toBe(201);
    const ph = await as(tech1, () => upload(visitId, checkId, 72));
    const photoId = ((await ph.json()) as { id: string }).id;
    await finish(visitId);
    const countOf = async () => ({
      applications: (
        await testDb()
          .selectFrom("applications")
          .select("id")
          .where("visit_id", "=", visitId)
          .execute()
      ).length,
      photos: (
        await testDb().selectFrom("photos").select("id").where("visit_id", "=", visitId).execute()
      ).length,
      checks: (
        await testDb()
          .selectFrom("zone_checks")
          .select("id")
          .where("visit_id", "=", visitId)
          .execute()
      ).length,
    });
    const before = await countOf();
    const refused = async (res: Response) => {
      expect(res.status).toBe(422);
      const body = (await res.json()) as {
        error: { message: string; fieldErrors?: Record<string, string[]> };
      };
      expect(body.error.fieldErrors?.correctionReason?.[0]).toMatch(/^Reason for the correction/);
      expect(body.error.message).not.toMatch(/correctionReason|_/);
    };
    await as(manager, async () => {
      await refused(await applicationsRoute.POST(json("POST", application()), ctx({ visitId })));
      await refused(
        await applicationsRoute.POST(
          json("POST", application({ correctionReason: "   " })),
          ctx({ visitId }),
        ),
      );
      await refused(
        await zoneCheckRoute.PUT(
          json("PUT", doneCheck(zones[1]!.id)),
          ctx({ visitId, zoneCheckId: randomUUID() }),
        ),
      );
      await refused(
        await zoneCheckRoute.PUT(
          json("PUT", doneCheck(zones[0]!.id, { color: 9, baseVersion: 1 })),
          ctx({ visitId, zoneCheckId: checkId }),
        ),
      );
      await refused(await upload(visitId, checkId, 73));
      await refused(await photoRoute.DELETE(json("DELETE", {}), ctx({ photoId })));
      await refused(await applicationRoute.DELETE(json("DELETE"), ctx({ applicationId: app.id })));
      const { id: _id, ...rest } = app;
      await refused(
        await applicationRoute.PUT(
          json("PUT", { ...rest, rateAmount: 2 }),
          ctx({ applicationId: app.id }),
        ),
      );
      await refused(
        await zoneCheckRoute.DELETE(json("DELETE", {}), ctx({ visitId, zoneCheckId: checkId })),
      );
    });
    expect(await countOf()).toEqual(before);
    expect(await auditRows(visitId)).toEqual([]);
  });

  it("a reason is one line of at most 500 characters: control characters, line breaks and longer text are 422", async () => {
    const visitId = await openVisit();
    await finish(visitId);
    for (const reason of ["a\u0000b", "first line\nsecond", "x".repeat(501)]) {
      const res = await as(manager, () =>
        applicationsRoute.POST(
          json("POST", application({ correctionReason: reason })),
          ctx({ visitId }),
        ),
      );
      expect(res.status).toBe(422);
    }
    const ok = await as(manager, () =>
      applicationsRoute.POST(
        json("POST", application({ correctionReason: "x".repeat(500) })),
        ctx({ visitId }),
      ),
    );
    expect(ok.status).toBe(201);
  });

  it("a technician cannot correct a finished visit at all (403), with or without a reason", async () => {
    const visitId = await openVisit();
    const app = application();
    await as(tech1, () => applicationsRoute.POST(json("POST", app), ctx({ visitId })));
    await finish(visitId);
    const res = await as(tech1, () =>
      applicationRoute.DELETE(
        json("DELETE", { correctionReason: "mine" }),
        ctx({ applicationId: app.id }),
      ),
    );
    expect(res.status).toBe(403);
    expect(
      (await testDb().selectFrom("applications").select("id").where("id", "=", app.id).execute())
        .length,
    ).toBe(1);
  });
});

describe("the audit event is written in the change's own transaction", () => {
  it("when the after-write step fails, the deletion and its audit event are both rolled back", async () => {
    const visitId = await openVisit();
    const app = application();
    await as(tech1, () => applicationsRoute.POST(json("POST", app), ctx({ visitId })));
    await finish(visitId);
    failAfterWrite = true;
    let res: Response;
    try {
      res = await as(manager, () =>
        applicationRoute.DELETE(
          json("DELETE", { correctionReason: "entered twice" }),
          ctx({ applicationId: app.id }),
        ),
      );
    } finally {
      failAfterWrite = false;
    }
    expect(res.status).toBe(500);
    expect(
      (await testDb().selectFrom("applications").select("id").where("id", "=", app.id).execute())
        .length,
    ).toBe(1);
    expect(await auditRows(visitId)).toEqual([]);
    // And once it works, both happen.
    const ok = await as(manager, () =>
      applicationRoute.DELETE(
        json("DELETE", { correctionReason: "entered twice" }),
        ctx({ applicationId: app.id }),
      ),
    );
    expect(ok.status).toBe(204);
    const rows = await auditRows(visitId);
    expect(rows.map((r) => [r.action, r.reason, r.zone_id])).toEqual([
      ["delete_after_finish", "entered twice", zones[0]!.id],
    ]);
  });

  it("a failing after-write step on an added application leaves neither the application nor its event", async () => {
    const visitId = await openVisit();
    await finish(visitId);
    const app = application({ correctionReason: "late entry" });
    failAfterWrite = true;
    try {
      const res = await as(manager, () =>
        applicationsRoute.POST(json("POST", app), ctx({ visitId })),
      );
      expect(res.status).toBe(500);
    } finally {
      failAfterWrite = false;
    }
    expect(
      (await testDb().selectFrom("applications").select("id").where("id", "=", app.id).execute())
        .length,
    ).toBe(0);
    expect(await auditRows(visitId)).toEqual([]);
  });
});

describe("correcting an application goes through the checks of a new one", () => {
  it("a manager corrects the rate on a finished visit: the nutrients are computed again and the trail keeps before → after", async () => {
    const visitId = await openVisit();
    const app = application();
    await as(tech1, () => applicationsRoute.POST(json("POST", app), ctx({ visitId })));
    const before = await testDb()
      .selectFrom("applications")
      .select(["n_lb_per_1000", "applied_at"])
      .where("id", "=", app.id)
      .executeTakeFirstOrThrow();
    await finish(visitId);
    const { id: _id, ...rest } = app;
    const res = await as(manager, () =>
      applicationRoute.PUT(
        json("PUT", { ...rest, rateAmount: 2, correctionReason: "bag weighed after" }),
        ctx({ applicationId: app.id }),
      ),
    );
    expect(res.status).toBe(200);
    const after = (await res.json()) as {
      per1000: { nLb: number };
      rate: { amount: number };
      appliedAt: string;
    };
    expect(after.rate.amount).toBe(2);
    // N scales with the rate (24-0-8: 24 % N, so 2 lb of product per 1,000 ft² is 0.48 lb N).
    expect(after.per1000.nLb).toBeCloseTo((Number(before.n_lb_per_1000) * 2) / 3, 6);
    expect(after.per1000.nLb).toBeCloseTo(0.48, 6);
    // Without a new time, the stored one is kept.
    expect(after.appliedAt).toBe(new Date(before.applied_at).toISOString());
    const rows = await auditRows(visitId);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ action: "edit_after_finish", reason: "bag weighed after" });
    expect(rows[0]!.changes).toMatchObject({
      rate: { from: { amount: 3, unit: "lb/1000ft2" }, to: { amount: 2, unit: "lb/1000ft2" } },
    });
    expect(Object.keys(rows[0]!.changes).sort()).toEqual(["product", "rate"]);
  });

  it("a correction the label refuses is 422 with the label's finding, and the stored record is unchanged", async () => {
    const visitId = await openVisit();
    const app = application();
    await as(tech1, () => applicationsRoute.POST(json("POST", app), ctx({ visitId })));
    const { id: _id, ...rest } = app;
    const res = await as(tech1, () =>
      applicationRoute.PUT(
        json("PUT", { ...rest, rateAmount: 90 }),
        ctx({ applicationId: app.id }),
      ),
    );
    expect(res.status).toBe(422);
    const stored = await testDb()
      .selectFrom("applications")
      .select("rate_amount")
      .where("id", "=", app.id)
      .executeTakeFirstOrThrow();
    expect(Number(stored.rate_amount)).toBe(3);
    // And a time outside the visit is refused as for a new application.
    const early = await as(tech1, () =>
      applicationRoute.PUT(
        json("PUT", { ...rest, appliedAt: "2019-06-01T10:00:00-04:00" }),
        ctx({ applicationId: app.id }),
      ),
    );
    expect(early.status).toBe(422);
    expect(
      ((await early.json()) as { error: { fieldErrors: Record<string, string[]> } }).error
        .fieldErrors.appliedAt,
    ).toBeDefined();
  });
});

describe("while the visit is open, the author corrects and deletes their own entries", () => {
  it("the author and a manager may; another technician on the visit may not (403); another company gets 404", async () => {
    const visitId = await openVisit("tech2"); // tech2 started it: both technicians reach it
    const mine = application();
    const forManager = application({ zoneId: zones[1]!.id }); // another zone: the label's interval
    await as(tech1, () => applicationsRoute.POST(json("POST", mine), ctx({ visitId })));
    await as(tech1, () => applicationsRoute.POST(json("POST", forManager), ctx({ visitId })));
    const { id: _id, ...rest } = mine;

    expect(
      (
        await as(tech2, () =>
          applicationRoute.DELETE(json("DELETE"), ctx({ applicationId: mine.id })),
        )
      ).status,
    ).toBe(403);
    expect(
      (
        await as(tech2, () =>
          applicationRoute.PUT(
            json("PUT", { ...rest, rateAmount: 2 }),
            ctx({ applicationId: mine.id }),
          ),
        )
      ).status,
    ).toBe(403);
    expect(
      (
        await as(otherManager, () =>
          applicationRoute.DELETE(json("DELETE"), ctx({ applicationId: mine.id })),
        )
      ).status,
    ).toBe(404);
    expect(
      (
        await as(owner, () =>
          applicationRoute.DELETE(json("DELETE"), ctx({ applicationId: mine.id })),
        )
      ).status,
    ).toBe(403);

    const corrected = await as(tech1, () =>
      applicationRoute.PUT(
        json("PUT", { ...rest, rateAmount: 2 }),
        ctx({ applicationId: mine.id }),
      ),
    );
    expect(corrected.status).toBe(200);
    expect(
      (
        await as(tech1, () =>
          applicationRoute.DELETE(json("DELETE"), ctx({ applicationId: mine.id })),
        )
      ).status,
    ).toBe(204);
    expect(
      (
        await as(manager, () =>
          applicationRoute.DELETE(json("DELETE"), ctx({ applicationId: forManager.id })),
        )
      ).status,
    ).toBe(204);
    // Open-visit corrections and deletions are audited too (no reason needed yet).
    expect((await auditRows(visitId)).map((r) => [r.action, r.actor_id, r.reason])).toEqual([
      ["edit", tech1.userId, null],
      ["delete", tech1.userId, null],
      ["delete", manager.userId, null],
    ]);
  });

  it("a technician deletes their own photo: the row, the check's figures and the stored files go; another's photo is 403", async () => {
    const visitId = await openVisit("tech2");
    const checkId = randomUUID();
    await saveZoneCheck(tech1, visitId, checkId, doneCheck(zones[0]!.id));
    const res = await as(tech1, () => upload(visitId, checkId, 74));
    expect(res.status).toBe(201);
    const photo = (await res.json()) as { id: string };
    const keys = await testDb()
      .selectFrom("photos")
      .select(["display_key", "thumb_key"])
      .where("id", "=", photo.id)
      .executeTakeFirstOrThrow();
    const files = [keys.display_key, keys.thumb_key].map((k) => path.join(STORE, k));
    expect(files.every((f) => existsSync(f))).toBe(true);

    expect(
      (await as(tech2, () => photoRoute.DELETE(json("DELETE"), ctx({ photoId: photo.id })))).status,
    ).toBe(403);
    expect(
      (await as(otherManager, () => photoRoute.DELETE(json("DELETE"), ctx({ photoId: photo.id }))))
        .status,
    ).toBe(404);
    expect(
      (await as(tech1, () => photoRoute.DELETE(json("DELETE"), ctx({ photoId: photo.id })))).status,
    ).toBe(204);
    expect(
      await testDb().selectFrom("photos").select("id").where("id", "=", photo.id).execute(),
    ).toEqual([]);
    expect(files.some((f) => existsSync(f))).toBe(false);
  });

  it("a deleted photo's files stay while the same picture is on another check", async () => {
    const visitId = await openVisit();
    const [a, b] = [randomUUID(), randomUUID()];
    await saveZoneCheck(tech1, visitId, a, doneCheck(zones[0]!.id));
    await saveZoneCheck(tech1, visitId, b, doneCheck(zones[1]!.id));
    const first = (await (await as(tech1, () => upload(visitId, a, 75))).json()) as { id: string };
    await as(tech1, () => upload(visitId, b, 75)); // the same bytes: the same content-hash keys
    const keys = await testDb()
      .selectFrom("photos")
      .select(["display_key"])
      .where("id", "=", first.id)
      .executeTakeFirstOrThrow();
    expect(
      (await as(tech1, () => photoRoute.DELETE(json("DELETE"), ctx({ photoId: first.id })))).status,
    ).toBe(204);
    expect(existsSync(path.join(STORE, keys.display_key))).toBe(true);
  });
});

describe("zone checks and waterings", () => {
  it("a manager removes a zone check from a finished visit with a reason: its photos go with it, the trail keeps its values", async () => {
    const visitId = await openVisit();
    const checkId = randomUUID();
    await saveZoneCheck(tech1, visitId, checkId, doneCheck(zones[0]!.id, { color: 4 }));
    await as(tech1, () => upload(visitId, checkId, 76));
    await finish(visitId);
    const res = await as(manager, () =>
      zoneCheckRoute.DELETE(
        json("DELETE", { correctionReason: "checked the neighbor's lawn" }),
        ctx({ visitId, zoneCheckId: checkId }),
      ),
    );
    expect(res.status).toBe(204);
    expect(
      await testDb()
        .selectFrom("photos")
        .select("id")
        .where("zone_check_id", "=", checkId)
        .execute(),
    ).toEqual([]);
    const [row] = await auditRows(visitId);
    expect(row).toMatchObject({ entity: "zone_check", action: "delete_after_finish" });
    expect(row!.changes).toMatchObject({ color: { from: 4, to: null } });
    const words = await listVisitAudit(manager, visitId);
    expect(words[0]!.sentence).toBe(
      `${zones[0]!.name} · zone check — removed by ${manager.name}: checked the neighbor's lawn`,
    );
  });

  it("a correction of a check's rating reads as the zone, the change, who and why", async () => {
    const visitId = await openVisit();
    const checkId = randomUUID();
    await saveZoneCheck(tech1, visitId, checkId, doneCheck(zones[0]!.id, { color: 6 }));
    await finish(visitId);
    const res = await as(manager, () =>
      zoneCheckRoute.PUT(
        json("PUT", {
          ...doneCheck(zones[0]!.id, { color: 8, baseVersion: 1 }),
          correctionReason: "misread in shade",
        }),
        ctx({ visitId, zoneCheckId: checkId }),
      ),
    );
    expect(res.status).toBe(200);
    const words = await listVisitAudit(manager, visitId);
    expect(words.map((w) => w.sentence)).toEqual([
      `${zones[0]!.name} · color 6 → 8 — corrected by ${manager.name}: misread in shade`,
    ]);
  });

  it("a watering recorded on a visit: its author corrects it while open; once finished only a manager, with a reason", async () => {
    const visitId = await openVisit();
    const propertyId = c.propertyIds["haddad"]!;
    const today = new Date().toISOString().slice(0, 10);
    const watering = {
      id: randomUUID(),
      zoneId: null,
      wateredOn: today,
      depthIn: 0.5,
      runMinutes: null,
      precipitationRateInPerHour: null,
      notes: "",
      visitId,
    };
    const created = await as(tech1, () =>
      wateringsRoute.POST(json("POST", watering), ctx({ propertyId })),
    );
    expect(created.status).toBe(201);
    expect(
      (
        await as(tech1, () =>
          wateringRoute.PUT(
            json("PUT", { ...watering, depthIn: 0.75 }),
            ctx({ wateringId: watering.id }),
          ),
        )
      ).status,
    ).toBe(200);
    await finish(visitId);
    expect(
      (
        await as(tech1, () =>
          wateringRoute.DELETE(
            json("DELETE", { correctionReason: "x" }),
            ctx({ wateringId: watering.id }),
          ),
        )
      ).status,
    ).toBe(403);
    expect(
      (
        await as(manager, () =>
          wateringRoute.DELETE(json("DELETE"), ctx({ wateringId: watering.id })),
        )
      ).status,
    ).toBe(422);
    expect(
      (
        await as(manager, () =>
          wateringRoute.DELETE(
            json("DELETE", { correctionReason: "sprinkler was off" }),
            ctx({ wateringId: watering.id }),
          ),
        )
      ).status,
    ).toBe(204);
    expect((await auditRows(visitId)).map((r) => [r.entity, r.action, r.reason])).toEqual([
      ["watering", "edit", null],
      ["watering", "delete_after_finish", "sprinkler was off"],
    ]);
  });

  it("a homeowner deletes their own watering; a technician cannot delete the homeowner's (403)", async () => {
    const propertyId = c.propertyIds["haddad"]!;
    const watering = {
      id: randomUUID(),
      zoneId: null,
      wateredOn: new Date().toISOString().slice(0, 10),
      depthIn: 0.4,
      runMinutes: null,
      precipitationRateInPerHour: null,
      notes: "",
    };
    expect(
      (await as(owner, () => wateringsRoute.POST(json("POST", watering), ctx({ propertyId }))))
        .status,
    ).toBe(201);
    expect(
      (
        await as(tech1, () =>
          wateringRoute.DELETE(json("DELETE"), ctx({ wateringId: watering.id })),
        )
      ).status,
    ).toBe(403);
    expect(
      (
        await as(otherManager, () =>
          wateringRoute.DELETE(json("DELETE"), ctx({ wateringId: watering.id })),
        )
      ).status,
    ).toBe(404);
    expect(
      (
        await as(owner, () =>
          wateringRoute.DELETE(json("DELETE"), ctx({ wateringId: watering.id })),
        )
      ).status,
    ).toBe(204);
  });
});
