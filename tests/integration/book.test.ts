// The manager's book: summaries kept by the write paths, "needs attention" first with reasons,
// filters (declining shows exactly the declining properties), keyset pages that neither skip nor
// repeat rows while rows are added, and a CSV of the filtered view with the same rows.
import { randomUUID } from "node:crypto";
import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { DEMO_PRODUCTS } from "@/fixtures/demo/products";
import { pastRounds } from "@/fixtures/demo/rounds";
import { demoCompany, otherCompany } from "@/fixtures/demo/scenario";
import { afterWrite } from "@/lib/after-write";
import { evaluateProperty } from "@/lib/after-write/sweep";
import type { Actor } from "@/lib/auth/actor";
import { getTeamActivity, listBook } from "@/lib/book/queries";
import { bookQuery } from "@/lib/book/schemas";
import { addDays, todayIn } from "@/lib/dates";
import { createProperty, setPropertyArchived } from "@/lib/properties/mutations";
import { resolveAlert } from "@/lib/risk-alerts/mutations";
import { getPropertyScoreHistory } from "@/lib/scoring/queries";
import { scheduleVisit } from "@/lib/visits/mutations";

import { BOOK_KEYS } from "../helpers/csv-columns";
import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

let c: TestCompany;
let other: TestCompany;
const q = (o: Record<string, unknown> = {}) => bookQuery.parse(o);
const today = todayIn("America/New_York");

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  for (const id of Object.values(c.propertyIds))
    await evaluateProperty(testDb(), c.companyId, id, { provider: null });
});

describe("the book", () => {
  it("puts the properties that need attention first, each with its reasons", async () => {
    const { rows, total } = await listBook(await c.actor("manager"), q());
    expect(total).toBe(6);
    expect(rows[0]!.name).toBe("Haddad residence");
    expect(rows[0]!.reasons).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^Declining \d+\.\d points \/ 30 days$/),
        "1 high alert",
      ]),
    );
    const scores = rows.map((r) => r.attentionScore);
    expect(scores).toEqual([...scores].sort((a, b) => b - a));
    // The year's N at Oyelaran: the feedings of the demo's rounds this calendar year (every zone
    // gets the same rate), rate × N % of each product.
    const oyelaran = demoCompany.properties.find((p) => p.key === "oyelaran")!;
    const ytd = pastRounds(demoCompany.schedule!, oyelaran, today)
      .filter((v) => v.application && addDays(today, -v.daysAgo).slice(0, 4) === today.slice(0, 4))
      .reduce((sum, v) => {
        const product = DEMO_PRODUCTS.find((p) => p.name === v.application!.product)!;
        return sum + (v.application!.rateLbPer1000 * product.nPct) / 100;
      }, 0);
    expect(rows.find((r) => r.name === "Oyelaran residence")!.nYtdLb).toBeCloseTo(ytd, 2);
  });

  it("declining shows exactly the properties whose property-index trend is declining", async () => {
    const manager = await c.actor("manager");
    const expected: string[] = [];
    for (const [key, id] of Object.entries(c.propertyIds)) {
      const h = await getPropertyScoreHistory(manager, id, { weather: false });
      if (h.trend?.word === "declining")
        expected.push(c.scenario.properties.find((p) => p.key === key)!.name);
    }
    const { rows } = await listBook(manager, q({ trend: "declining", limit: 100 }));
    expect(rows.map((r) => r.name).sort()).toEqual(expected.sort());
    expect(expected.length).toBeGreaterThan(0);
  });

  it("filters by technician, alert kind and severity, text, and refuses other roles", async () => {
    const manager = await c.actor("manager");
    expect(
      (await listBook(manager, q({ technician: c.userIds["tech2"] }))).rows
        .map((r) => r.name)
        .sort(),
    ).toEqual(["Brandvold residence", "Hollis Mill Commons (HOA green)", "Okafor residence"]);
    expect((await listBook(manager, q({ kind: "torn_tips" }))).rows.map((r) => r.name)).toEqual([
      "Oyelaran residence",
    ]);
    expect(
      (await listBook(manager, q({ severity: "high" }))).rows.map((r) => r.name).sort(),
    ).toEqual(["Haddad residence", "Kowalczyk residence"]);
    expect((await listBook(manager, q({ q: "sedgefield" }))).rows.map((r) => r.name)).toEqual([
      "Haddad residence",
    ]);
    expect((await listBook(manager, q({ q: "%" }))).rows).toEqual([]);
    await expect(listBook(await c.actor("tech1"), q())).rejects.toMatchObject({
      code: "forbidden",
    });
    expect((await listBook(await other.actor("manager"), q())).rows.map((r) => r.name)).toEqual([
      "Aaland residence",
    ]);
  });

  it("shows a property from the moment it is created, finds it by postal code or any case, and drops it when archived", async () => {
    const manager = await c.actor("manager");
    const before = (await listBook(manager, q())).total;
    // No visit, no refresh: the summary row comes with the property (a database trigger).
    const created = await createProperty(manager, {
      name: "Quillfeather Cottage",
      street: "9 Brackenridge Row",
      city: "Larkfield",
      region: "NJ",
      postalCode: "08599",
      latitude: 40.3,
      longitude: -74.7,
      timeZone: "America/New_York",
      ruleSetId: null,
      technicianId: null,
      notes: "",
      customerPhone: "",
      accessNotes: "",
    });
    expect((await listBook(manager, q())).total).toBe(before + 1);
    for (const text of ["QUILLFEATHER", "brackenridge", "08599"]) {
      const found = await listBook(manager, q({ q: text }));
      expect(found.rows.map((r) => r.name)).toEqual(["Quillfeather Cottage"]);
      expect(found.total).toBe(1);
    }
    const row = (await listBook(manager, q({ q: "Quillfeather" }))).rows[0]!;
    expect(row).toMatchObject({
      lastVisitOn: null,
      latestIndex: null,
      trendWord: null,
      attentionScore: 0,
      alerts: { high: 0, moderate: 0, low: 0 },
    });
    // The count of a view filtered on the summary agrees with its rows.
    const none = await listBook(manager, q({ trend: "none", limit: 100 }));
    expect(none.total).toBe(none.rows.length);
    expect(none.rows.map((r) => r.name)).toContain("Quillfeather Cottage");
    await setPropertyArchived(manager, created.id, true);
    expect((await listBook(manager, q({ q: "Quillfeather" }))).total).toBe(0);
    expect((await listBook(manager, q())).total).toBe(before);
  });

  it("keeps the summary current: a visit scheduled, an alert resolved", async () => {
    const manager = await c.actor("manager");
    const okafor = c.propertyIds["okafor"]!;
    await scheduleVisit(manager, {
      id: randomUUID(),
      propertyId: okafor,
      scheduledFor: addDays(today, 9),
      technicianId: c.userIds["tech2"]!,
      plannedService: "inspection",
      stopOrder: 0,
      notes: "",
    });
    const row = (await listBook(manager, q({ q: "Okafor" }))).rows[0]!;
    expect(row.nextVisitOn).toBe(addDays(today, 9));
    const high = await testDb()
      .selectFrom("risk_alerts")
      .select("id")
      .where("property_id", "=", c.propertyIds["kowalczyk"]!)
      .where("severity", "=", "high")
      .executeTakeFirstOrThrow();
    await resolveAlert(
      manager,
      high.id,
      "Overseeded with shade-tolerant fescue; pruning the oaks.",
    );
    expect((await listBook(manager, q({ q: "Kowalczyk" }))).rows[0]!.alerts.high).toBe(0);
  });

  it("keyset pages neither skip nor repeat rows while rows are added between pages", async () => {
    const manager = await c.actor("manager");
    for (const sort of ["attention", "name", "index", "next"] as const) {
      const before = (await listBook(manager, q({ sort, limit: 100 }))).rows.map(
        (r) => r.propertyId,
      );
      const seen: string[] = [];
      let after: string | undefined;
      let added = 0;
      for (;;) {
        const page = await listBook(manager, q({ sort, limit: 2, after }));
        seen.push(...page.rows.map((r) => r.propertyId));
        if (!page.nextCursor) break;
        after = page.nextCursor;
        // A property added between two pages (it may sort before or after the cursor).
        const { id } = await testDb()
          .insertInto("properties")
          .values({
            company_id: c.companyId,
            name: `${["Aardvark", "Mid", "Zephyr"][added % 3]} lot ${sort} ${added}`,
            street: "1 New Lane",
            city: "Larkfield",
            region: "NJ",
            postal_code: "08561",
            latitude: 40.33,
            longitude: -74.74,
            time_zone: "America/New_York",
          })
          .returning("id")
          .executeTakeFirstOrThrow();
        await testDb()
          .transaction()
          .execute((trx) =>
            afterWrite(trx, { companyId: c.companyId, propertyId: id, alerts: "keep" }),
          );
        added++;
      }
      const original = seen.filter((id) => before.includes(id));
      expect(new Set(seen).size).toBe(seen.length); // no repeats
      expect(original.sort()).toEqual([...before].sort()); // no skips
    }
  });

  it("the CSV of a filtered view has the same rows, in the same order, as the table", async () => {
    current = await c.actor("manager");
    const route = await import("@/app/api/v1/book/export/route");
    for (const view of [{}, { trend: "declining" }, { sort: "name", dir: "desc" }, { q: "lot" }]) {
      const table: string[] = [];
      let after: string | undefined;
      do {
        const page = await listBook(current, q({ ...view, after, limit: 3 }));
        table.push(...page.rows.map((r) => r.name));
        after = page.nextCursor ?? undefined;
      } while (after);
      const res = await route.GET(
        new Request(
          `http://localhost/api/v1/book/export?${new URLSearchParams(view as Record<string, string>)}`,
        ),
      );
      expect(res.status).toBe(200);
      expect(res.headers.get("content-type")).toContain("text/csv");
      const bytes = new Uint8Array(await res.arrayBuffer());
      expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]); // UTF-8 byte-order mark
      const records = parse(new TextDecoder().decode(bytes), { columns: BOOK_KEYS }) as {
        property: string;
        last_visit: string;
      }[];
      expect(records.map((r) => r.property)).toEqual(table);
      for (const r of records)
        if (r.last_visit) expect(r.last_visit).toMatch(/^\d{2}\/\d{2}\/\d{4}$/); // US dates
    }
  });

  it("neutralises formula-like cells in the CSV", async () => {
    current = await c.actor("manager");
    const { id } = await testDb()
      .insertInto("properties")
      .values({
        company_id: c.companyId,
        name: '=HYPERLINK("x")',
        street: "+1 Plus Way",
        city: "-Minus",
        region: "NJ",
        postal_code: "08561",
        latitude: 40.33,
        longitude: -74.74,
        time_zone: "America/New_York",
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    await testDb()
      .transaction()
      .execute((trx) =>
        afterWrite(trx, { companyId: c.companyId, propertyId: id, alerts: "keep" }),
      );
    const route = await import("@/app/api/v1/book/export/route");
    const text = await (
      await route.GET(new Request("http://localhost/api/v1/book/export?q=HYPERLINK"))
    ).text();
    const [row] = parse(text, { columns: BOOK_KEYS }) as {
      property: string;
      street: string;
      city: string;
    }[];
    expect(row).toMatchObject({
      property: '\'=HYPERLINK("x")',
      street: "'+1 Plus Way",
      city: "'-Minus",
    });
  });

  it("shows each technician's last eight weeks (managers only)", async () => {
    const { technicians } = await getTeamActivity(await c.actor("manager"));
    const luis = technicians.find((t) => t.name === "Luis Arroyo")!;
    expect(luis.visits).toBe(6); // the demo visits 42 and 21 days ago at his three properties
    expect(luis.checksPerVisit).toBeCloseTo(3, 9); // (3 + 2 + 4 zones) / 3 properties
    expect(luis.weeks.reduce((s, w) => s + w.visits, 0)).toBe(6);
    await expect(getTeamActivity(await c.actor("tech1"))).rejects.toMatchObject({
      code: "forbidden",
    });
  });
});
