// The day's route worked out without a database (lib/routing): great-circle distance against
// published worked examples, and the driving order (nearest neighbour, 2-opt, Or-opt) against
// cases checked by hand and against exhaustive search.
import fc from "fast-check";
import { describe, expect, it } from "vitest";

import {
  ASSUMED_SPEED_M_PER_S,
  EARTH_MEAN_RADIUS_M,
  estimatedMatrix,
  haversineMeters,
  METERS_PER_MILE,
  US_ROAD_CIRCUITY,
} from "@/lib/routing/great-circle";
import { nearestNeighbourRoute, pathCost, planRoute, type RouteProblem } from "@/lib/routing/order";

import { exhaustiveBestRoute, randomStops } from "../helpers/exhaustive-route";
import { seededRandom } from "../helpers/seeded-random";

describe("great-circle distance (haversine)", () => {
  it("Nashville (BNA) to Los Angeles (LAX): Rosetta Code's worked example, 2,887.26 km on a 6,372.8 km sphere", () => {
    // Rosetta Code, task "Haversine formula": BNA N 36°7.2' W 86°40.2' (36.12, -86.67), LAX
    // N 33°56.4' W 118°24.0' (33.94, -118.40), R = 6372.8 km → 2887.2599506071106 km (the task's
    // published answer; digits quoted from memory).
    const bna = { latitude: 36.12, longitude: -86.67 };
    const lax = { latitude: 33.94, longitude: -118.4 };
    expect(haversineMeters(bna, lax, 6_372_800) / 1000).toBeCloseTo(2887.2599506, 5);
    // The same pair on the GRS 80 mean radius the product uses.
    expect(haversineMeters(bna, lax) / 1000).toBeCloseTo(2886.45, 1);
  });

  it("Los Angeles (LAX) to New York (JFK): the Aviation Formulary's worked example, 0.623585 rad ≈ 2,144 nm", () => {
    // E. Williams, "Aviation Formulary" (worked examples): LAX 33°57'N 118°24'W, JFK 40°38'N
    // 73°47'W, d = 0.623585 radians = 2144 nm (1 nm = one minute of arc). From memory.
    const lax = { latitude: 33 + 57 / 60, longitude: -(118 + 24 / 60) };
    const jfk = { latitude: 40 + 38 / 60, longitude: -(73 + 47 / 60) };
    const radians = haversineMeters(lax, jfk, 1);
    expect(radians).toBeCloseTo(0.623585, 6);
    expect(Math.round((radians * 180 * 60) / Math.PI)).toBe(2144);
  });

  it("uses the GRS 80 mean radius R1 = 6,371,008.8 m (Moritz 1980)", () => {
    expect(EARTH_MEAN_RADIUS_M).toBe(6_371_008.8);
  });

  it("one degree of latitude along a meridian is 111.195 km on the mean sphere (2πR/360)", () => {
    const d = haversineMeters({ latitude: 40, longitude: -75 }, { latitude: 41, longitude: -75 });
    expect(d).toBeCloseTo((2 * Math.PI * EARTH_MEAN_RADIUS_M) / 360, 3);
  });

  it("is zero for one point, symmetric, and half the circumference for antipodes", () => {
    const a = { latitude: 40.35, longitude: -74.66 };
    expect(haversineMeters(a, a)).toBe(0);
    const b = { latitude: 40.29, longitude: -74.7 };
    expect(haversineMeters(a, b)).toBeCloseTo(haversineMeters(b, a), 9);
    expect(
      haversineMeters({ latitude: 0, longitude: 0 }, { latitude: 0, longitude: 180 }),
    ).toBeCloseTo(Math.PI * EARTH_MEAN_RADIUS_M, 3);
  });

  it("the estimate: great-circle × 1.2 (Ballou, Rahardja & Sakai 2002, US) at 30 mph (our assumption)", () => {
    expect(US_ROAD_CIRCUITY).toBe(1.2);
    expect(METERS_PER_MILE).toBe(1609.344); // the international mile, exact
    const a = { latitude: 40, longitude: -75 };
    const b = { latitude: 40.1, longitude: -75 }; // 6.91 mi apart as the crow flies
    const m = estimatedMatrix([a, b]);
    expect(m.meters[0]![0]).toBe(0);
    expect(m.meters[0]![1]).toBeCloseTo(haversineMeters(a, b) * 1.2, 6);
    // 30 mph: 8.29 mi of road take 16.6 minutes.
    expect(m.seconds[0]![1]! / 60).toBeCloseTo((m.meters[0]![1]! / METERS_PER_MILE / 30) * 60, 6);
    expect(ASSUMED_SPEED_M_PER_S).toBeCloseTo(13.4112, 4);
  });
});

/** Points on a plane (x, y), Euclidean costs: hand-checkable. */
function plane(points: [number, number][]) {
  return points.map(([x1, y1]) => points.map(([x2, y2]) => Math.hypot(x2 - x1, y2 - y1)));
}

describe("the driving order", () => {
  it("a square from a depot at one corner goes round it (cost 4), either way", () => {
    const cost = plane([
      [0, 0],
      [1, 1],
      [0, 1],
      [1, 0],
    ]);
    const route = planRoute({ cost, stops: [1, 2, 3], start: 0, end: 0 });
    expect(route.cost).toBeCloseTo(4, 9);
    expect([
      [3, 1, 2],
      [2, 1, 3],
    ]).toContainEqual(route.order);
  });

  it("points on a line with the depot between them: nearest neighbour zigzags (16), 2-opt straightens it (14)", () => {
    // Depot at x = 0; stops at 1, −2, 5. Nearest neighbour: 0→1 (1), then −2 (3, nearer than 5's 4),
    // then 5 (7), home (5) = 16. Reversing the first two stops (one 2-opt exchange):
    // 0→−2→1→5→0 = 2 + 3 + 4 + 5 = 14, the least any closed tour can drive (twice the span −2…5).
    const cost = plane([
      [0, 0],
      [1, 0],
      [-2, 0],
      [5, 0],
    ]);
    const problem: RouteProblem = { cost, stops: [1, 2, 3], start: 0, end: 0 };
    expect(nearestNeighbourRoute(problem)).toEqual({ order: [1, 2, 3], cost: 16 });
    const route = planRoute(problem);
    expect(route.cost).toBe(14);
    expect([
      [2, 1, 3],
      [3, 1, 2],
    ]).toContainEqual(route.order);
  });

  it("an open route (no yard, no start point) drives the line end to end", () => {
    const cost = plane([
      [0, 0],
      [5, 0],
      [1, 0],
      [3, 0],
    ]);
    const route = planRoute({ cost, stops: [0, 1, 2, 3], start: null, end: null });
    expect(route.cost).toBe(5);
    expect([
      [0, 2, 3, 1],
      [1, 3, 2, 0],
    ]).toContainEqual(route.order);
  });

  it("one stop: out and back", () => {
    const cost = plane([
      [0, 0],
      [3, 4],
    ]);
    expect(planRoute({ cost, stops: [1], start: 0, end: 0 })).toEqual({ order: [1], cost: 10 });
    expect(planRoute({ cost, stops: [1], start: null, end: null })).toEqual({
      order: [1],
      cost: 0,
    });
  });

  it("zero stops: nothing to drive", () => {
    const cost = plane([[0, 0]]);
    expect(planRoute({ cost, stops: [], start: 0, end: 0 })).toEqual({ order: [], cost: 0 });
    expect(planRoute({ cost, stops: [], start: null, end: null })).toEqual({ order: [], cost: 0 });
  });

  it("stops at identical locations (two homes sharing a lot) are driven one after the other", () => {
    const cost = plane([
      [0, 0],
      [2, 0],
      [2, 0],
      [2, 0],
      [0, 1],
    ]);
    const route = planRoute({ cost, stops: [1, 2, 3, 4], start: 0, end: 0 });
    // 0 → the three at (2, 0) → (0, 1) → 0: 2 + 0 + 0 + √5 + 1.
    expect(route.cost).toBeCloseTo(3 + Math.sqrt(5), 9);
    const at = (s: number) => route.order.indexOf(s);
    const positions = [at(1), at(2), at(3)].sort();
    expect(positions[2]! - positions[0]!).toBe(2);
  });

  it("follows one-way costs: a cheaper direction round the loop is taken", () => {
    // Driving 0→1→2→0 costs 1 + 1 + 1; the other way 0→2→1→0 costs 5 + 5 + 5.
    const cost = [
      [0, 1, 5],
      [5, 0, 1],
      [1, 5, 0],
    ];
    expect(planRoute({ cost, stops: [2, 1], start: 0, end: 0 })).toEqual({
      order: [1, 2],
      cost: 3,
    });
  });

  it("is within 10 % of exhaustive search on 40 random 9-stop days (and never worse than nearest neighbour)", () => {
    const random = seededRandom(20261203);
    let worst = 0;
    for (let n = 0; n < 40; n++) {
      const points = randomStops(random, 10); // point 0 is the yard
      const { seconds } = estimatedMatrix(points);
      const problem: RouteProblem = {
        cost: seconds,
        stops: [1, 2, 3, 4, 5, 6, 7, 8, 9],
        start: 0,
        end: 0,
      };
      const best = exhaustiveBestRoute(problem);
      const route = planRoute(problem);
      expect(route.cost).toBeGreaterThanOrEqual(best.cost - 1e-6);
      expect(route.cost).toBeLessThanOrEqual(nearestNeighbourRoute(problem).cost + 1e-6);
      worst = Math.max(worst, route.cost / best.cost - 1);
    }
    expect(worst).toBeLessThanOrEqual(0.1);
  });

  it("always returns each stop exactly once and prices the order it returns (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 0, max: 50 }), fc.integer({ min: 0, max: 50 })), {
          minLength: 1,
          maxLength: 12,
        }),
        fc.boolean(),
        (points, withDepot) => {
          const cost = plane(points);
          const stops = points.map((_, i) => i).slice(withDepot ? 1 : 0);
          const problem: RouteProblem = {
            cost,
            stops,
            start: withDepot ? 0 : null,
            end: withDepot ? 0 : null,
          };
          const route = planRoute(problem);
          expect([...route.order].sort((a, b) => a - b)).toEqual(stops);
          expect(route.cost).toBeCloseTo(pathCost(problem, route.order), 9);
        },
      ),
      { numRuns: 200 },
    );
  });
});
