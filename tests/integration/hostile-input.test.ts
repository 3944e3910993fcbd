// fast-check: for every mutating endpoint (route handlers and the public server actions),
// 10,000 malformed payloads each (wrong types, out-of-range values, huge strings, unicode, unknown
// fields, missing fields, prototype-pollution keys, SQL and HTML fragments, non-objects) get 422
// with field errors — never a 5xx, never a stack trace or an SQL error in the body — and change no
// rows. Text a schema would accept but holding NUL, a C0/C1 control or a lone surrogate is 422
// naming the field. HOSTILE_RUNS lowers the count for a quick local run.
import fc from "fast-check";
import { sql } from "kysely";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { z } from "zod";

import { evaluateProperty } from "@/lib/after-write/sweep";
import { applicationSchema } from "@/lib/applications/schemas";
import type { Actor } from "@/lib/auth/actor";
import { signInLinkSchema, signInSchema } from "@/lib/auth/schemas";
import { addDays, todayIn } from "@/lib/dates";
import { acceptInvitationSchema, invitationSchema } from "@/lib/invitations/schemas";
import { productSchema } from "@/lib/products/schemas";
import { propertySchema, zoneSchema } from "@/lib/properties/schemas";
import { acknowledgeSchema, resolveSchema } from "@/lib/risk-alerts/schemas";
import { ruleSetSchema } from "@/lib/rule-sets/schemas";
import {
  finishVisitSchema,
  scheduleVisitSchema,
  startVisitSchema,
  zoneCheckFields,
} from "@/lib/visits/schemas";
import { wateringSchema } from "@/lib/watering/schemas";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { ACCEPTED_SEPARATORS, REFUSED_TEXT } from "../helpers/hostile-text";
import { doneCheck, newId } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
// The sign-in actions read the client address from the request headers.
vi.mock("next/headers", () => ({
  headers: async () => new Headers({ "x-forwarded-for": "198.51.100.77" }),
  cookies: async () => ({ get: () => undefined }),
}));

const RUNS = Number(process.env.HOSTILE_RUNS ?? 10_000);
let c: TestCompany;
let ids: {
  propertyId: string;
  zoneId: string;
  visitId: string;
  techId: string;
  productId: string;
  ruleSetId: string;
  alertId: string;
};

beforeAll(async () => {
  c = await createTestCompany();
  const zone = await testDb()
    .selectFrom("zones")
    .select("id")
    .where("property_id", "=", c.propertyIds["haddad"]!)
    .executeTakeFirstOrThrow();
  const visit = await testDb()
    .selectFrom("visits")
    .select("id")
    .where("property_id", "=", c.propertyIds["haddad"]!)
    .where("status", "=", "scheduled")
    .executeTakeFirstOrThrow();
  const productRow = await testDb()
    .selectFrom("products")
    .select("id")
    .where("company_id", "=", c.companyId)
    .executeTakeFirstOrThrow();
  const ruleSetRow = await testDb()
    .selectFrom("rule_sets")
    .select("id")
    .where("company_id", "=", c.companyId)
    .executeTakeFirstOrThrow();
  await evaluateProperty(testDb(), c.companyId, c.propertyIds["haddad"]!, { provider: null }); // the demo season raises a declining-Index alert
  const alert = await testDb()
    .selectFrom("risk_alerts")
    .select("id")
    .where("company_id", "=", c.companyId)
    .executeTakeFirstOrThrow();
  ids = {
    propertyId: c.propertyIds["haddad"]!,
    zoneId: zone.id,
    visitId: visit.id,
    techId: c.userIds["tech1"]!,
    productId: productRow.id,
    ruleSetId: ruleSetRow.id,
    alertId: alert.id,
  };
});

type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;
interface Parses {
  safeParse(value: unknown): { success: boolean };
}
type ObjectSchema = Parses & { shape: Record<string, Parses> };
interface Endpoint {
  name: string;
  load: () => Promise<Record<string, Handler>>;
  method: "POST" | "PUT";
  params: () => Record<string, string>;
  /** An object schema, full zod or zod/mini (the forms' schemas): its fields and a parse. */
  schema: ObjectSchema;
  valid: () => Record<string, unknown>;
}

const endpoints: Endpoint[] = [
  {
    name: "POST /properties",
    load: () => import("@/app/api/v1/properties/route"),
    method: "POST",
    params: () => ({}),
    schema: propertySchema,
    valid: () => ({
      name: "A",
      street: "1 Elm",
      city: "X",
      region: "NJ",
      postalCode: "08500",
      latitude: 40,
      longitude: -74,
      timeZone: "America/New_York",
      ruleSetId: null,
      technicianId: null,
      notes: "",
    }),
  },
  {
    name: "PUT /properties/:id",
    load: () => import("@/app/api/v1/properties/[propertyId]/route"),
    method: "PUT",
    params: () => ({ propertyId: ids.propertyId }),
    schema: propertySchema,
    valid: () => ({
      name: "A",
      street: "1 Elm",
      city: "X",
      region: "NJ",
      postalCode: "08500",
      latitude: 40,
      longitude: -74,
      timeZone: "America/New_York",
      ruleSetId: null,
      technicianId: null,
      notes: "",
    }),
  },
  {
    name: "POST /properties/:id/archive",
    load: () => import("@/app/api/v1/properties/[propertyId]/archive/route"),
    method: "POST",
    params: () => ({ propertyId: ids.propertyId }),
    schema: z.object({ archived: z.boolean() }).strict(),
    valid: () => ({ archived: true }),
  },
  {
    name: "POST /properties/:id/zones",
    load: () => import("@/app/api/v1/properties/[propertyId]/zones/route"),
    method: "POST",
    params: () => ({ propertyId: ids.propertyId }),
    schema: zoneSchema,
    valid: () => ({
      name: "Z",
      area: 100,
      areaUnit: "ft2",
      grassSpecies: "tall_fescue",
      sunExposure: "shade",
      isIrrigated: false,
      slope: "flat",
    }),
  },
  {
    name: "PUT /zones/:id",
    load: () => import("@/app/api/v1/zones/[zoneId]/route"),
    method: "PUT",
    params: () => ({ zoneId: ids.zoneId }),
    schema: zoneSchema,
    valid: () => ({
      name: "Z",
      area: 100,
      areaUnit: "m2",
      grassSpecies: "tall_fescue",
      sunExposure: "shade",
      isIrrigated: false,
      slope: "flat",
    }),
  },
  {
    name: "POST /zones/:id/archive",
    load: () => import("@/app/api/v1/zones/[zoneId]/archive/route"),
    method: "POST",
    params: () => ({ zoneId: ids.zoneId }),
    schema: z.object({ archived: z.boolean() }).strict(),
    valid: () => ({ archived: false }),
  },
  {
    name: "POST /properties/:id/invitations",
    load: () => import("@/app/api/v1/properties/[propertyId]/invitations/route"),
    method: "POST",
    params: () => ({ propertyId: ids.propertyId }),
    schema: invitationSchema,
    valid: () => ({ email: "new@test.sward.test", name: "N" }),
  },
  {
    name: "POST /visits",
    load: () => import("@/app/api/v1/visits/route"),
    method: "POST",
    params: () => ({}),
    schema: scheduleVisitSchema,
    valid: () => ({
      propertyId: ids.propertyId,
      scheduledFor: addDays(todayIn("America/New_York"), 30),
      technicianId: ids.techId,
      plannedService: "inspection",
    }),
  },
  {
    name: "POST /visits/:id/start",
    load: () => import("@/app/api/v1/visits/[visitId]/start/route"),
    method: "POST",
    params: () => ({ visitId: ids.visitId }),
    schema: startVisitSchema,
    valid: () => ({ latitude: 40, longitude: -74 }),
  },
  {
    name: "POST /visits/:id/finish",
    load: () => import("@/app/api/v1/visits/[visitId]/finish/route"),
    method: "POST",
    params: () => ({ visitId: ids.visitId }),
    schema: finishVisitSchema,
    valid: () => ({}),
  },
  {
    name: "POST /visits/:id/cancel",
    load: () => import("@/app/api/v1/visits/[visitId]/cancel/route"),
    method: "POST",
    params: () => ({ visitId: ids.visitId }),
    schema: z.object({}).strict(),
    valid: () => ({}),
  },
  {
    name: "PUT /visits/:id/zone-checks/:id",
    load: () => import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/route"),
    method: "PUT",
    params: () => ({ visitId: ids.visitId, zoneCheckId: newId() }),
    schema: zoneCheckFields,
    valid: () => ({ ...doneCheck(ids.zoneId) }),
  },
  {
    name: "POST /products",
    load: () => import("@/app/api/v1/products/route"),
    method: "POST",
    params: () => ({}),
    schema: productSchema,
    valid: () => ({
      name: "P",
      form: "granular",
      nPct: 20,
      p2o5Pct: 0,
      k2oPct: 5,
      slowReleasePctOfN: 0,
      densityLbPerGal: null,
      isPesticide: false,
      registrationNumber: "",
      labelCautions: "",
      reentryGuidance: "",
    }),
  },
  {
    name: "PUT /products/:id",
    load: () => import("@/app/api/v1/products/[productId]/route"),
    method: "PUT",
    params: () => ({ productId: ids.productId }),
    schema: productSchema,
    valid: () => ({
      name: "P",
      form: "liquid",
      nPct: 20,
      p2o5Pct: 0,
      k2oPct: 5,
      slowReleasePctOfN: 0,
      densityLbPerGal: 11,
      isPesticide: false,
      registrationNumber: "",
      labelCautions: "",
      reentryGuidance: "",
    }),
  },
  {
    name: "POST /rule-sets",
    load: () => import("@/app/api/v1/rule-sets/route"),
    method: "POST",
    params: () => ({}),
    schema: ruleSetSchema,
    valid: () => ({
      name: "R",
      citation: "",
      limitsAreLaw: false,
      maxNLbPer1000: 1,
      maxWsnLbPer1000: null,
      minSlowReleasePct: null,
      proBlackout: null,
      homeownerBlackout: ["11-15", "03-01"],
      phosphorusRule: "allowed",
      soilTestMaxAgeYears: null,
      recordRetentionYears: 3,
      recordRequiredFields: ["applicator_name"],
      recordFieldsApplyTo: "pesticides",
    }),
  },
  {
    name: "PUT /rule-sets/:id",
    load: () => import("@/app/api/v1/rule-sets/[ruleSetId]/route"),
    method: "PUT",
    params: () => ({ ruleSetId: ids.ruleSetId }),
    schema: ruleSetSchema,
    valid: () => ({
      name: "R",
      citation: "",
      limitsAreLaw: true,
      maxNLbPer1000: 0.9,
      maxWsnLbPer1000: 0.7,
      minSlowReleasePct: 20,
      proBlackout: ["12-01", "03-01"],
      homeownerBlackout: null,
      phosphorusRule: "soil_test_or_establishment",
      soilTestMaxAgeYears: 3,
      recordRetentionYears: 2,
      recordRequiredFields: [],
      recordFieldsApplyTo: "all",
    }),
  },
  {
    name: "POST /visits/:id/applications",
    load: () => import("@/app/api/v1/visits/[visitId]/applications/route"),
    method: "POST",
    params: () => ({ visitId: ids.visitId }),
    schema: applicationSchema,
    valid: () => ({
      id: newId(),
      zoneId: ids.zoneId,
      productId: ids.productId,
      rateAmount: 2,
      rateUnit: "lb/1000ft2",
      windMph: null,
      temperatureF: null,
      isEstablishing: false,
      applicatorName: "",
      applicatorLicence: "",
      overrideReason: null,
    }),
  },
  {
    name: "POST /properties/:id/waterings",
    load: () => import("@/app/api/v1/properties/[propertyId]/waterings/route"),
    method: "POST",
    params: () => ({ propertyId: ids.propertyId }),
    schema: wateringSchema,
    valid: () => ({
      id: newId(),
      zoneId: null,
      wateredOn: addDays(todayIn("America/New_York"), -1),
      depthIn: 0.5,
      runMinutes: null,
      precipitationRateInPerHour: null,
      notes: "",
    }),
  },
  {
    name: "POST /products/:id/archive",
    load: () => import("@/app/api/v1/products/[productId]/archive/route"),
    method: "POST",
    params: () => ({ productId: ids.productId }),
    schema: z.object({ archived: z.boolean() }).strict(),
    valid: () => ({ archived: false }),
  },
  {
    name: "POST /alerts/:id/acknowledge",
    load: () => import("@/app/api/v1/alerts/[alertId]/acknowledge/route"),
    method: "POST",
    params: () => ({ alertId: ids.alertId }),
    schema: acknowledgeSchema,
    valid: () => ({ note: "Looked at it" }),
  },
  {
    name: "POST /alerts/:id/resolve",
    load: () => import("@/app/api/v1/alerts/[alertId]/resolve/route"),
    method: "POST",
    params: () => ({ alertId: ids.alertId }),
    schema: resolveSchema,
    valid: () => ({ note: "Sprayed" }),
  },
];

const junk = fc.oneof(
  fc.anything({ maxDepth: 3 }),
  fc.string({ minLength: 5000, maxLength: 20000 }),
  fc.constantFrom(
    "' OR 1=1 --",
    "'); drop table properties; --",
    "<script>alert(1)</script>",
    '"><img src=x onerror=alert(1)>',
    "\u0000",
    '\r\n{"level":60}',
    "😀".repeat(500),
    "\u202e\u0301\ufeff",
    "NaN",
    "1e309",
    "__proto__",
    "{{7*7}}",
    "${7*7}",
  ),
  // NUL, the other C0 and the C1 controls, lone surrogates, and the line/paragraph separators.
  fc.constantFrom(...REFUSED_TEXT, ...ACCEPTED_SEPARATORS),
  fc
    .tuple(
      fc.string({ maxLength: 20 }),
      fc.constantFrom(...REFUSED_TEXT),
      fc.string({ maxLength: 20 }),
    )
    .map(([a, ch, b]) => a + ch + b),
  fc.string({ unit: "grapheme", maxLength: 200 }),
  fc.double(),
  fc.integer({ min: -1e9, max: 1e9 }),
  fc.constantFrom(null, true, [], {}, -1, 10, 101, 1.5),
);

/** A payload that is certainly invalid for the schema, built by corrupting a valid one. */
function malformed(endpoint: Endpoint) {
  const shape = endpoint.schema.shape;
  const keys = Object.keys(shape);
  const required = keys.filter((k) => !shape[k]!.safeParse(undefined).success);
  return fc
    .oneof(
      // an unknown or prototype-polluting field (schemas are strict)
      fc
        .tuple(
          fc.constantFrom("__proto__", "constructor", "prototype", "isAdmin", "company_id", "role"),
          junk,
        )
        .map(([k, v]) => {
          const body = endpoint.valid();
          Object.defineProperty(body, k, {
            value: v,
            enumerable: true,
            configurable: true,
            writable: true,
          });
          return body;
        }),
      // a field with a value its own schema refuses
      ...(keys.length
        ? [
            fc
              .tuple(fc.constantFrom(...keys), junk)
              .filter(([k, v]) => !shape[k]!.safeParse(v).success)
              .map(([k, v]) => ({ ...endpoint.valid(), [k]: v })),
          ]
        : []),
      // a required field missing
      ...(required.length
        ? [
            fc
              .constantFrom(...required)
              .map((k) =>
                Object.fromEntries(Object.entries(endpoint.valid()).filter(([key]) => key !== k)),
              ),
          ]
        : []),
      // not an object at all
      fc.constantFrom(null, 42, "text", [], [1, 2], true),
    )
    .filter((payload) => {
      // What the server receives is the JSON text: undefined values vanish on the way, so keep only
      // payloads that are still invalid once they have been through JSON.
      const sent: unknown = JSON.parse(JSON.stringify(payload) ?? "null");
      return !endpoint.schema.safeParse(sent).success;
    });
}

async function tableCounts(): Promise<string> {
  const { rows } = await sql<{ t: string; n: number }>`
    select 'properties' t, count(*)::int n from properties union all select 'zones', count(*)::int from zones
    union all select 'visits', count(*)::int from visits union all select 'zone_checks', count(*)::int from zone_checks
    union all select 'users', count(*)::int from users union all select 'audit', count(*)::int from audit_events
    union all select 'products', count(*)::int from products union all select 'rule_sets', count(*)::int from rule_sets
    union all select 'applications', count(*)::int from applications union all select 'waterings', count(*)::int from waterings
    union all select 'alerts', count(*)::int from risk_alerts union all select 'alert_events', count(*)::int from risk_alert_events
    union all select 'alerts_open', count(*)::int from risk_alerts where status = 'open'
    union all select 'invitations', count(*)::int from homeowner_invitations
    union all select 'homeowner_links', count(*)::int from property_homeowners
    union all select 'outbox', count(*)::int from mail_outbox`.execute(testDb());
  return JSON.stringify(rows);
}

const stats = { payloads: 0, controls: 0, serverErrors: 0, leakyBodies: 0, rowsChanged: 0 };
const LEAKY = /\n\s+at |node_modules|syntax error|relation "|violates|duplicate key|postgres/i;
const prototypeBefore = Object.getOwnPropertyNames(Object.prototype).sort();

describe("malformed payloads", () => {
  for (const endpoint of endpoints) {
    it(`${endpoint.name}: ${RUNS} payloads → 422, never 5xx, nothing changed`, async () => {
      current = await c.actor("manager");
      const handler = (await endpoint.load())[endpoint.method]!;
      const before = await tableCounts();
      await fc.assert(
        fc.asyncProperty(malformed(endpoint), async (payload) => {
          const res = await handler(
            new Request("http://localhost/api", {
              method: endpoint.method,
              body: JSON.stringify(payload),
              headers: {
                origin: "http://localhost:3000",
                host: "localhost",
                "content-type": "application/json",
              },
            }),
            { params: Promise.resolve(endpoint.params()) },
          );
          const text = await res.text();
          stats.payloads++;
          if (res.status >= 500) stats.serverErrors++;
          if (LEAKY.test(text)) stats.leakyBodies++;
          expect(res.status).toBe(422);
          const body = JSON.parse(text) as {
            error: { code: string; fieldErrors?: Record<string, string[]> };
          };
          expect(body.error.code).toBe("invalid_input");
          if (payload !== null && typeof payload === "object" && !Array.isArray(payload))
            expect(body.error.fieldErrors).toBeDefined();
          expect(text).not.toMatch(LEAKY);
        }),
        { numRuns: RUNS },
      );
      const after = await tableCounts();
      if (after !== before) stats.rowsChanged++;
      expect(after).toBe(before);
    }, 300_000);
  }

  // The public server actions take FormData: every value arrives as a string.
  const actions = [
    {
      name: "action requestSignInLinkAction",
      schema: signInLinkSchema,
      valid: () => ({ email: "owner1@demo.sward.test" }),
      run: async (form: FormData) =>
        (await import("@/lib/auth/actions")).requestSignInLinkAction({ email: "" }, form),
    },
    {
      name: "action signInAction",
      schema: signInSchema,
      valid: () => ({ email: "owner1@demo.sward.test", password: "x" }),
      run: async (form: FormData) =>
        (await import("@/lib/auth/actions")).signInAction({ email: "" }, form),
    },
    {
      name: "action acceptInvitationAction",
      schema: acceptInvitationSchema,
      valid: () => ({ token: "0".repeat(64), name: "Pat Lee", password: "x" }),
      run: async (form: FormData) =>
        (await import("@/lib/invitations/actions")).acceptInvitationAction({ name: "" }, form),
    },
  ];
  for (const a of actions) {
    it(`${a.name}: ${RUNS} malformed forms → an error state with field errors, nothing recorded`, async () => {
      current = null;
      const counts = async () =>
        JSON.stringify(
          (
            await sql<{
              a: number;
              l: number;
              v: number;
              u: number;
              i: number;
              h: number;
            }>`select (select count(*)::int from sign_in_attempts) a, (select count(*)::int from sign_in_link_requests) l, (select count(*)::int from verification_tokens) v,
                      (select count(*)::int from users) u, (select count(*)::int from homeowner_invitations where accepted_at is not null) i, (select count(*)::int from property_homeowners) h`.execute(
              testDb(),
            )
          ).rows,
        );
      const before = await counts();
      const field = fc.oneof(
        junk.map((v) => (typeof v === "string" ? v : (JSON.stringify(v) ?? ""))),
        fc.string({ maxLength: 400 }),
      );
      const form = fc
        .record(
          Object.fromEntries(
            [...new Set([...Object.keys(a.valid()), "redirectTo"])].map((k) => [
              k,
              fc.option(field, { nil: undefined }),
            ]),
          ),
          { requiredKeys: [] },
        )
        .map(
          (o) =>
            Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Record<
              string,
              string
            >,
        )
        .filter((o) => !a.schema.safeParse(o).success);
      await fc.assert(
        fc.asyncProperty(form, async (fields) => {
          const data = new FormData();
          for (const [k, v] of Object.entries(fields)) data.set(k, v);
          const state = await a.run(data);
          stats.payloads++;
          if (LEAKY.test(JSON.stringify(state))) stats.leakyBodies++;
          expect(state.error).toBeTruthy();
          expect(state.fieldErrors).toBeDefined();
          expect(JSON.stringify(state)).not.toMatch(LEAKY);
        }),
        { numRuns: RUNS },
      );
      const after = await counts();
      if (after !== before) stats.rowsChanged++;
      expect(after).toBe(before);
    }, 300_000);
  }

  // Text a schema would accept, with a refused character somewhere in it (a value or a key): the
  // boundary answers 422 naming the field, before anything is parsed further or written.
  const REFUSED_RUNS = Math.min(RUNS, 1000);
  for (const endpoint of endpoints) {
    it(`${endpoint.name}: ${REFUSED_RUNS} texts with NUL, C0/C1 controls or lone surrogates → 422 naming the field, nothing changed`, async () => {
      current = await c.actor("manager");
      const textFields = Object.keys(endpoint.valid()).filter(
        (k) => typeof endpoint.valid()[k] === "string",
      );
      const handler = (await endpoint.load())[endpoint.method]!;
      const before = await tableCounts();
      const hostileText = fc
        .tuple(
          fc.string({ maxLength: 30 }),
          fc.constantFrom(...REFUSED_TEXT),
          fc.string({ maxLength: 30 }),
        )
        .map(([a, ch, b]) => a + ch + b);
      const payload = fc.oneof(
        ...(textFields.length
          ? [
              fc
                .tuple(fc.constantFrom(...textFields), hostileText)
                .map(([k, v]) => ({ field: k, body: { ...endpoint.valid(), [k]: v } })),
            ]
          : []),
        hostileText.map((k) => ({ field: null, body: { ...endpoint.valid(), [k]: "x" } })),
      );
      await fc.assert(
        fc.asyncProperty(payload, async ({ field, body }) => {
          const res = await handler(
            new Request("http://localhost/api", {
              method: endpoint.method,
              body: JSON.stringify(body),
              headers: {
                origin: "http://localhost:3000",
                host: "localhost",
                "content-type": "application/json",
              },
            }),
            { params: Promise.resolve(endpoint.params()) },
          );
          const text = await res.text();
          stats.payloads++;
          stats.controls++;
          if (res.status >= 500) stats.serverErrors++;
          expect(res.status).toBe(422);
          const parsed = JSON.parse(text) as { error: { fieldErrors?: Record<string, string[]> } };
          if (field) expect(parsed.error.fieldErrors?.[field]?.[0]).toMatch(/control characters/);
          expect(text).not.toMatch(LEAKY);
        }),
        { numRuns: REFUSED_RUNS },
      );
      const after = await tableCounts();
      if (after !== before) stats.rowsChanged++;
      expect(after).toBe(before);
    }, 300_000);
  }

  it("the sign-in forms refuse control characters in any field with an error state", async () => {
    current = null;
    for (const a of actions)
      for (const ch of REFUSED_TEXT) {
        const data = new FormData();
        for (const [k, v] of Object.entries(a.valid())) data.set(k, `${v}${ch}`);
        const state = await a.run(data);
        stats.payloads++;
        stats.controls++;
        expect(state.error, JSON.stringify(ch)).toBeTruthy();
        expect(state.fieldErrors, JSON.stringify(ch)).toBeDefined();
      }
  });

  // U+2028 and U+2029 are text: a valid body carrying them is never a 5xx (stored as sent or
  // refused by the field's own rule, e.g. an e-mail address).
  it("line and paragraph separators in every text field: never a 5xx", async () => {
    current = await c.actor("manager");
    for (const endpoint of endpoints) {
      const handler = (await endpoint.load())[endpoint.method]!;
      for (const k of Object.keys(endpoint.valid()).filter(
        (key) => typeof endpoint.valid()[key] === "string",
      ))
        for (const ch of ACCEPTED_SEPARATORS) {
          const body = { ...endpoint.valid(), [k]: `a${ch}b` };
          const res = await handler(
            new Request("http://localhost/api", {
              method: endpoint.method,
              body: JSON.stringify(body),
              headers: {
                origin: "http://localhost:3000",
                host: "localhost",
                "content-type": "application/json",
              },
            }),
            { params: Promise.resolve(endpoint.params()) },
          );
          stats.payloads++;
          if (res.status >= 500) stats.serverErrors++;
          expect(res.status, `${endpoint.name} ${k}`).toBeLessThan(500);
        }
    }
  });

  it("the valid payloads themselves are accepted by their schemas (the generator corrupts something real), and Object.prototype is untouched", () => {
    for (const e of endpoints) expect(e.schema.safeParse(e.valid()).success, e.name).toBe(true);
    for (const a of actions) expect(a.schema.safeParse(a.valid()).success, a.name).toBe(true);
    expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(prototypeBefore);
    expect(({} as Record<string, unknown>).isAdmin).toBeUndefined();
    console.log(
      `hostile input: ${stats.payloads} malformed payloads across ${endpoints.length} route handlers and ${actions.length} server actions (${RUNS} each), ${stats.controls} of them texts with one of ${REFUSED_TEXT.length} refused characters (${REFUSED_TEXT.length - 5} C0/DEL/C1 controls, 5 lone-surrogate cases); responses 5xx ${stats.serverErrors}, stack traces or SQL errors in bodies ${stats.leakyBodies}, endpoints with rows changed by rejected requests ${stats.rowsChanged}`,
    );
    expect(stats).toMatchObject({ serverErrors: 0, leakyBodies: 0, rowsChanged: 0 });
  });
});
