// Data-access scope against a real, freshly migrated PostgreSQL: every read is limited to the
// actor's company and role; anything outside is "not found".
import { beforeAll, describe, expect, it } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import { AppError } from "@/lib/http/app-error";
import { getProperty, listProperties } from "@/lib/properties/queries";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let main: TestCompany;
let other: TestCompany;

beforeAll(async () => {
  [main, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
});

const names = (items: { name: string }[]) => items.map((p) => p.name).sort();

describe("listProperties", () => {
  it("a manager sees every property of their company and nothing else", async () => {
    const items = await listProperties(await main.actor("manager"));
    expect(names(items)).toEqual(main.scenario.properties.map((p) => p.name).sort());
    const zoneCounts = Object.fromEntries(items.map((p) => [p.name, p.zoneCount]));
    for (const p of main.scenario.properties) expect(zoneCounts[p.name]).toBe(p.zones.length);
  });

  it("lawn area is the sum of the zone areas", async () => {
    const items = await listProperties(await main.actor("manager"));
    for (const p of main.scenario.properties) {
      const expected = p.zones.reduce((sum, z) => sum + z.areaFt2, 0);
      expect(items.find((i) => i.name === p.name)?.lawnAreaFt2).toBe(expected);
    }
  });

  it("a technician sees only the properties assigned to them", async () => {
    for (const tech of ["tech1", "tech2"]) {
      const items = await listProperties(await main.actor(tech));
      expect(names(items)).toEqual(
        main.scenario.properties
          .filter((p) => p.technician === tech)
          .map((p) => p.name)
          .sort(),
      );
    }
  });

  it("a homeowner sees only their own property", async () => {
    for (const owner of ["owner1", "owner2", "owner3"]) {
      const items = await listProperties(await main.actor(owner));
      expect(names(items)).toEqual(
        main.scenario.properties.filter((p) => p.homeowners.includes(owner)).map((p) => p.name),
      );
    }
  });

  it("the other company's manager sees only their own book", async () => {
    const items = await listProperties(await other.actor("manager"));
    expect(names(items)).toEqual(otherCompany.properties.map((p) => p.name));
  });

  it("archived properties leave the list", async () => {
    const company = await createTestCompany();
    const id = company.propertyIds["okafor"]!;
    await testDb()
      .updateTable("properties")
      .set({ archived_at: new Date() })
      .where("id", "=", id)
      .execute();
    const items = await listProperties(await company.actor("manager"));
    expect(items.map((p) => p.id)).not.toContain(id);
    expect(items).toHaveLength(company.scenario.properties.length - 1);
  });
});

describe("getProperty", () => {
  it("returns zones in their order with species names from the reference table", async () => {
    const property = await getProperty(await main.actor("manager"), main.propertyIds["kowalczyk"]!);
    expect(property.zones.map((z) => z.name)).toEqual([
      "Front lawn",
      "Under the oaks",
      "Back yard",
      "Pool surround",
    ]);
    expect(property.zones[1]).toMatchObject({
      areaFt2: 1200,
      grassSpecies: { key: "fine_fescue", name: "Fine fescue", season: "cool" },
      sunExposure: "shade",
    });
  });

  it("staff see the linked homeowners; a homeowner does not get that list", async () => {
    const id = main.propertyIds["oyelaran"]!;
    expect(
      (await getProperty(await main.actor("manager"), id)).homeowners.map((h) => h.email),
    ).toEqual([main.emails.owner1]);
    expect((await getProperty(await main.actor("owner1"), id)).homeowners).toEqual([]);
  });

  const notFound = { code: "not_found" } as Partial<AppError>;

  it("out of scope is not found: other homeowner, unassigned technician, other company", async () => {
    const haddad = main.propertyIds["haddad"]!;
    await expect(getProperty(await main.actor("owner1"), haddad)).rejects.toMatchObject(notFound);
    await expect(getProperty(await main.actor("tech2"), haddad)).rejects.toMatchObject(notFound);
    await expect(getProperty(await other.actor("manager"), haddad)).rejects.toMatchObject(notFound);
    await expect(
      getProperty(await main.actor("manager"), other.propertyIds["aaland"]!),
    ).rejects.toMatchObject(notFound);
  });

  it("an unknown id is not found", async () => {
    await expect(
      getProperty(await main.actor("manager"), "00000000-0000-4000-8000-000000000000"),
    ).rejects.toBeInstanceOf(AppError);
  });
});
