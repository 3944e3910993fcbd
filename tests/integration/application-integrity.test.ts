// Record integrity: an application is legal evidence, so every path that writes one goes through
// the same time binding and the same rule and label checks.
// 1. The finding (issue: "an application can be dated anywhere"), replayed through the route
//    users hit, POST /api/v1/visits/{id}/applications: a New Jersey visit on 2 December (in the
//    professional blackout, N.J.S.A. 58:10A-62b) is refused without a time, and stays refused with
//    the times that used to slip past (2026-11-25, 2019-06-01, 2099-06-01): nothing stored.
// 2. A time within the visit but away from it is kept and audited; a finished visit's
//    application without a time is dated at the finish and judged on that date.
// 3. Every writer in the source tree: only lib/applications/mutations.ts and the demo seed insert
//    applications, both through assessApplication; the seed refuses a scenario that breaks a rule.
import { randomUUID } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { join, relative } from "node:path";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { demoCompany } from "@/fixtures/demo/scenario";
import { seedCompany } from "@/fixtures/demo/seed-scenario";
import type { Actor } from "@/lib/auth/actor";
import { listProducts } from "@/lib/products/queries";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
const route = await import("@/app/api/v1/visits/[visitId]/applications/route");

let c: TestCompany;
let zoneId: string;
let feed: string; // Autumn Anchor 20-0-10: within New Jersey's N limits at 3 lb

interface Reply {
  appliedAt?: string;
  appliedOn?: string;
  error?: { fieldErrors: Record<string, string[]>; details: { findings: { key: string }[] } };
}

async function post(visitId: string, body: Record<string, unknown>) {
  const res = await route.POST(
    new Request(`http://localhost/api/v1/visits/${visitId}/applications`, {
      method: "POST",
      headers: {
        origin: "http://localhost:3000",
        host: "localhost",
        "content-type": "application/json",
      },
      body: JSON.stringify(body),
    }),
    { params: Promise.resolve({ visitId }) },
  );
  return { status: res.status, json: (await res.json()) as Reply };
}

const body = (extra: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  zoneId,
  productId: feed,
  rateAmount: 3,
  rateUnit: "lb/1000ft2",
  windMph: 3,
  temperatureF: 45,
  isEstablishing: false,
  applicatorName: "",
  applicatorLicence: "",
  overrideReason: null,
  // An application added to a finished visit is a correction and says why (an open visit's ignores it).
  correctionReason: "entered after the visit",
  ...extra,
});

async function visit(startedAt: string, completedAt: string | null) {
  const id = randomUUID();
  await testDb()
    .insertInto("visits")
    .values({
      id,
      company_id: c.companyId,
      property_id: c.propertyIds["haddad"]!,
      technician_id: c.userIds["tech1"]!,
      scheduled_for: startedAt.slice(0, 10),
      planned_service: "feeding_round",
      status: completedAt ? "completed" : "in_progress",
      started_at: new Date(startedAt),
      started_by: c.userIds["tech1"]!,
      completed_at: completedAt ? new Date(completedAt) : null,
      completed_by: completedAt ? c.userIds["tech1"]! : null,
    })
    .execute();
  return id;
}

const rows = async (visitId: string) =>
  testDb()
    .selectFrom("applications")
    .select(["id", "applied_on", "applied_at"])
    .where("visit_id", "=", visitId)
    .execute();
const audits = async (entityId: string) =>
  testDb()
    .selectFrom("audit_events")
    .select(["action", "changes"])
    .where("entity_id", "=", entityId)
    .execute();

beforeAll(async () => {
  c = await createTestCompany();
  zoneId = (
    await testDb()
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .where("name", "=", "Back yard")
      .executeTakeFirstOrThrow()
  ).id;
  feed = (await listProducts(await c.actor("manager"))).find((p) =>
    p.name.startsWith("Autumn Anchor"),
  )!.id;
});

describe("POST /api/v1/visits/{id}/applications: the time is the visit's", () => {
  it("a 2 December New Jersey visit: refused without a time, and with the times that used to slip past", async () => {
    current = await c.actor("manager");
    // Finished on 2 December 2025: a manager's correction without a time is dated at the finish.
    const visitId = await visit("2025-12-02T09:00:00-05:00", "2025-12-02T10:00:00-05:00");
    const none = await post(visitId, body());
    expect(none.status).toBe(422);
    expect(none.json.error!.details.findings.map((f) => f.key)).toContain("blackout");
    for (const appliedAt of [
      "2026-11-25T10:00:00-05:00",
      "2019-06-01T10:00:00-04:00",
      "2099-06-01T10:00:00-04:00",
      "2025-12-01T10:00:00-05:00", // the day before the visit: the blackout's last free day
    ]) {
      const b = body({ appliedAt });
      const r = await post(visitId, b);
      expect(r.status, appliedAt).toBe(422);
      expect(r.json.error!.fieldErrors.appliedAt![0], appliedAt).toMatch(
        /^An application is recorded at the time of its visit: between Dec 2, 2025, 7:00\sAM and Dec 2, 2025, 12:00\sPM\.$/,
      );
      expect(await audits(b.id)).toEqual([]);
    }
    expect(await rows(visitId)).toEqual([]);
  });

  it("an open visit (technician): a time within the visit but away from now is kept and audited", async () => {
    current = await c.actor("tech1");
    const visitId = await visit("2025-10-06T08:00:00-04:00", null);
    const b = body({ appliedAt: "2025-10-06T09:30:00-04:00" });
    const r = await post(visitId, b);
    expect(r.status).toBe(201);
    expect(r.json.appliedOn).toBe("2025-10-06");
    const [event] = await audits(b.id);
    expect(event!.action).toBe("applied_at_differs");
    expect(JSON.stringify(event!.changes)).toContain("2025-10-06T13:30:00.000Z");
    // Two hours and a minute before the start is outside the visit.
    expect((await post(visitId, body({ appliedAt: "2025-10-06T05:59:00-04:00" }))).status).toBe(
      422,
    );
  });

  it("a finished visit: a correction without a time is dated at the finish and judged on that date", async () => {
    current = await c.actor("manager");
    const visitId = await visit("2025-10-20T08:00:00-04:00", "2025-10-20T09:00:00-04:00");
    const b = body();
    const r = await post(visitId, b);
    expect(r.status).toBe(201);
    expect(r.json.appliedAt).toBe("2025-10-20T13:00:00.000Z");
    expect(r.json.appliedOn).toBe("2025-10-20");
    expect((await audits(b.id)).map((e) => e.action)).not.toContain("applied_at_differs");
  });
});

describe("every path that writes an application", () => {
  const root = join(__dirname, "..", "..");
  const files = (dir: string): string[] =>
    readdirSync(join(root, dir), { withFileTypes: true }).flatMap((e) =>
      e.isDirectory()
        ? ["node_modules", ".next", "migrations"].includes(e.name)
          ? []
          : files(join(dir, e.name))
        : /\.(ts|tsx|mjs|js)$/.test(e.name)
          ? [join(dir, e.name)]
          : [],
    );
  // Anything that can put or change a row of applications: Kysely, a helper taking the table's
  // name, or SQL text.
  const WRITES =
    /insertInto\(\s*["']applications["']|updateTable\(\s*["']applications["']|["']applications["']\s*,\s*APPLICATION_COLUMNS|\b(insert\s+into|update|copy)\s+applications\b/i;
  // The benchmark fills its own database (sward_bench) with synthetic rows; no user reaches it.
  const NOT_A_USER_PATH = new Set(["tests/bench/seed.ts"]);

  it("only the API's mutation and the demo seed write applications, both through assessApplication", () => {
    const writers = ["app", "lib", "components", "fixtures", "jobs", "db", "tests/bench"]
      .flatMap(files)
      .map((f) => relative(root, join(root, f)))
      .filter((f) => WRITES.test(readFileSync(join(root, f), "utf8")))
      .filter((f) => !NOT_A_USER_PATH.has(f))
      .sort();
    expect(writers).toEqual(["fixtures/demo/seed-scenario.ts", "lib/applications/mutations.ts"]);
    for (const f of writers) {
      const text = readFileSync(join(root, f), "utf8");
      expect(text, f).toMatch(/assessApplication\(/);
    }
    // The mutation binds the time to the visit before it assesses.
    const mutation = readFileSync(join(root, "lib/applications/mutations.ts"), "utf8");
    expect(mutation.indexOf("bindAppliedAt(")).toBeGreaterThan(0);
    expect(mutation.indexOf("bindAppliedAt(")).toBeLessThan(mutation.indexOf("assessApplication("));
  });

  it("the one route that records applications calls the mutation; no server action does", () => {
    const callers = ["app", "lib", "components"]
      .flatMap(files)
      .filter((f) => /recordApplication\(/.test(readFileSync(join(root, f), "utf8")))
      .map((f) => relative(root, join(root, f)))
      .sort();
    expect(callers).toEqual([
      "app/api/v1/visits/[visitId]/applications/route.ts",
      "lib/applications/mutations.ts",
    ]);
    for (const f of ["app", "lib", "components"].flatMap(files)) {
      const text = readFileSync(join(root, f), "utf8");
      if (/^["']use server["']/m.test(text)) expect(text, f).not.toMatch(/applications/);
    }
  });

  it("the seed refuses a scenario application that breaks the label or the law", async () => {
    const schedule = demoCompany.schedule!;
    // The round on a seeded day decides what the history puts down (fixtures/demo/rounds.ts):
    // seeded on 2026-06-15 the April visit is a feeding, on 2026-10-20 the September one an
    // aeration with its starter.
    const broken = (
      service: "feeding_round" | "aeration_overseeding",
      application: { product: string; rateLbPer1000: number },
    ) => ({
      ...demoCompany,
      slug: `t-broken-${randomUUID().slice(0, 8)}`,
      people: demoCompany.people.map((p) => ({
        ...p,
        email: `${p.key}.${randomUUID().slice(0, 8)}@test.sward.test`,
      })),
      schedule: {
        ...schedule,
        treatments: { ...schedule.treatments, [service]: application },
      },
    });
    await expect(
      seedCompany(
        testDb(),
        broken("feeding_round", { product: "Larkmoor Steadyfeed 24-0-8", rateLbPer1000: 4.5 }),
        "x-password-2026",
        "2026-06-15",
      ),
    ).rejects.toThrow(/label's maximum of 4\.2/);
    await expect(
      seedCompany(
        testDb(),
        broken("aeration_overseeding", {
          product: "Rootstart 18-24-12 (starter)",
          rateLbPer1000: 2,
        }),
        "x-password-2026",
        "2026-10-20",
      ),
    ).rejects.toThrow(/Phosphorus/);
  });
});
