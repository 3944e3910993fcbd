// The homeowner's next visit: the visit report e-mail queued when a visit is finished names the
// property's next scheduled visit after it (day and planned service in words), skipping called-off
// ones, and says nothing when none is scheduled; My lawn's read (findNextVisit) is scoped to the
// homeowner's own properties.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import { addDays, formatDate } from "@/lib/dates";
import { finishVisit } from "@/lib/reports/mutations";
import { findNextVisit } from "@/lib/reports/queries";
import { saveZoneCheck, startVisit } from "@/lib/visits/mutations";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { doneCheck, newId } from "../helpers/zone-checks";

let c: TestCompany;
let other: TestCompany;

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
});

async function finishStop(propertyKey: string) {
  const tech1 = await c.actor("tech1");
  const propertyId = c.propertyIds[propertyKey]!;
  const visit = await testDb()
    .selectFrom("visits")
    .select(["id", "scheduled_for"])
    .where("property_id", "=", propertyId)
    .where("status", "=", "scheduled")
    .orderBy("scheduled_for")
    .executeTakeFirstOrThrow();
  // Only the visits this test makes come after it.
  await testDb()
    .deleteFrom("visits")
    .where("property_id", "=", propertyId)
    .where("status", "=", "scheduled")
    .where("id", "!=", visit.id)
    .execute();
  return { tech1, propertyId, visit };
}

async function complete(
  tech1: Awaited<ReturnType<TestCompany["actor"]>>,
  propertyId: string,
  visitId: string,
) {
  await startVisit(tech1, visitId, { latitude: null, longitude: null });
  const zones = await testDb()
    .selectFrom("zones")
    .select("id")
    .where("property_id", "=", propertyId)
    .execute();
  for (const z of zones) await saveZoneCheck(tech1, visitId, newId(), doneCheck(z.id));
  await finishVisit(tech1, visitId);
}

describe("the next visit in the report e-mail", () => {
  it("names the next scheduled visit after the report's visit and its planned service", async () => {
    const { tech1, propertyId, visit } = await finishStop("haddad");
    const add = (days: number, service: "weed_control" | "liming", status?: "cancelled") =>
      testDb()
        .insertInto("visits")
        .values({
          id: randomUUID(),
          company_id: c.companyId,
          property_id: propertyId,
          technician_id: tech1.userId,
          scheduled_for: addDays(visit.scheduled_for, days),
          planned_service: service,
          ...(status ? { status } : {}),
        })
        .execute();
    await add(3, "liming", "cancelled"); // called off: not the next visit
    await add(9, "weed_control");
    await add(20, "liming");
    await complete(tech1, propertyId, visit.id);

    const mail = await testDb()
      .selectFrom("mail_outbox")
      .select(["text_body", "html_body"])
      .where("company_id", "=", c.companyId)
      .where("kind", "=", "visit_report")
      .where("to_address", "=", c.emails["owner2"]!)
      .executeTakeFirstOrThrow();
    // "Weed control" is the catalogue's name of the service; the date in the en-US form of lib/dates.
    const expected = `Next visit: Weed control on ${formatDate(addDays(visit.scheduled_for, 9))}.`;
    expect(mail.text_body).toContain(expected);
    expect(mail.html_body).toContain(expected);

    // My lawn's read: the same visit for the homeowner, nothing for another company's homeowner.
    const owner2 = await c.actor("owner2");
    expect(await findNextVisit(owner2, propertyId, visit.scheduled_for)).toEqual({
      date: addDays(visit.scheduled_for, 9),
      service: "weed_control",
    });
    const stranger = await other.actor("manager");
    expect(await findNextVisit(stranger, propertyId, visit.scheduled_for)).toBeNull();
  });

  it("says nothing of a next visit when none is scheduled", async () => {
    const { tech1, propertyId, visit } = await finishStop("oyelaran");
    await complete(tech1, propertyId, visit.id);
    const mails = await testDb()
      .selectFrom("mail_outbox")
      .select(["text_body", "html_body"])
      .where("company_id", "=", c.companyId)
      .where("kind", "=", "visit_report")
      .where("subject", "like", "%Oyelaran%")
      .execute();
    expect(mails.length).toBeGreaterThan(0);
    for (const m of mails) {
      expect(m.text_body).not.toContain("Next visit");
      expect(m.html_body).not.toContain("Next visit");
    }
  });
});
