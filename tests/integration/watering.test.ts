// The watering log: depth given or computed from run time × precipitation rate, idempotent by
// id, scoped to the actor's properties.
import { beforeAll, describe, expect, it } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import { addDays, todayIn } from "@/lib/dates";
import { logWatering } from "@/lib/watering/mutations";
import { listWaterings } from "@/lib/watering/queries";
import type { WateringInput } from "@/lib/watering/schemas";

import { createTestCompany, type TestCompany } from "../helpers/factories";
import { newId } from "../helpers/zone-checks";

let c: TestCompany;
let other: TestCompany;
beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
});
// Waterings are logged for past days within a year (lib/watering/schemas.ts).
const yesterday = addDays(todayIn("America/New_York"), -1);
const twoDaysAgo = addDays(yesterday, -1);
const entry = (o: Partial<WateringInput>): WateringInput => ({
  id: newId(),
  zoneId: null,
  wateredOn: yesterday,
  depthIn: 0.5,
  runMinutes: null,
  precipitationRateInPerHour: null,
  notes: "",
  ...o,
});

describe("logWatering", () => {
  it("stores a depth, or run time × rate (30 min at 1.5 in/h = 0.75 in), newest first", async () => {
    const tech1 = await c.actor("tech1");
    const haddad = c.propertyIds["haddad"]!;
    const first = await logWatering(tech1, haddad, entry({ wateredOn: twoDaysAgo }));
    const byRun = await logWatering(
      tech1,
      haddad,
      entry({ depthIn: null, runMinutes: 30, precipitationRateInPerHour: 1.5 }),
    );
    expect(byRun.depthIn).toBe(0.75);
    // Newest first, among the demo's own irrigation log.
    const ours = (await listWaterings(tech1, haddad, { limit: 500 })).filter(
      (w) => w.id === first.id || w.id === byRun.id,
    );
    expect(ours.map((w) => w.wateredOn)).toEqual([yesterday, twoDaysAgo]);
  });

  it("is idempotent by id", async () => {
    const tech1 = await c.actor("tech1");
    const e = entry({});
    await logWatering(tech1, c.propertyIds["oyelaran"]!, e);
    await logWatering(tech1, c.propertyIds["oyelaran"]!, e);
    expect(
      (await listWaterings(tech1, c.propertyIds["oyelaran"]!)).filter((w) => w.id === e.id),
    ).toHaveLength(1);
  });

  it("is scoped: another technician's property and another company are not found; homeowners read their own", async () => {
    await expect(
      logWatering(await c.actor("tech2"), c.propertyIds["haddad"]!, entry({})),
    ).rejects.toMatchObject({ code: "not_found" });
    await expect(
      logWatering(await other.actor("manager"), c.propertyIds["haddad"]!, entry({})),
    ).rejects.toMatchObject({ code: "not_found" });
    expect(
      (await listWaterings(await c.actor("owner2"), c.propertyIds["haddad"]!)).length,
    ).toBeGreaterThan(0);
    // Another homeowner's lawn is not found (as the property itself is), not an empty list.
    await expect(
      listWaterings(await c.actor("owner1"), c.propertyIds["haddad"]!),
    ).rejects.toMatchObject({ code: "not_found" });
    await expect(
      listWaterings(await other.actor("manager"), c.propertyIds["haddad"]!),
    ).rejects.toMatchObject({ code: "not_found" });
    // Homeowners log their own watering, and only on their own lawn.
    const own = await logWatering(
      await c.actor("owner2"),
      c.propertyIds["haddad"]!,
      entry({ depthIn: 0.4 }),
    );
    expect(own.enteredByRole).toBe("homeowner");
    await expect(
      logWatering(await c.actor("owner1"), c.propertyIds["haddad"]!, entry({})),
    ).rejects.toMatchObject({ code: "not_found" });
  });
});
