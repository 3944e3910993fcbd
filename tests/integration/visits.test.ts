// Visits and zone checks against the real database: scope of every read and write, the
// technician's day, idempotent and versioned saves, finishing, locking and the audit trail.
import { beforeAll, describe, expect, it } from "vitest";

import { findingSeason } from "@/fixtures/demo/rounds";
import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";
import { todayIn } from "@/lib/dates";
import { getProperty, listProperties } from "@/lib/properties/queries";
import { finishVisit } from "@/lib/reports/mutations";
import { saveZoneCheck, scheduleVisit, startVisit } from "@/lib/visits/mutations";
import {
  getVisit,
  getZoneHistory,
  listTodayStops,
  listVisitAudit,
  listVisits,
} from "@/lib/visits/queries";
import { emptyZoneCheck } from "@/lib/visits/schemas";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { doneCheck, newId } from "../helpers/zone-checks";

let c: TestCompany;
let other: TestCompany;
let manager: Actor;
let tech1: Actor;
let tech2: Actor;
let owner1: Actor;
const today = todayIn("America/New_York");

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [manager, tech1, tech2, owner1] = await Promise.all([
    c.actor("manager"),
    c.actor("tech1"),
    c.actor("tech2"),
    c.actor("owner1"),
  ]);
});

async function todayVisitOf(actor: Actor, propertyKey: string) {
  const stops = await listTodayStops(actor, today);
  const stop = stops.find((s) => s.propertyId === c.propertyIds[propertyKey]);
  if (!stop) throw new Error(`no stop at ${propertyKey}`);
  return getVisit(actor, stop.id);
}

async function freshVisit(propertyKey = "haddad", technician = tech1) {
  return scheduleVisit(manager, {
    propertyId: c.propertyIds[propertyKey]!,
    scheduledFor: today,
    technicianId: technician.userId,
    plannedService: "inspection",
    stopOrder: 9,
    notes: "",
    confirmSameDay: true, // the property has its demo stop today
  });
}

describe("the technician's day", () => {
  it("lists tech1's stops in order, with the last visit and what it found", async () => {
    const stops = await listTodayStops(tech1, today);
    expect(stops.map((s) => s.propertyName)).toEqual([
      "Oyelaran residence",
      "Haddad residence",
      "Kowalczyk residence",
    ]);
    const haddad = stops[1]!;
    expect(haddad.lastVisitOn).not.toBeNull();
    // What the last visit (three weeks ago) found follows its month (fixtures/demo/rounds.ts).
    const season = findingSeason(haddad.lastVisitOn!);
    expect(haddad.concerns).toEqual(
      expect.arrayContaining([
        "Back yard: overall quality 5 of 9 (below acceptable)",
        expect.stringMatching(
          {
            summer: /^Back yard: Dollar spot \(moderate, 10 % of zone\)$/,
            shoulder: /^Back yard: Red thread \(moderate, 10 % of zone\)$/,
            dormant: /^Back yard: Snow mou?ld \(moderate, 10 % of zone\)$/,
          }[season],
        ),
        ...(season === "dormant" ? [] : ["Front slope: matted canopy"]),
      ]),
    );
    expect(stops.every((s) => s.status === "scheduled")).toBe(true);
  });

  it("a technician never sees another technician's stops, even when asking for them", async () => {
    const asked = await listTodayStops(tech1, today, tech2.userId);
    expect(asked.every((s) => s.technician?.id === tech1.userId)).toBe(true);
    const mine = await listVisits(tech2, {});
    expect(mine.length).toBeGreaterThan(0);
    expect(mine.every((v) => v.technician?.id === tech2.userId)).toBe(true);
  });
});

describe("scope of visits", () => {
  it("tech2 cannot read, start or write tech1's visit; the other company cannot either", async () => {
    const visit = await todayVisitOf(tech1, "oyelaran");
    const zoneId = visit.zones[0]!.id;
    for (const actor of [tech2, await other.actor("manager")]) {
      await expect(getVisit(actor, visit.id)).rejects.toMatchObject({ code: "not_found" });
      await expect(
        startVisit(actor, visit.id, { latitude: null, longitude: null }),
      ).rejects.toMatchObject({ code: "not_found" });
      await expect(
        saveZoneCheck(actor, visit.id, newId(), doneCheck(zoneId)),
      ).rejects.toMatchObject({ code: "not_found" });
      await expect(finishVisit(actor, visit.id)).rejects.toMatchObject({ code: "not_found" });
    }
  });

  it("a homeowner sees no visits and no drafts", async () => {
    const visit = await todayVisitOf(tech1, "oyelaran");
    await saveZoneCheck(tech1, visit.id, newId(), {
      ...emptyZoneCheck(visit.zones[1]!.id),
      quality: 6,
    });
    expect(await listVisits(owner1, {})).toEqual([]);
    await expect(getVisit(owner1, visit.id)).rejects.toMatchObject({ code: "not_found" });
  });

  it("a technician reaches a property only while they have an open visit there", async () => {
    const okafor = c.propertyIds["okafor"]!; // assigned to tech2
    await expect(getProperty(tech1, okafor)).rejects.toMatchObject({ code: "not_found" });
    const visit = await freshVisit("okafor", tech1);
    expect((await getProperty(tech1, okafor)).name).toBe("Okafor residence");
    expect((await listProperties(tech1)).map((p) => p.id)).toContain(okafor);
    await testDb()
      .updateTable("visits")
      .set({ status: "cancelled" })
      .where("id", "=", visit.id)
      .execute();
    await expect(getProperty(tech1, okafor)).rejects.toMatchObject({ code: "not_found" });
  });

  it("a visit goes only to an active technician of the company, in words", async () => {
    const refused = {
      code: "invalid_input",
      fieldErrors: { technicianId: ["Choose one of your technicians."] },
    };
    const otherManager = await other.actor("manager");
    // A manager, a homeowner, another company's person: not one of your technicians.
    for (const person of [manager, owner1, otherManager])
      await expect(freshVisit("haddad", person)).rejects.toMatchObject(refused);
    // A disabled technician neither.
    await testDb()
      .updateTable("users")
      .set({ disabled_at: new Date() })
      .where("id", "=", tech2.userId)
      .execute();
    try {
      await expect(freshVisit("okafor", tech2)).rejects.toMatchObject(refused);
    } finally {
      await testDb()
        .updateTable("users")
        .set({ disabled_at: null })
        .where("id", "=", tech2.userId)
        .execute();
    }
  });

  it("a zone of another property cannot be checked on this visit", async () => {
    const visit = await freshVisit("haddad");
    const foreignZone = (await getProperty(manager, c.propertyIds["oyelaran"]!)).zones[0]!.id;
    await expect(
      saveZoneCheck(tech1, visit.id, newId(), doneCheck(foreignZone)),
    ).rejects.toMatchObject({ code: "invalid_input", fieldErrors: { zoneId: expect.any(Array) } });
  });
});

describe("saving zone checks", () => {
  it("the same check submitted three times at once leaves one row", async () => {
    const visit = await freshVisit();
    const id = newId();
    const check = doneCheck(visit.zones[0]!.id);
    const results = await Promise.all(
      [1, 2, 3].map(() => saveZoneCheck(tech1, visit.id, id, check)),
    );
    expect(new Set(results.map((r) => r.id))).toEqual(new Set([id]));
    const rows = await testDb()
      .selectFrom("zone_checks")
      .select("id")
      .where("visit_id", "=", visit.id)
      .execute();
    expect(rows).toHaveLength(1);
    expect(results.every((r) => r.version === 1)).toBe(true);
  });

  it("versions advance, a replay of an acknowledged save is harmless, and a stale edit is a conflict with the server's copy", async () => {
    const visit = await freshVisit();
    const zoneId = visit.zones[1]!.id;
    const id = newId();
    const v1 = await saveZoneCheck(tech1, visit.id, id, { ...emptyZoneCheck(zoneId), quality: 6 });
    const v2 = await saveZoneCheck(tech1, visit.id, id, {
      ...emptyZoneCheck(zoneId),
      quality: 7,
      baseVersion: v1.version,
    });
    expect([v1.version, v2.version]).toEqual([1, 2]);
    // The phone retries the second save after a timeout: same content, old base → accepted, no new version.
    expect(
      (
        await saveZoneCheck(tech1, visit.id, id, {
          ...emptyZoneCheck(zoneId),
          quality: 7,
          baseVersion: 1,
        })
      ).version,
    ).toBe(2);
    // Another device edits from version 1 with different content → conflict carrying version 2.
    await expect(
      saveZoneCheck(manager, visit.id, id, {
        ...emptyZoneCheck(zoneId),
        quality: 3,
        baseVersion: 1,
      }),
    ).rejects.toMatchObject({
      code: "conflict",
      details: { current: { version: 2, quality: 7 } },
    });
  });

  it("two devices starting the same zone with different ids get a conflict, not two checks", async () => {
    const visit = await freshVisit();
    const zoneId = visit.zones[0]!.id;
    await saveZoneCheck(tech1, visit.id, newId(), { ...emptyZoneCheck(zoneId), color: 8 });
    await expect(
      saveZoneCheck(tech1, visit.id, newId(), { ...emptyZoneCheck(zoneId), color: 4 }),
    ).rejects.toMatchObject({ code: "conflict" });
  });

  it("saving a check starts a scheduled visit", async () => {
    const visit = await freshVisit();
    expect(visit.status).toBe("scheduled");
    await saveZoneCheck(tech1, visit.id, newId(), emptyZoneCheck(visit.zones[0]!.id));
    const after = await getVisit(tech1, visit.id);
    expect(after.status).toBe("in_progress");
    expect(after.startedAt).not.toBeNull();
  });

  it("start stamps the time and device location once", async () => {
    const visit = await freshVisit();
    const started = await startVisit(tech1, visit.id, { latitude: 40.33, longitude: -74.74 });
    const again = await startVisit(tech1, visit.id, { latitude: 1, longitude: 1 });
    expect(started.startedAt).not.toBeNull();
    expect(again.startedAt).toBe(started.startedAt);
    const row = await testDb()
      .selectFrom("visits")
      .select(["start_latitude", "start_longitude", "started_by"])
      .where("id", "=", visit.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({
      start_latitude: 40.33,
      start_longitude: -74.74,
      started_by: tech1.userId,
    });
  });
});

describe("finishing, locking and the audit trail", () => {
  it("refuses to finish while a zone is unchecked, naming it", async () => {
    const visit = await freshVisit();
    await saveZoneCheck(tech1, visit.id, newId(), doneCheck(visit.zones[0]!.id));
    await expect(finishVisit(tech1, visit.id)).rejects.toMatchObject({
      code: "invalid_input",
      message: expect.stringContaining(visit.zones[1]!.name),
    });
  });

  it("a finished visit is locked for the technician; a manager's later edit is audited old → new", async () => {
    const visit = await freshVisit();
    const [front, back] = visit.zones;
    const checkId = newId();
    const saved = await saveZoneCheck(tech1, visit.id, checkId, doneCheck(front!.id));
    await saveZoneCheck(tech1, visit.id, newId(), {
      ...emptyZoneCheck(back!.id),
      status: "skipped",
      skipReason: "dog_in_yard",
    });
    const finished = await finishVisit(tech1, visit.id);
    expect(finished.status).toBe("completed");
    expect(finished.canEdit).toBe(false); // technicians cannot edit a finished visit

    await expect(
      saveZoneCheck(tech1, visit.id, checkId, {
        ...doneCheck(front!.id),
        quality: 9,
        baseVersion: saved.version,
      }),
    ).rejects.toMatchObject({ code: "forbidden" });

    // A manager's correction needs its reason (422 without one).
    await expect(
      saveZoneCheck(manager, visit.id, checkId, {
        ...doneCheck(front!.id),
        quality: 5,
        baseVersion: saved.version,
      }),
    ).rejects.toMatchObject({ code: "invalid_input" });
    const edited = await saveZoneCheck(
      manager,
      visit.id,
      checkId,
      { ...doneCheck(front!.id), quality: 5, baseVersion: saved.version },
      "rated in full sun, re-rated",
    );
    expect(edited.quality).toBe(5);
    const audit = await listVisitAudit(manager, visit.id);
    const edit = audit.find((a) => a.action === "edit_after_finish");
    expect(edit).toMatchObject({
      actor: manager.name,
      entity: "zone_check",
      entityId: checkId,
      changes: { quality: { from: 7, to: 5 } },
      reason: "rated in full sun, re-rated",
      sentence: `${front!.name} · overall quality 7 → 5 — corrected by ${manager.name}: rated in full sun, re-rated`,
    });
    expect(audit.find((a) => a.action === "finish")).toMatchObject({ actor: tech1.name });
    expect(await listVisitAudit(tech1, visit.id)).toEqual([]);
  });
});

describe("zone history", () => {
  it("lists every check of a zone, newest first", async () => {
    const zoneId = (await getProperty(manager, c.propertyIds["kowalczyk"]!)).zones.find(
      (z) => z.name === "Under the oaks",
    )!.id;
    const history = await getZoneHistory(manager, zoneId);
    expect(history.zoneName).toBe("Under the oaks");
    expect(history.entries.length).toBeGreaterThanOrEqual(2);
    const dates = history.entries.map((e) => e.visitedOn);
    expect([...dates].sort().reverse()).toEqual(dates);
    expect(history.entries[0]).toMatchObject({ density: 4, barePct: 25 });
    await expect(getZoneHistory(await other.actor("manager"), zoneId)).rejects.toMatchObject({
      code: "not_found",
    });
    await expect(getZoneHistory(owner1, zoneId)).rejects.toMatchObject({ code: "not_found" });
  });
});

describe("the stored Sward Index", () => {
  it("is computed when a check is saved, null for drafts without ratings, and photos move it", async () => {
    const visit = await freshVisit();
    const [front, back] = visit.zones;
    const rated = await saveZoneCheck(
      tech1,
      visit.id,
      newId(),
      doneCheck(front!.id, { symptoms: [], barePct: 0, weedsPct: 0 }),
    );
    const { swardIndex } = await import("@/lib/scoring/sward-index");
    expect(rated.swardIndex).toBe(
      swardIndex({
        qualityRating: 7,
        colorRating: 7,
        densityRating: 6,
        uniformityRating: 7,
        bareSoilPct: 0,
        weedPct: 0,
        symptoms: [],
      }).index,
    );
    const draft = await saveZoneCheck(tech1, visit.id, newId(), {
      ...emptyZoneCheck(back!.id),
      quality: 6,
    });
    expect(draft.swardIndex).toBeNull();
    const history = await getZoneHistory(manager, front!.id);
    expect(history.entries.find((e) => e.zoneCheckId === rated.id)?.swardIndex).toBe(
      rated.swardIndex,
    );
  });
});
