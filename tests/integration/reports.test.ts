// Visit reports for homeowners: plain words per zone, what was applied with its cautions, the care
// notes that match what was seen; only the homeowner's own completed visits.
import { beforeAll, describe, expect, it } from "vitest";

import { findingSeason, pastRounds } from "@/fixtures/demo/rounds";
import { demoCompany, otherCompany } from "@/fixtures/demo/scenario";
import { addDays, todayIn } from "@/lib/dates";
import { getVisitReport, listReports } from "@/lib/reports/queries";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let c: TestCompany;
let other: TestCompany;
const today = todayIn("America/New_York");
const visitOn = (propertyKey: string, daysAgo: number) =>
  testDb()
    .selectFrom("visits")
    .select("id")
    .where("property_id", "=", c.propertyIds[propertyKey]!)
    .where("scheduled_for", "=", addDays(today, -daysAgo))
    .executeTakeFirstOrThrow();

// The demo's past rounds at the Haddad lawn (fixtures/demo/rounds.ts), newest first.
const haddadRounds = pastRounds(
  demoCompany.schedule!,
  demoCompany.properties.find((p) => p.key === "haddad")!,
  today,
);

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
});

describe("visit reports", () => {
  it("the homeowner lists their finished visits, newest first", async () => {
    const reports = await listReports(await c.actor("owner2"), c.propertyIds["haddad"]!);
    expect(reports).toHaveLength(7);
    expect(reports[0]!.date).toBe(addDays(today, -21));
  });

  it("says what was seen in plain words and brings the matching care notes", async () => {
    const latest = await visitOn("haddad", 21);
    const report = await getVisitReport(await c.actor("owner2"), latest.id);
    // What the visit found follows its month: mowing signs from April to November, the season's
    // disease on the back yard.
    const season = findingSeason(addDays(today, -21));
    const slope = report.zones.find((z) => z.name === "Front slope")!;
    const back = report.zones.find((z) => z.name === "Back yard")!;
    expect(back.sentences.join(" ")).toMatch(/Overall fair \(5 of 9\)/);
    expect(back.sentences.join(" ")).toMatch(
      {
        summer: /Signs of dollar spot \(moderate, about 10 % of the zone\)/,
        shoulder: /Signs of red thread \(moderate, about 10 % of the zone\)/,
        dormant: /Signs of snow mou?ld \(moderate, about 10 % of the zone\)/,
      }[season],
    );
    if (season !== "dormant") {
      expect(slope.sentences.join(" ")).toMatch(
        /Mowing: cut at 2\.5 in, mowed the same way as last time, grass matted and laid over\./,
      );
      const keys = report.careNotes.map((n) => n.note.key);
      expect(keys).toEqual(expect.arrayContaining(["vary_mowing_direction"]));
      expect(
        report.careNotes.find((n) => n.note.key === "vary_mowing_direction")!.because,
      ).toContain("Front slope: grass matted and laid over");
    }
    // What the round of that visit put down, on both zones (nothing for an inspection).
    const round = haddadRounds.find((v) => v.daysAgo === 21)!;
    expect(report.applications.map((a) => a.productName)).toEqual(
      round.application ? [round.application.product, round.application.product] : [],
    );
  });

  it("a feeding visit lists the product with its keep-off guidance and the after-feeding note", async () => {
    // The latest past round that fed the lawn (a product with N).
    const feeding = haddadRounds.find((v) => ["feeding_round", "fall_feeding"].includes(v.service));
    if (!feeding) return; // no feeding in the months before a winter or early-spring seed
    const fall = await visitOn("haddad", feeding.daysAgo);
    const report = await getVisitReport(await c.actor("owner2"), fall.id);
    expect(report.applications.map((a) => a.productName)).toEqual([
      feeding.application!.product,
      feeding.application!.product,
    ]);
    expect(report.applications[0]!.reentryGuidance).toMatch(/Keep off until watered in/);
    const notes = report.careNotes.map((n) => n.note.key);
    expect(notes).toEqual(
      expect.arrayContaining(
        feeding.service === "fall_feeding"
          ? ["after_fertiliser", "late_season_results"]
          : ["after_fertiliser"],
      ),
    );
    expect(
      report.careNotes.find((n) => n.note.key === "after_fertiliser")!.note.cautions!.join(" "),
    ).toMatch(/Keep children and pets off/);
  });

  it("is scoped: another homeowner, another company and unfinished visits are not found", async () => {
    const latest = await visitOn("haddad", 21);
    await expect(getVisitReport(await c.actor("owner1"), latest.id)).rejects.toMatchObject({
      code: "not_found",
    });
    await expect(getVisitReport(await other.actor("manager"), latest.id)).rejects.toMatchObject({
      code: "not_found",
    });
    const todays = await testDb()
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .where("status", "=", "scheduled")
      .executeTakeFirstOrThrow();
    await expect(getVisitReport(await c.actor("owner2"), todays.id)).rejects.toMatchObject({
      code: "not_found",
    });
    expect(await listReports(await c.actor("owner1"), c.propertyIds["haddad"]!)).toEqual([]);
  });
});
