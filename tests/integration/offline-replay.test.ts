// What the device outbox (lib/offline) sends, replayed: each operation a phone queued offline may
// arrive twice — the first answer lost on a bad network, or two tabs — and must then answer with
// the stored result and change nothing more. Through the route handlers, against the real
// database: start (with the device's start time), a zone check, a photo (with the device's
// capture time), an application, finish (the report e-mail queued once). Each one sent twice in a
// row and twice at once.
import { rmSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

import type { Actor } from "@/lib/auth/actor";
import type { PhotoDto } from "@/lib/photos/dto";
import type { VisitDetailDto, ZoneCheckDto } from "@/lib/visits/dto";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { lawnImage } from "../helpers/images";
import { doneCheck, newId } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
const startRoute = await import("@/app/api/v1/visits/[visitId]/start/route");
const finishRoute = await import("@/app/api/v1/visits/[visitId]/finish/route");
const checkRoute = await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/route");
const photoRoute =
  await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/photos/route");
const applicationRoute = await import("@/app/api/v1/visits/[visitId]/applications/route");

const STORE = "tests/.artifacts/photos-integration";
const headers = { origin: "http://localhost:3000", host: "localhost" };
let c: TestCompany;
let visitId: string;
let zoneIds: string[];
let photoCheckId = "";

function json(method: string, body: unknown) {
  return new Request("http://localhost/api/x", {
    method,
    body: JSON.stringify(body),
    headers: { ...headers, "content-type": "application/json" },
  });
}
const visitParams = () => ({ params: Promise.resolve({ visitId }) });

async function start(body: unknown) {
  const response = await startRoute.POST(json("POST", body), visitParams());
  return { status: response.status, body: (await response.json()) as VisitDetailDto };
}
async function putCheck(checkId: string, body: unknown) {
  const response = await checkRoute.PUT(json("PUT", body), {
    params: Promise.resolve({ visitId, zoneCheckId: checkId }),
  });
  return { status: response.status, body: (await response.json()) as ZoneCheckDto };
}
async function postPhoto(checkId: string, bytes: Uint8Array, capturedAt?: string) {
  const query = capturedAt ? `?capturedAt=${encodeURIComponent(capturedAt)}` : "";
  const response = await photoRoute.POST(
    new Request(`http://localhost/api/x${query}`, {
      method: "POST",
      body: new Uint8Array(bytes),
      headers: { ...headers, "content-type": "image/jpeg" },
    }),
    { params: Promise.resolve({ visitId, zoneCheckId: checkId }) },
  );
  return {
    status: response.status,
    body: (await response.json()) as PhotoDto & {
      error?: { fieldErrors?: Record<string, string[]> };
    },
  };
}
async function finish() {
  const response = await finishRoute.POST(json("POST", {}), visitParams());
  return { status: response.status, body: (await response.json()) as VisitDetailDto };
}

beforeAll(async () => {
  rmSync(STORE, { recursive: true, force: true });
  c = await createTestCompany();
  current = await c.actor("tech1");
  visitId = (
    await testDb()
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .where("status", "=", "scheduled")
      .orderBy("scheduled_for")
      .executeTakeFirstOrThrow()
  ).id;
  zoneIds = (
    await testDb()
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .where("archived_at", "is", null)
      .orderBy("sort_order")
      .execute()
  ).map((z) => z.id);
});
afterAll(() => rmSync(STORE, { recursive: true, force: true }));

describe("a visit queued offline, replayed", () => {
  it("start: the device's start time is kept; a replay, in a row or at once, changes nothing", async () => {
    const startedAt = new Date(Date.now() - 40 * 60_000).toISOString();
    const body = { latitude: 40.1, longitude: -75.2, startedAt };
    const [a, b] = await Promise.all([start(body), start(body)]);
    expect([a.status, b.status]).toEqual([200, 200]);
    const again = await start({ ...body, startedAt: new Date().toISOString() });
    expect(again.status).toBe(200);
    const row = await testDb()
      .selectFrom("visits")
      .select(["status", "started_at", "version"])
      .where("id", "=", visitId)
      .executeTakeFirstOrThrow();
    expect(row.status).toBe("in_progress");
    expect(row.started_at!.toISOString()).toBe(startedAt);
  });

  it("start: a device time in the future or more than a day old is refused, naming the field", async () => {
    const inAnHour = new Date(Date.now() + 3_600_000).toISOString();
    const twoDaysAgo = new Date(Date.now() - 2 * 86_400_000).toISOString();
    for (const startedAt of [inAnHour, twoDaysAgo]) {
      const refused = await start({ latitude: null, longitude: null, startedAt });
      expect(refused.status).toBe(422);
      expect(
        (refused.body as unknown as { error: { fieldErrors: Record<string, string[]> } }).error
          .fieldErrors.startedAt?.[0],
      ).toMatch(/within the last 24 hours/);
    }
  });

  it("a zone check replayed with the same content and base version answers the stored row, also at once", async () => {
    const checkId = newId();
    const body = { ...doneCheck(zoneIds[0]!), baseVersion: 0 };
    const [a, b] = await Promise.all([putCheck(checkId, body), putCheck(checkId, body)]);
    for (const r of [a, b]) expect(r.status, JSON.stringify(r.body)).toBeLessThan(300);
    expect(a.body.version).toBe(1);
    expect(b.body.version).toBe(1);
    const again = await putCheck(checkId, body);
    expect(again.body).toMatchObject({ id: checkId, version: 1 });
    const rows = await testDb()
      .selectFrom("zone_checks")
      .select("id")
      .where("visit_id", "=", visitId)
      .where("zone_id", "=", zoneIds[0]!)
      .execute();
    expect(rows).toHaveLength(1);
  });

  it("a photo replayed (same bytes) answers the stored photo: 201 once, then 200; two at once are one row", async () => {
    const checkId = (await putCheck(newId(), { ...doneCheck(zoneIds[1]!), baseVersion: 0 })).body
      .id;
    photoCheckId = checkId;
    const capturedAt = new Date(Date.now() - 30 * 60_000).toISOString();
    const bytes = new Uint8Array(await lawnImage(800, 600, 0.2));
    const first = await postPhoto(checkId, bytes, capturedAt);
    expect(first.status).toBe(201);
    const replay = await postPhoto(checkId, bytes, capturedAt);
    expect(replay.status).toBe(200);
    expect(replay.body.id).toBe(first.body.id);

    const other = new Uint8Array(await lawnImage(640, 480, 0.3));
    const both = await Promise.all([
      postPhoto(checkId, other, capturedAt),
      postPhoto(checkId, other, capturedAt),
    ]);
    expect(both.map((r) => r.status).sort()).toEqual([200, 201]);
    expect(both[0]!.body.id).toBe(both[1]!.body.id);
    const rows = await testDb()
      .selectFrom("photos")
      .select(["id", "captured_local"])
      .where("zone_check_id", "=", checkId)
      .execute();
    expect(rows).toHaveLength(2);
    // The device's time, at the property (the demo properties are in one US time zone).
    const zone = (
      await testDb()
        .selectFrom("properties")
        .select("time_zone")
        .where("id", "=", c.propertyIds["haddad"]!)
        .executeTakeFirstOrThrow()
    ).time_zone;
    const local = new Intl.DateTimeFormat("sv-SE", {
      timeZone: zone,
      dateStyle: "short",
      timeStyle: "medium",
    }).format(new Date(capturedAt));
    expect(rows.map((r) => r.captured_local)).toEqual([local, local]);
  });

  it("a photo's device time outside the visit is refused with the field named, and nothing is stored", async () => {
    const checkId = photoCheckId;
    const lastWeek = new Date(Date.now() - 7 * 86_400_000).toISOString();
    const refused = await postPhoto(
      checkId,
      new Uint8Array(await lawnImage(320, 240, 0.4)),
      lastWeek,
    );
    expect(refused.status).toBe(422);
    expect(refused.body.error?.fieldErrors?.capturedAt?.[0]).toMatch(/within the visit/);
    const rows = await testDb()
      .selectFrom("photos")
      .select("id")
      .where("zone_check_id", "=", checkId)
      .execute();
    expect(rows).toHaveLength(2); // the two of the test before
  });

  it("an application replayed under its id answers the stored one, also at once", async () => {
    // Lime: no nitrogen or phosphorus, so no seasonal fertilizer rule refuses it on any date.
    const productId = (
      await testDb()
        .selectFrom("products")
        .select("id")
        .where("company_id", "=", c.companyId)
        .where("is_pesticide", "=", false)
        .where("n_pct", "=", 0)
        .where("p2o5_pct", "=", 0)
        .executeTakeFirstOrThrow()
    ).id;
    const body = {
      id: newId(),
      zoneId: zoneIds[0]!,
      productId,
      rateAmount: 0.5,
      rateUnit: "lb/1000ft2",
      appliedAt: new Date(Date.now() - 20 * 60_000).toISOString(),
      windMph: 4,
      temperatureF: 68,
      isEstablishing: false,
      applicatorName: "",
      applicatorLicence: "",
      overrideReason: null,
    };
    const send = async () => {
      const response = await applicationRoute.POST(json("POST", body), visitParams());
      return { status: response.status, body: (await response.json()) as { id: string } };
    };
    const [a, b] = await Promise.all([send(), send()]);
    const c3 = await send();
    for (const r of [a, b, c3]) expect(r.body.id, JSON.stringify(r.body)).toBe(body.id);
    const rows = await testDb()
      .selectFrom("applications")
      .select("id")
      .where("id", "=", body.id)
      .execute();
    expect(rows).toHaveLength(1);
  });

  it("finish: two at once and one more finish the visit once and queue one report e-mail per homeowner", async () => {
    for (const zoneId of zoneIds.slice(3))
      await putCheck(newId(), { ...doneCheck(zoneId), baseVersion: 0 });
    const mailOf = () =>
      testDb()
        .selectFrom("mail_outbox")
        .select(["dedupe_key"])
        .where("dedupe_key", "like", `visit_report:${visitId}:%`)
        .execute();
    const [a, b] = await Promise.all([finish(), finish()]);
    const afterTwo = await mailOf();
    const again = await finish();
    for (const r of [a, b, again]) expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(again.body.status).toBe("completed");
    const mail = await mailOf();
    const homeowners = await testDb()
      .selectFrom("property_homeowners")
      .select("user_id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .execute();
    expect(homeowners.length).toBeGreaterThan(0);
    expect(mail.length).toBeGreaterThan(0);
    expect(mail).toEqual(afterTwo);
    expect(new Set(mail.map((m) => m.dedupe_key)).size).toBe(mail.length);
    const audit = await testDb()
      .selectFrom("audit_events")
      .select("id")
      .where("visit_id", "=", visitId)
      .where("action", "=", "finish")
      .execute();
    expect(audit).toHaveLength(1);
  });
});
