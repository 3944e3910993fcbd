// The day's route worked out without the database (lib/day-route/plan.ts, links.ts): legs and
// totals of the stored order, stops already started kept first, the open route without a yard,
// the demo's own day (its stored order is not the driving order, on purpose), the links a stop
// opens and the figures in US units.
import { describe, expect, it } from "vitest";

import { demoCompany } from "@/fixtures/demo/scenario";
import { directionsUrl, drivingTimeText, milesText, telHref } from "@/lib/day-route/links";
import { dayRoute, routePoints, type DayStop, type Depot } from "@/lib/day-route/plan";
import { formatUsPhone, usPhoneE164 } from "@/lib/reference/us-phone";
import { estimatedMatrix } from "@/lib/routing/great-circle";

/** Stops on a line of longitude -75, `miles` north of latitude 40 (1° of latitude ≈ 69.09 mi). */
const onLine = (id: string, miles: number, started = false): DayStop => ({
  visitId: id,
  propertyName: `Property ${id}`,
  started,
  latitude: 40 + miles / 69.09,
  longitude: -75,
});
const yard: Depot = { kind: "yard", label: "The yard", latitude: 40, longitude: -75 };

function route(stops: DayStop[], depot: Depot | null) {
  return dayRoute(stops, depot, estimatedMatrix(routePoints(stops, depot)));
}

describe("the day's route", () => {
  it("prices the stored order leg by leg and back to the yard, and proposes the straight run", () => {
    // Yard at 0 mi; stops stored at 2, 6, 4 mi north: 2 + 4 + 2 + 4 (back) = 12 crow-miles,
    // × 1.2 = 14.4 road miles. Out to the far end and back costs 12 in any order that turns once,
    // so this stored order is already a driving order.
    const r = route([onLine("a", 2), onLine("b", 6), onLine("c", 4)], yard);
    expect(r.total.meters / 1609.344).toBeCloseTo(14.4, 1);
    expect(r.stops.map((s) => s.leg!.meters / 1609.344)).toEqual([
      expect.closeTo(2.4, 1),
      expect.closeTo(4.8, 1),
      expect.closeTo(2.4, 1),
    ]);
    expect(r.returnLeg!.meters / 1609.344).toBeCloseTo(4.8, 1);
    expect(r.inDrivingOrder).toBe(true);
  });

  it("finds the shorter order when the stored one doubles back, keeping started stops first", () => {
    // Stored: 6 (finished), 1, 5, 2 → from 6: 5 + 4 + 3 + 2 (home) = 14 crow-miles.
    // Proposed: 6 first (finished), then 5, 2, 1 → 1 + 3 + 1 + 1 = 6.
    const r = route([onLine("f", 6, true), onLine("a", 1), onLine("b", 5), onLine("c", 2)], yard);
    expect(r.proposed.visitIds).toEqual(["f", "b", "c", "a"]);
    expect(r.inDrivingOrder).toBe(false);
    expect(r.proposed.total.meters / 1609.344).toBeCloseTo((6 + 1 + 3 + 1 + 1) * 1.2, 1);
    expect(r.total.meters / 1609.344).toBeCloseTo((6 + 5 + 4 + 3 + 1 + 1) * 1.2, 1);
  });

  it("runs open from the first stop to the last without a yard or start point", () => {
    const r = route([onLine("a", 1), onLine("b", 5), onLine("c", 3)], null);
    expect(r.stops[0]!.leg).toBeNull();
    expect(r.returnLeg).toBeNull();
    expect(r.proposed.visitIds).toEqual(["a", "c", "b"]);
    expect(r.proposed.total.meters / 1609.344).toBeCloseTo(4 * 1.2, 1);
  });

  it("has nothing to drive on a day without stops", () => {
    expect(route([], yard)).toMatchObject({
      stops: [],
      returnLeg: null,
      total: { meters: 0, seconds: 0 },
      proposed: { visitIds: [] },
      inDrivingOrder: true,
    });
  });

  it("the demo's first technician's day is stored out of driving order, so Today offers to fix it", () => {
    const stops = demoCompany.schedule!.today.tech1!.map((key) => {
      const p = demoCompany.properties.find((x) => x.key === key)!;
      return {
        visitId: key,
        propertyName: p.name,
        started: false,
        latitude: p.latitude,
        longitude: p.longitude,
      };
    });
    const r = route(stops, { kind: "yard", label: "yard", ...demoCompany.yard! });
    expect(r.inDrivingOrder).toBe(false);
    expect(r.proposed.total.seconds).toBeLessThan(r.total.seconds);
  });
});

describe("a stop's links and figures", () => {
  it("Directions is a Maps URL with the destination's coordinates, driving", () => {
    expect(directionsUrl({ latitude: 40.3342, longitude: -74.7391 })).toBe(
      "https://www.google.com/maps/dir/?api=1&destination=40.334200%2C-74.739100&travelmode=driving",
    );
  });

  it("Call is a tel: URI in E.164 form (RFC 3966)", () => {
    expect(telHref("+16095550142")).toBe("tel:+16095550142");
  });

  it("miles to one decimal, driving time in minutes and hours", () => {
    expect(milesText(1609.344 * 12.34)).toBe("12.3 mi");
    expect(milesText(0)).toBe("0.0 mi");
    expect(milesText(20)).toBe("0.1 mi");
    expect(drivingTimeText(0)).toBe("0 min");
    expect(drivingTimeText(10)).toBe("1 min");
    expect(drivingTimeText(7 * 60 + 20)).toBe("7 min");
    expect(drivingTimeText(65 * 60)).toBe("1 h 5 min");
    expect(drivingTimeText(120 * 60)).toBe("2 h");
  });
});

describe("US phone numbers (NANP NPA-NXX-XXXX, stored as E.164)", () => {
  it("accepts the usual ways of typing one", () => {
    for (const typed of [
      "(609) 555-0142",
      "609-555-0142",
      "609.555.0142",
      "6095550142",
      "+1 609 555 0142",
      "1-609-555-0142",
    ])
      expect(usPhoneE164(typed), typed).toBe("+16095550142");
    expect(formatUsPhone("+16095550142")).toBe("(609) 555-0142");
  });

  it("refuses what is not a US number", () => {
    for (const typed of [
      "555-0142", // seven digits: no area code
      "(109) 555-0142", // an area code cannot start with 0 or 1
      "(609) 155-0142", // nor an exchange
      "+44 20 7946 0958", // another country
      "609-555-0142 x12", // extensions are refused
      "1-800-FLOWERS", // letters
      "60955501420", // eleven digits not starting with 1
      "",
    ])
      expect(usPhoneE164(typed), typed).toBeNull();
  });
});
