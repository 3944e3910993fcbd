// Soil tests through the route handlers the property page posts to: who may record, read and
// delete; the bounds in words (the property's own day for dates); a replay and a second copy of
// one sample; a lab's CSV file (preview, all rows or none, re-imported adds nothing); and the
// phosphorus rule of New Jersey reading the latest soil test and its age (P.L.2010, c.112,
// s.11b(1): a soil test "performed no more than three years before the application" that shows
// phosphorus is needed).
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import { recordApplication } from "@/lib/applications/mutations";
import type { Actor } from "@/lib/auth/actor";
import { addDays, todayIn } from "@/lib/dates";
import { listProducts } from "@/lib/products/queries";
import type { SoilTestDto, SoilTestImportDto } from "@/lib/soil-tests/dto";
import type { SoilTestInput } from "@/lib/soil-tests/schemas";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { callRoute } from "../helpers/route-call";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const listRoute = await import("@/app/api/v1/properties/[propertyId]/soil-tests/route");
const importRoute = await import("@/app/api/v1/properties/[propertyId]/soil-tests/import/route");
const oneRoute = await import("@/app/api/v1/soil-tests/[soilTestId]/route");

let c: TestCompany;
let other: TestCompany;
let manager: Actor;
let tech1: Actor;
let tech2: Actor;
let owner: Actor;
let otherManager: Actor;
let haddad: string;
let backYard: string;
const db = testDb();
const today = todayIn("America/New_York");

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [manager, tech1, tech2, owner, otherManager] = await Promise.all([
    c.actor("manager"),
    c.actor("tech1"),
    c.actor("tech2"),
    c.actor("owner2"),
    other.actor("manager"),
  ]);
  haddad = c.propertyIds["haddad"]!; // tech1's, New Jersey
  backYard = (
    await db
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", haddad)
      .where("name", "=", "Back yard")
      .executeTakeFirstOrThrow()
  ).id;
});

const sample = (over: Partial<SoilTestInput> = {}): SoilTestInput => ({
  id: randomUUID(),
  zoneId: null,
  sampledOn: addDays(today, -30),
  lab: "Pinebrook Soil Lab",
  sampleDepthIn: 4,
  extractant: "mehlich3",
  ph: 6.1,
  bufferPh: null,
  bufferMethod: null,
  organicMatterPct: 3.2,
  pPpm: 14,
  kPpm: 52,
  caPpm: 880,
  mgPpm: 110,
  sPpm: 9,
  labLimeLbPer1000: null,
  labPhosphorusNeeded: null,
  notes: "",
  ...over,
});

async function record(as: Actor, body: unknown, propertyId = haddad) {
  current = as;
  return callRoute<SoilTestDto>(listRoute.POST, body, { params: { propertyId } });
}
async function importCsv(as: Actor, csv: string, preview = false, propertyId = haddad) {
  current = as;
  return callRoute<SoilTestImportDto>(
    importRoute.POST,
    { csv, preview },
    { params: { propertyId } },
  );
}
const count = async (propertyId = haddad) =>
  Number(
    (
      await db
        .selectFrom("soil_tests")
        .select((eb) => eb.fn.countAll().as("n"))
        .where("property_id", "=", propertyId)
        .executeTakeFirstOrThrow()
    ).n,
  );

describe("recording a soil test", () => {
  it("a manager and the property's technician record; the answer carries the reading", async () => {
    const byManager = await record(manager, sample({ lab: "Reader lab A" }));
    expect(byManager.status).toBe(201);
    const p = byManager.body.reading.elements.find((e) => e.element === "p")!;
    expect(p).toMatchObject({ ppm: 14, guidelinePpm: 21, meets: false, amountOf: "P₂O₅" });
    expect(byManager.body.reading.showsPhosphorusNeed).toBe(true);
    expect(byManager.body.recordedBy).toBe("Dana Whitcombe");
    const byTech = await record(tech1, sample({ lab: "Reader lab B", zoneId: backYard }));
    expect(byTech.status).toBe(201);
    expect(byTech.body.zone).toEqual({ id: backYard, name: "Back yard" });
  });

  it("another technician, another company: not found; a homeowner: refused", async () => {
    const before = await count();
    expect((await record(tech2, sample())).status).toBe(404);
    expect((await record(otherManager, sample())).status).toBe(404);
    expect((await record(owner, sample())).status).toBe(403);
    current = tech2;
    expect(
      (await callRoute(listRoute.GET, null, { method: "GET", params: { propertyId: haddad } }))
        .status,
    ).toBe(404);
    expect(await count()).toBe(before);
  });

  it("refuses values outside a lab report's range, in words naming the field", async () => {
    const cases: [Partial<SoilTestInput>, string, string][] = [
      [{ ph: 10.1 }, "ph", "Soil pH: at most 10."],
      [{ ph: 2.9 }, "ph", "Soil pH: at least 3."],
      [{ kPpm: -1 }, "kPpm", "Potassium (K): at least 0 ppm."],
      [{ caPpm: 20_001 }, "caPpm", "Calcium (Ca): at most 20,000 ppm."],
      [{ sampleDepthIn: 0.5 }, "sampleDepthIn", "Sample depth: at least 1 in."],
      [{ sampleDepthIn: 13 }, "sampleDepthIn", "Sample depth: at most 12 in."],
      [
        { bufferPh: 6.4 },
        "bufferMethod",
        "Buffer: say which buffer the lab used for the buffer pH.",
      ],
      [
        { ph: null, pPpm: null, kPpm: null, caPpm: null, mgPpm: null, sPpm: null },
        "ph",
        "Enter the soil pH or at least one nutrient from the lab report.",
      ],
      [{ lab: "  " }, "lab", "Lab: the laboratory's name is required."],
      [{ sampledOn: "04/15/2026" }, "sampledOn", "Date sampled: a date like 2026-04-15."],
      [
        { sampledOn: addDays(today, -3660) },
        "sampledOn",
        "Date sampled: within the last ten years.",
      ],
      [
        { lab: "Lab\u0000" },
        "lab",
        "Remove the control characters (such as a NUL byte) from this text; they cannot be stored.",
      ],
    ];
    for (const [over, field, words] of cases) {
      const answer = await record(manager, sample(over));
      expect(answer.status, field).toBe(422);
      expect(answer.body.error!.fieldErrors![field], JSON.stringify(over)).toEqual([words]);
    }
  });

  it("checks the date against the property's own day and the zone against the property", async () => {
    const tomorrow = await record(manager, sample({ sampledOn: addDays(today, 1) }));
    // The device's clock allows a day of slack; the property's day does not.
    expect(tomorrow.status).toBe(422);
    expect(tomorrow.body.error!.fieldErrors!.sampledOn![0]).toMatch(
      /^Date sampled: not in the future \(today is /,
    );
    const otherZone = (
      await db
        .selectFrom("zones")
        .select("id")
        .where("property_id", "=", c.propertyIds["okafor"]!)
        .executeTakeFirstOrThrow()
    ).id;
    const wrongZone = await record(manager, sample({ zoneId: otherZone }));
    expect(wrongZone.body.error!.fieldErrors!.zoneId).toEqual([
      "That zone is not part of this property.",
    ]);
  });

  it("a replay of the same id stores one row; a second copy of one sample is refused in words", async () => {
    const body = sample({ lab: "Replay lab", sampledOn: addDays(today, -40) });
    const [a, b] = await Promise.all([record(tech1, body), record(tech1, body)]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(b.body.id).toBe(body.id);
    const copies = await db
      .selectFrom("soil_tests")
      .select("id")
      .where("lab", "=", "Replay lab")
      .execute();
    expect(copies).toHaveLength(1);
    const again = await record(manager, { ...body, id: randomUUID() });
    expect(again.status).toBe(409);
    expect(again.body.error!.message).toMatch(
      /^A soil test from Replay lab sampled on .+ is already recorded for the whole property\.$/,
    );
  });
});

describe("importing a lab's CSV file", () => {
  const header =
    "Sampled on,Lab,Zone,Depth (in),Extractant,pH,Buffer pH,Buffer method,P ppm,K ppm,Lab P needed";

  it("previews, imports every row, and adds nothing when the same file comes again", async () => {
    const day = addDays(today, -60);
    const [y, m, d] = day.split("-");
    const csv = [
      header,
      `${day},Import lab,,4,Mehlich-3,5.1,6.2,Mehlich,18,30,`,
      `${Number(m)}/${Number(d)}/${y},Import lab,back yard,3,M3,6.4,,,25,41,no`,
      `${day},Import lab,Front slope,4,bray1,6.0,,,9,"1,040",yes`,
    ].join("\r\n");
    const before = await count();
    const preview = await importCsv(manager, csv, true);
    expect(preview.body).toEqual({ rows: 3, added: 3, alreadyRecorded: 0, preview: true });
    expect(await count()).toBe(before);
    const done = await importCsv(tech1, csv);
    expect(done.body).toEqual({ rows: 3, added: 3, alreadyRecorded: 0, preview: false });
    expect(await count()).toBe(before + 3);
    const again = await importCsv(manager, csv);
    expect(again.body).toMatchObject({ added: 0, alreadyRecorded: 3 });

    current = manager;
    const list = await callRoute<{ items: SoilTestDto[] }>(listRoute.GET, null, {
      method: "GET",
      params: { propertyId: haddad },
    });
    const imported = list.body.items.filter((t) => t.lab === "Import lab");
    const whole = imported.find((t) => t.zone === null)!;
    expect(whole.reading.lime).toMatchObject({ kind: "mehlich_buffer", ph: 5.1, bufferPh: 6.2 });
    const back = imported.find((t) => t.zone?.name === "Back yard")!;
    expect(back).toMatchObject({ sampledOn: day, sampleDepthIn: 3, labPhosphorusNeeded: false });
    const bray = imported.find((t) => t.zone?.name === "Front slope")!;
    expect(bray.reading).toMatchObject({ interpreted: false, showsPhosphorusNeed: true });
    expect(bray.ppm.k).toBe(1040);
  });

  it("saves nothing when a row is wrong, and names the row and the column", async () => {
    const day = addDays(today, -70);
    const before = await count();
    const bad = await importCsv(
      manager,
      [
        header,
        `${day},Bad lab,,4,Mehlich-3,6.0,,,20,40,`,
        `${day},Bad lab,Side strip,4,Mehlich-3,6.0,,,20,40,`,
        `${day},Bad lab,,4,Mehlich-3,11,,,abc,40,maybe`,
      ].join("\n"),
    );
    expect(bad.status).toBe(422);
    expect(bad.body.error!.message).toBe(
      "The file has rows that need attention; nothing was imported.",
    );
    expect(bad.body.error!.fieldErrors!.csv).toEqual([
      'Row 3: Zone: "Side strip" is not a zone of this property.',
      'Row 4: P (ppm): "abc" is not a number.',
      "Row 4: Lab P needed: use yes, no or leave it blank.",
    ]);
    expect(await count()).toBe(before);
  });

  it("refuses a file without the format's columns, or without rows", async () => {
    const missing = await importCsv(manager, "Date,Lab,pH\n2026-01-01,X,6");
    expect(missing.body.error!.fieldErrors!.csv).toEqual([
      'Unknown columns: "Date". See the format.',
      "Missing columns: Sampled on, Depth (in), Extractant.",
    ]);
    const empty = await importCsv(manager, header);
    expect(empty.body.error!.fieldErrors!.csv).toEqual([
      "The file needs a header row and at least one row of results.",
    ]);
    const broken = await importCsv(manager, `${header}\n"2026-01-01,unterminated`);
    expect(broken.body.error!.fieldErrors!.csv![0]).toMatch(/^The file is not readable as CSV/);
  });
});

describe("New Jersey's phosphorus rule reads the latest soil test", () => {
  let rootstart: string;
  beforeAll(async () => {
    rootstart = (await listProducts(manager)).find((p) => p.name.startsWith("Rootstart"))!.id;
  });

  /** tech1's visit at the Haddad residence on `day`, under way; a starter (with P) on the back yard. */
  async function phosphorusOn(day: string) {
    const visitId = randomUUID();
    await db
      .insertInto("visits")
      .values({
        id: visitId,
        company_id: c.companyId,
        property_id: haddad,
        technician_id: c.userIds["tech1"]!,
        scheduled_for: day,
        planned_service: "feeding_round",
        status: "in_progress",
        started_at: new Date(`${day}T09:00:00-04:00`),
        started_by: c.userIds["tech1"]!,
      })
      .execute();
    return recordApplication(tech1, visitId, {
      id: randomUUID(),
      zoneId: backYard,
      productId: rootstart,
      rateAmount: 2,
      rateUnit: "lb/1000ft2",
      windMph: 4,
      temperatureF: 68,
      isEstablishing: false,
      applicatorName: "",
      applicatorLicence: "",
      overrideReason: null,
      appliedAt: `${day}T10:00:00-04:00`,
    }).then(
      () => "recorded",
      (err: { details?: { findings?: { key: string }[] } }) =>
        err.details?.findings?.some((f) => f.key === "phosphorus") ? "refused: phosphorus" : err,
    );
  }
  const soil = (sampledOn: string, over: Partial<SoilTestInput> = {}) =>
    record(
      manager,
      sample({ lab: `P rule lab ${sampledOn}`, zoneId: backYard, sampledOn, ...over }),
    );

  it("no test, an old one, a later one without need, and the lab's own word", async () => {
    // The file's other tests are dated within the last months; these visits are in 2025.
    expect(await phosphorusOn("2025-09-10")).toBe("refused: phosphorus");
    // Three years and a day before: too old (s.11b(1)); on the day three years before: counts.
    expect((await soil("2022-09-09", { pPpm: 10 })).status).toBe(201);
    expect(await phosphorusOn("2025-09-10")).toBe("refused: phosphorus");
    expect(await phosphorusOn("2025-09-09")).toBe("recorded");
    // A later test at the guideline shows no need: it outweighs the older one.
    expect((await soil("2024-05-01", { pPpm: 30 })).status).toBe(201);
    expect(await phosphorusOn("2025-06-01")).toBe("refused: phosphorus");
    // Applied before that later test, the older one is the latest: it counts.
    expect(await phosphorusOn("2024-04-30")).toBe("recorded");
    // The lab says phosphorus is needed (its own scale), although above the guideline.
    expect((await soil("2025-07-01", { pPpm: 30, labPhosphorusNeeded: true })).status).toBe(201);
    expect(await phosphorusOn("2025-08-01")).toBe("recorded");
  });
});

describe("deleting a soil test", () => {
  it("managers only, audited with what it held; a second delete finds nothing", async () => {
    const made = await record(
      manager,
      sample({ lab: "Delete me lab", sampledOn: addDays(today, -90) }),
    );
    const id = made.body.id;
    current = tech1;
    expect(
      (await callRoute(oneRoute.DELETE, {}, { method: "DELETE", params: { soilTestId: id } }))
        .status,
    ).toBe(403);
    current = otherManager;
    expect(
      (await callRoute(oneRoute.DELETE, {}, { method: "DELETE", params: { soilTestId: id } }))
        .status,
    ).toBe(404);
    current = manager;
    expect(
      (await callRoute(oneRoute.DELETE, {}, { method: "DELETE", params: { soilTestId: id } }))
        .status,
    ).toBe(204);
    expect(
      (await callRoute(oneRoute.DELETE, {}, { method: "DELETE", params: { soilTestId: id } }))
        .status,
    ).toBe(404);
    const trail = await db
      .selectFrom("audit_events")
      .select(["action", "changes"])
      .where("entity", "=", "soil_test")
      .where("entity_id", "=", id)
      .orderBy("created_at")
      .execute();
    expect(trail.map((t) => t.action)).toEqual(["record", "delete"]);
    expect(trail[1]!.changes).toMatchObject({
      soilTest: { from: { lab: "Delete me lab", p_ppm: 14 }, to: null },
    });
  });
});
