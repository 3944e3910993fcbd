// `npm run db:recompute-index` (jobs/recompute-index.ts → lib/after-write/recompute-all.ts): after
// the stored Indexes are out of date (a change of weights), the recompute brings the checks, the
// book row and the alerts up to date together — through afterWrite, as every other write does —
// so the book API shows the recomputed Index at once and the sweep has nothing left to do.
import { beforeAll, describe, expect, it, vi } from "vitest";

import { afterWrite } from "@/lib/after-write";
import { recomputeAllIndexes } from "@/lib/after-write/recompute-all";
import { evaluateProperty } from "@/lib/after-write/sweep";
import type { Actor } from "@/lib/auth/actor";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
const book = await import("@/app/api/v1/book/route");

let c: TestCompany;
let propertyId: string;

async function bookIndex(): Promise<number | null> {
  const res = await book.GET(
    new Request("http://localhost/api/v1/book?limit=100", {
      headers: { origin: "http://localhost:3000", host: "localhost" },
    }),
    { params: Promise.resolve({}) },
  );
  const page = (await res.json()) as {
    rows: { propertyId: string; latestIndex: number | null }[];
  };
  return page.rows.find((r) => r.propertyId === propertyId)!.latestIndex;
}

beforeAll(async () => {
  c = await createTestCompany();
  propertyId = c.propertyIds["oyelaran"]!;
  current = await c.actor("manager");
});

describe("recomputing every stored Index", () => {
  it("restores stale Indexes and the book row in the same step, property by property", async () => {
    const correct = await bookIndex();
    expect(correct).not.toBeNull();
    // Stale stored Indexes, as after a change of the weights: every check of the property reads 1
    // and the book row is written from them.
    const visitIds = (
      await testDb()
        .selectFrom("visits")
        .select("id")
        .where("property_id", "=", propertyId)
        .execute()
    ).map((v) => v.id);
    await testDb()
      .updateTable("zone_checks")
      .set({ sward_index: 1 })
      .where("visit_id", "in", visitIds)
      .where("sward_index", "is not", null)
      .execute();
    await testDb()
      .transaction()
      .execute((trx) => afterWrite(trx, { companyId: c.companyId, propertyId, alerts: "keep" }));
    expect(await bookIndex()).toBe(1);

    const r = await recomputeAllIndexes(testDb(), { companyIds: [c.companyId] });
    expect(r.properties).toBe(Object.keys(c.propertyIds).length);
    expect(r.changed).toBeGreaterThan(0);
    expect(await bookIndex()).toBe(correct);

    // Nothing left for the daily sweep: the alerts were evaluated in the same step.
    const s = await evaluateProperty(testDb(), c.companyId, propertyId, { provider: null });
    expect(s.raised + s.reopened + s.updated + s.cleared + s.autoResolved).toBe(0);
    // A second run changes nothing.
    expect((await recomputeAllIndexes(testDb(), { companyIds: [c.companyId] })).changed).toBe(0);
  });

  it("touches only the companies named", async () => {
    const other = await createTestCompany();
    const r = await recomputeAllIndexes(testDb(), { companyIds: [other.companyId] });
    expect(r.properties).toBe(Object.keys(other.propertyIds).length);
    expect(await recomputeAllIndexes(testDb(), { companyIds: [] })).toEqual({
      properties: 0,
      checks: 0,
      changed: 0,
    });
  });
});
