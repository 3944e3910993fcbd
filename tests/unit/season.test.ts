// The round of the season (lib/agronomy/season.ts) per state and month, and the next day
// fertilizer is allowed. The calendar itself is common practice (no single published source,
// said in the module); the no-fertilizer windows are the statutes' words, quoted beside each case.
import { describe, expect, it } from "vitest";

import { findingSeason, roundFor } from "@/fixtures/demo/rounds";
import { demoCompany } from "@/fixtures/demo/scenario";
import { checkApplication } from "@/lib/agronomy/rules";
import { nextFertilizerDate, putsDownNOrP, seasonalRound } from "@/lib/agronomy/season";
import { addDays } from "@/lib/dates";
import { SHIPPED_RULE_SETS } from "@/lib/reference/rule-sets";

const nj = SHIPPED_RULE_SETS.find((r) => r.name.startsWith("New Jersey"))!;
const mn = SHIPPED_RULE_SETS.find((r) => r.name.startsWith("Minnesota"))!;
// The demo's properties: central New Jersey (40.3° N) and the Twin Cities area (44.9° N).
const NJ = { latitude: 40.33, proBlackout: nj.proBlackout };
const MN = { latitude: 44.95, proBlackout: mn.proBlackout };
const month = (m: number) => `2026-${String(m).padStart(2, "0")}-15`;

describe("the round of the season", () => {
  it("New Jersey, month by month (common practice for cool-season lawns)", () => {
    expect(Array.from({ length: 12 }, (_, i) => seasonalRound(month(i + 1), NJ).service)).toEqual([
      "inspection", // January: dormant
      "soil_sampling",
      "liming",
      "feeding_round", // April: first spring feeding
      "weed_control",
      "feeding_round",
      "insect_control", // July: preventive grub control
      "inspection", // August: no feeding of cool-season turf in the heat
      "aeration_overseeding",
      "fall_feeding",
      "fall_feeding",
      "liming", // December: inside the professional window
    ]);
  });

  it("Minnesota: a shorter season, the frozen months kept for inspection; no statute window", () => {
    expect(mn.proBlackout).toBeNull(); // Minn. Stat. 18C.60 restricts phosphorus, not dates
    expect(Array.from({ length: 12 }, (_, i) => seasonalRound(month(i + 1), MN).service)).toEqual([
      "inspection",
      "inspection",
      "inspection",
      "soil_sampling",
      "feeding_round",
      "weed_control",
      "insect_control",
      "aeration_overseeding",
      "fall_feeding",
      "fall_feeding",
      "liming",
      "inspection",
    ]);
  });

  // N.J.S.A. 58:10A-62b: "No professional fertilizer applicator shall apply fertilizer containing
  // phosphorus or nitrogen to turf before March 1st or after December 1st in any calendar year."
  it("New Jersey's professional window: no round with N or P after December 1 or before March 1", () => {
    expect(nj.proBlackout).toEqual(["12-01", "03-01"]);
    for (let d = "2025-11-25"; d <= "2026-03-05"; d = addDays(d, 1)) {
      const round = seasonalRound(d, NJ);
      const inside = d > "2025-12-01" && d < "2026-03-01";
      if (inside) expect(putsDownNOrP(round.service), d).toBe(false);
    }
    // The named days themselves are allowed ("before March 1st", "after December 1st").
    expect(seasonalRound("2026-11-30", NJ).service).toBe("fall_feeding");
    expect(seasonalRound("2026-12-02", NJ)).toMatchObject({ service: "liming", treatment: "lime" });
  });

  it("a company window that would catch a feeding month turns the round into lime, naming the next allowed day", () => {
    // A stricter company rule set: no fertilizer after November 1 or before April 15.
    const strict = { latitude: 40.33, proBlackout: ["11-01", "04-15"] as const };
    expect(seasonalRound("2026-11-10", strict)).toMatchObject({
      service: "liming",
      treatment: "lime",
    });
    expect(seasonalRound("2026-11-10", strict).why).toMatch(/next allowed April 15, 2027/);
    expect(seasonalRound("2026-04-10", strict).service).toBe("liming");
    expect(seasonalRound("2026-04-15", strict).service).toBe("feeding_round"); // the named day
  });

  it("the next day fertilizer is allowed, across the new year", () => {
    const w = nj.proBlackout!;
    expect(nextFertilizerDate("2026-12-02", w)).toBe("2027-03-01");
    expect(nextFertilizerDate("2026-12-01", w)).toBe("2026-12-01");
    expect(nextFertilizerDate("2027-02-28", w)).toBe("2027-03-01");
    expect(nextFertilizerDate("2026-07-15", w)).toBe("2026-07-15");
    expect(nextFertilizerDate("2026-07-15", ["06-30", "07-01"])).toBe("2026-07-15"); // nothing between
  });
});

describe("the demo's rounds on any day", () => {
  const schedule = demoCompany.schedule!;
  const haddad = demoCompany.properties.find((p) => p.key === "haddad")!;

  it("every day of a year: the round's product passes the New Jersey rule set on that day", () => {
    for (let d = "2026-01-01"; d <= "2026-12-31"; d = addDays(d, 1)) {
      const round = roundFor(schedule, haddad, d);
      if (!round.application) continue;
      const nPct = round.application.product.match(/ (\d+)-(\d+)-(\d+)/);
      const n = nPct ? Number(nPct[1]) : 0;
      const p = nPct ? Number(nPct[2]) : 0;
      const findings = checkApplication(nj, {
        appliedOn: d,
        byProfessional: true,
        nPct: n,
        nLb: (round.application.rateLbPer1000 * n) / 100,
        wsnLb: 0,
        p2o5Lb: (round.application.rateLbPer1000 * p) / 100,
        slowReleasePctOfN: 30,
        isEstablishing: false,
        isRepairing: round.application.isRepairing ?? false,
        soilTestOn: null,
        yearToDateNLb: 0,
        annualNRange: null,
        weather: null,
      });
      expect(
        findings.filter((f) => f.key === "blackout"),
        `${d} ${round.service}`,
      ).toEqual([]);
    }
  });

  it("what a check can find follows the month", () => {
    expect(findingSeason("2026-01-15")).toBe("dormant");
    expect(findingSeason("2026-03-31")).toBe("dormant");
    expect(findingSeason("2026-04-01")).toBe("shoulder");
    expect(findingSeason("2026-07-15")).toBe("summer");
    expect(findingSeason("2026-11-11")).toBe("shoulder");
    expect(findingSeason("2026-12-01")).toBe("dormant");
  });
});
