// The manager's property form through its routes: the state and ZIP code checks (422 naming the
// field, nothing saved or changed), and "Find the location from the address"
// (GET /api/v1/geocode) against the local fake of the Census Bureau's geocoder — managers only.
import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";
import { useServices } from "@/lib/services";
import { censusGeocoder } from "@/lib/services/geocoder/client";

import { startFakeGeocoder } from "../harness/geocoder-fake";
import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const properties = await import("@/app/api/v1/properties/route");
const property = await import("@/app/api/v1/properties/[propertyId]/route");
const geocode = await import("@/app/api/v1/geocode/route");

let c: TestCompany;
let other: TestCompany;
let fake: Server;
let restore: () => void;

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  fake = await startFakeGeocoder(0);
  restore = useServices({
    geocoder: censusGeocoder({
      baseUrl: `http://127.0.0.1:${(fake.address() as AddressInfo).port}`,
    }),
  });
});
afterAll(async () => {
  restore();
  await new Promise<void>((r) => fake.close(() => r()));
});

const headers = {
  origin: "http://localhost:3000",
  host: "localhost",
  "content-type": "application/json",
};

async function call(
  handler: (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>,
  init: { method?: string; body?: unknown; url?: string; params?: Record<string, string> } = {},
) {
  const res = await handler(
    new Request(`http://localhost${init.url ?? "/api"}`, {
      method: init.method ?? "GET",
      headers,
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
    }),
    { params: Promise.resolve(init.params ?? {}) },
  );
  const json = (await res.json()) as Record<string, unknown> & {
    error?: { code: string; message: string; fieldErrors?: Record<string, string[]> };
  };
  return { status: res.status, json };
}

const newProperty = (o: Record<string, unknown> = {}) => ({
  name: `Bramblecote ${Math.random().toString(36).slice(2, 8)}`,
  street: "77 Bramblecote Road",
  city: "Larkfield",
  region: "NJ",
  postalCode: "08561",
  latitude: 40.3378,
  longitude: -74.7326,
  timeZone: "America/New_York",
  ruleSetId: null,
  technicianId: null,
  notes: "",
  ...o,
});

const countNamed = async (name: string) =>
  Number(
    (
      await testDb()
        .selectFrom("properties")
        .select((eb) => eb.fn.countAll().as("n"))
        .where("company_id", "=", c.companyId)
        .where("name", "=", name)
        .executeTakeFirstOrThrow()
    ).n,
  );

describe("state and ZIP code on the property routes", () => {
  it("creating: a bad state or ZIP is 422 naming the field, and nothing is saved", async () => {
    current = await c.actor("manager");
    for (const [field, value, message] of [
      ["region", "ZZ", /^State: use the two-letter USPS code/],
      ["region", "New Jersey", /^State: use the two-letter USPS code/],
      ["postalCode", "@08540", /^ZIP code: five digits/],
      ["postalCode", "8540", /^ZIP code: five digits/],
    ] as const) {
      const body = newProperty({ [field]: value });
      const res = await call(properties.POST, { method: "POST", body });
      expect(res.status, `${field} ${value}`).toBe(422);
      expect(Object.keys(res.json.error!.fieldErrors!)).toEqual([field]);
      expect(res.json.error!.fieldErrors![field]![0]).toMatch(message);
      expect(await countNamed(body.name)).toBe(0);
    }
  });

  it("creating: a good address is saved, the state in capitals, ZIP+4 kept", async () => {
    current = await c.actor("manager");
    const body = newProperty({ region: " nj ", postalCode: "08561-2207" });
    const res = await call(properties.POST, { method: "POST", body });
    expect(res.status).toBe(200);
    expect(res.json).toMatchObject({ address: { region: "NJ", postalCode: "08561-2207" } });
    expect(await countNamed(body.name)).toBe(1);
  });

  it("editing: a bad ZIP is 422 and the stored address is unchanged", async () => {
    current = await c.actor("manager");
    const id = c.propertyIds["oyelaran"]!;
    const before = await testDb()
      .selectFrom("properties")
      .selectAll()
      .where("id", "=", id)
      .executeTakeFirstOrThrow();
    const res = await call(property.PUT, {
      method: "PUT",
      params: { propertyId: id },
      body: newProperty({ name: before.name, postalCode: "@08540" }),
    });
    expect(res.status).toBe(422);
    expect(res.json.error!.fieldErrors!.postalCode).toBeDefined();
    const after = await testDb()
      .selectFrom("properties")
      .selectAll()
      .where("id", "=", id)
      .executeTakeFirstOrThrow();
    expect(after).toEqual(before);
  });
});

describe("GET /api/v1/geocode", () => {
  const url = (q: Record<string, string>) => `/api/v1/geocode?${new URLSearchParams(q)}`;
  const address = {
    street: "77 Bramblecote Road",
    city: "Larkfield",
    region: "NJ",
    postalCode: "08561",
  };

  it("a manager gets the fake's match: the matched address and its coordinates", async () => {
    current = await c.actor("manager");
    const res = await call(geocode.GET, { url: url(address) });
    expect(res.status).toBe(200);
    expect(res.json).toEqual({
      status: "found",
      address: "77 Bramblecote Road, Larkfield, NJ 08561",
      matches: [
        {
          matchedAddress: "77 BRAMBLECOTE RD, LARKFIELD, NJ, 08561",
          latitude: 40.3378,
          longitude: -74.7326,
          state: "NJ",
          zip: "08561",
        },
      ],
    });
  });

  it("another company's manager gets the same public answer; nothing of either book is read", async () => {
    current = await other.actor("manager");
    const res = await call(geocode.GET, { url: url(address) });
    expect(res.json).toMatchObject({ status: "found", matches: [{ latitude: 40.3378 }] });
  });

  it("an address the service does not know is 'no match' in plain words", async () => {
    current = await c.actor("manager");
    const res = await call(geocode.GET, { url: url({ ...address, street: "1 Nowhere Street" }) });
    expect(res.json).toEqual({
      status: "no_match",
      address: "1 Nowhere Street, Larkfield, NJ 08561",
      matches: [],
      message:
        "No match for “1 Nowhere Street, Larkfield, NJ 08561”. Check the street number, street and town, or type the coordinates.",
    });
  });

  it("a missing street is 422 naming it", async () => {
    current = await c.actor("manager");
    const res = await call(geocode.GET, { url: url({ ...address, street: "" }) });
    expect(res.status).toBe(422);
    expect(res.json.error!.fieldErrors!.street![0]).toBe(
      "Street address is required to look up the location.",
    );
  });

  it("technicians, homeowners and no session are refused", async () => {
    for (const [who, status] of [
      ["tech1", 403],
      ["owner1", 403],
    ] as const) {
      current = await c.actor(who);
      expect((await call(geocode.GET, { url: url(address) })).status, who).toBe(status);
    }
    current = null;
    expect((await call(geocode.GET, { url: url(address) })).status).toBe(401);
  });

  it("a service that is down, or not set up, is 'unavailable' with what to do instead", async () => {
    current = await c.actor("manager");
    const down = useServices({ geocoder: censusGeocoder({ baseUrl: "http://127.0.0.1:9" }) });
    try {
      const res = await call(geocode.GET, { url: url(address) });
      expect(res.json).toMatchObject({
        status: "unavailable",
        message:
          "The address could not be looked up just now (the address lookup service could not be reached). Try again, type the coordinates, or use this device's location.",
      });
    } finally {
      down();
    }
    const none = useServices({ geocoder: null });
    try {
      const res = await call(geocode.GET, { url: url(address) });
      expect(res.json).toMatchObject({
        status: "unavailable",
        message: /not set up on this server/,
      });
    } finally {
      none();
    }
  });
});
