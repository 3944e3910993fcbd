// The week's schedule worked out without the database (lib/schedule/plan.ts): working days, the
// week a day falls in, and where moved stops land with their warnings.
import { describe, expect, it } from "vitest";

import {
  isWorkingDay,
  nextWorkingDay,
  planMove,
  weekDays,
  weekStart,
  type PlanStop,
} from "@/lib/schedule/plan";

// N.J.S.A. 58:10A-62b: "No professional fertilizer applicator shall apply fertilizer containing
// phosphorus or nitrogen to turf before March 1st or after December 1st in any calendar year"
// (the statute's own words, also quoted in lib/agronomy/season.ts): month-days [after, before].
const NJ: readonly [string, string] = ["12-01", "03-01"];

const stop = (id: string, over: Partial<PlanStop> = {}): PlanStop => ({
  id,
  propertyId: `p-${id}`,
  propertyName: `Property ${id}`,
  scheduledFor: "2026-12-04",
  technicianId: "tech-a",
  stopOrder: 1,
  putsDownNOrP: false,
  window: null,
  ...over,
});
const empty = { propertyIds: [], count: 0, lastStopOrder: 0, capacity: 10 };

describe("working days and weeks", () => {
  // Calendar facts: 2026-12-03 is a Thursday, 2026-12-06 a Sunday, 2027-01-01 a Friday (any
  // calendar; ISO 8601 weeks start on Monday).
  it("Monday to Saturday are working days; Sunday is not (common practice of lawn crews)", () => {
    expect(weekDays("2026-11-30").map(isWorkingDay)).toEqual([
      true,
      true,
      true,
      true,
      true,
      true,
      false,
    ]);
  });

  it("the next working day skips Sunday, across a month and a year", () => {
    expect(nextWorkingDay("2026-12-03")).toBe("2026-12-04"); // Thursday → Friday
    expect(nextWorkingDay("2026-12-04")).toBe("2026-12-05"); // Friday → Saturday
    expect(nextWorkingDay("2026-12-05")).toBe("2026-12-07"); // Saturday → Monday
    expect(nextWorkingDay("2026-12-06")).toBe("2026-12-07"); // Sunday → Monday
    expect(nextWorkingDay("2026-12-31")).toBe("2027-01-01"); // Thursday → Friday, new year
    expect(nextWorkingDay("2027-01-02")).toBe("2027-01-04"); // Saturday → Monday
  });

  it("a week runs Monday to Sunday (ISO 8601)", () => {
    expect(weekStart("2026-12-03")).toBe("2026-11-30");
    expect(weekStart("2026-11-30")).toBe("2026-11-30");
    expect(weekStart("2026-12-06")).toBe("2026-11-30");
    expect(weekStart("2027-01-01")).toBe("2026-12-28");
    expect(weekDays("2026-12-28")).toEqual([
      "2026-12-28",
      "2026-12-29",
      "2026-12-30",
      "2026-12-31",
      "2027-01-01",
      "2027-01-02",
      "2027-01-03",
    ]);
  });
});

describe("planMove", () => {
  it("keeps the stops' order (by day, then stop number) and numbers them after the day's own", () => {
    const plan = planMove(
      [
        stop("c", { stopOrder: 3 }),
        stop("a", { stopOrder: 1 }),
        stop("z", { scheduledFor: "2026-12-03", stopOrder: 9 }),
        stop("b", { stopOrder: 2 }),
      ],
      "2026-12-05",
      "tech-a",
      { ...empty, count: 2, lastStopOrder: 4 },
    );
    expect(plan.moves).toEqual([
      { stopId: "z", from: "2026-12-03", stopOrder: 5 },
      { stopId: "a", from: "2026-12-04", stopOrder: 6 },
      { stopId: "b", from: "2026-12-04", stopOrder: 7 },
      { stopId: "c", from: "2026-12-04", stopOrder: 8 },
    ]);
    expect(plan.warnings).toEqual([]);
  });

  it("warns for a property already visited that day, and for two moved stops of one property", () => {
    const plan = planMove(
      [
        stop("a"),
        stop("b", { propertyId: "p-x", stopOrder: 2 }),
        stop("c", { propertyId: "p-x", stopOrder: 3 }),
      ],
      "2026-12-05",
      "tech-a",
      { ...empty, propertyIds: ["p-a"] },
    );
    expect(plan.warnings).toEqual([
      { kind: "same_day", stopId: "a", propertyName: "Property a" },
      { kind: "same_day", stopId: "c", propertyName: "Property c" },
    ]);
  });

  it("warns for a round with N or P inside the no-fertilizer window, read as the statute words it", () => {
    const feeding = (id: string) => stop(id, { putsDownNOrP: true, window: NJ });
    // December 1 is allowed ("after December 1st"); December 2 is not.
    expect(planMove([feeding("a")], "2026-12-01", "tech-a", empty).warnings).toEqual([]);
    expect(planMove([feeding("a")], "2026-12-02", "tech-a", empty).warnings).toEqual([
      { kind: "blackout", stopId: "a", propertyName: "Property a" },
    ]);
    // The last days of February are not allowed ("before March 1st"); March 1 is. (February 27,
    // 2027 is a Saturday, a working day: the window's warning alone.)
    expect(planMove([feeding("a")], "2027-02-27", "tech-a", empty).warnings).toEqual([
      { kind: "blackout", stopId: "a", propertyName: "Property a" },
    ]);
    expect(planMove([feeding("a")], "2027-03-01", "tech-a", empty).warnings).toEqual([]);
    // Lime or an inspection puts down neither: no warning inside the window.
    expect(planMove([stop("a", { window: NJ })], "2026-12-15", "tech-a", empty).warnings).toEqual(
      [],
    );
  });

  it("warns when the day passes the technician's capacity, not when it reaches it", () => {
    const stops = [stop("a"), stop("b", { stopOrder: 2 })];
    expect(planMove(stops, "2026-12-05", "tech-a", { ...empty, count: 8 }).warnings).toEqual([]);
    expect(planMove(stops, "2026-12-05", "tech-a", { ...empty, count: 9 }).warnings).toEqual([
      { kind: "over_capacity", count: 11, capacity: 10 },
    ]);
  });

  it("warns for a Sunday", () => {
    expect(planMove([stop("a")], "2026-12-06", "tech-a", empty).warnings).toEqual([
      { kind: "not_working_day" },
    ]);
  });
});
