// Pressure areas (lib/risk/pressure-areas.ts): ST-DBSCAN over great-circle distance and date.
// Hand-checked cases, the distance against a published worked example and a reference library,
// and the clustering against @turf/clusters-dbscan (a general-purpose open-source DBSCAN) with
// the time window wide open.
import clustersDbscan from "@turf/clusters-dbscan";
import { featureCollection, point } from "@turf/helpers";
import { describe, expect, it } from "vitest";

import {
  circleRing,
  findPressureAreas,
  greatCircleMiles,
  isInsideArea,
  stDbscan,
  type PressureAlert,
} from "@/lib/risk/pressure-areas";
import { seededRandom } from "@/tests/helpers/seeded-random";

/** Miles per degree of latitude on the sphere of radius 6,371,008.8 m: π R / 180. */
const MI_PER_DEG_LAT = (Math.PI * (6_371_008.8 / 1_609.344)) / 180;
const BASE = { lat: 39.95, lng: -86.1 };
/** A place `north` and `east` miles from BASE (east measured at BASE's latitude). */
const at = (north: number, east: number) => ({
  lat: BASE.lat + north / MI_PER_DEG_LAT,
  lng: BASE.lng + east / (MI_PER_DEG_LAT * Math.cos((BASE.lat * Math.PI) / 180)),
});
let n = 0;
const alert = (
  propertyId: string,
  place: { lat: number; lng: number },
  raisedOn = "2026-07-10",
  kind = "dollar_spot_weather",
): PressureAlert => ({
  alertId: `a${String(++n).padStart(4, "0")}`,
  kind,
  propertyId,
  raisedOn,
  ...place,
});
const SETTINGS = { distanceMi: 1, days: 7, minProperties: 3 };

describe("great-circle distance", () => {
  it("matches the Aviation Formulary's worked example LAX → JFK, 0.623585 rad (≈ 2,144 nm)", () => {
    // Ed Williams, "Aviation Formulary" V1.47, worked example: LAX (33°57′N, 118°24′W) to JFK
    // (40°38′N, 73°47′W), d = 0.623585 radians (from memory of the published example).
    const lax = { lat: 33 + 57 / 60, lng: -(118 + 24 / 60) };
    const jfk = { lat: 40 + 38 / 60, lng: -(73 + 47 / 60) };
    const radians = greatCircleMiles(lax, jfk) / (6_371_008.8 / 1_609.344);
    expect(radians).toBeCloseTo(0.623585, 5);
  });

  it("one degree of latitude is π R / 180 ≈ 69.09 mi on the mean-radius sphere", () => {
    expect(greatCircleMiles({ lat: 40, lng: -86 }, { lat: 41, lng: -86 })).toBeCloseTo(69.093, 2);
  });
});

describe("pressure areas: hand-checked cases", () => {
  it("three lawns a third of a mile apart with dollar spot weather the same week make one area", () => {
    const areas = findPressureAreas(
      [
        alert("p1", at(0, 0), "2026-07-08"),
        alert("p2", at(0.3, 0), "2026-07-10"),
        alert("p3", at(0, 0.3), "2026-07-12"),
      ],
      SETTINGS,
    );
    expect(areas).toHaveLength(1);
    expect(areas[0]!.propertyIds).toEqual(["p1", "p2", "p3"]);
    expect(areas[0]!.firstOn).toBe("2026-07-08");
    expect(areas[0]!.latestOn).toBe("2026-07-12");
    expect(areas[0]!.kind).toBe("dollar_spot_weather");
    // The centre is the mean (0.1 mi N, 0.1 mi E); the farthest lawn is p2 or p3: √(0.2² + 0.1²).
    expect(areas[0]!.radiusMi).toBeCloseTo(Math.hypot(0.2, 0.1), 3);
  });

  it("no area when the third alert is more than Eps2 days after both others", () => {
    // Days 0, 1 and 9: p3 is 8 and 9 days from p1 and p2 (> 7), so no point has 3 properties.
    const alerts = [
      alert("p1", at(0, 0), "2026-07-01"),
      alert("p2", at(0.3, 0), "2026-07-02"),
      alert("p3", at(0, 0.3), "2026-07-10"),
    ];
    expect(findPressureAreas(alerts, SETTINGS)).toEqual([]);
    // …and one with a window of 9 days (Eps2 is inclusive, Def. 1's ≤).
    expect(findPressureAreas(alerts, { ...SETTINGS, days: 9 })).toHaveLength(1);
  });

  it("no area when the third lawn is farther than Eps1 from both others", () => {
    const alerts = [
      alert("p1", at(0, 0)),
      alert("p2", at(0.5, 0)),
      alert("p3", at(2.0, 0)), // 2.0 and 1.5 mi away
    ];
    expect(findPressureAreas(alerts, SETTINGS)).toEqual([]);
    expect(findPressureAreas(alerts, { ...SETTINGS, distanceMi: 1.6 })).toHaveLength(1);
  });

  it("a chain of lawns 0.8 mi apart is one area: the inner ones are core points, the ends border points", () => {
    // A—B—C—D on a line, 0.8 mi steps, Eps1 1 mi: B's neighbourhood {A,B,C} and C's {B,C,D} hold 3;
    // A's {A,B} and D's {C,D} only 2, so A and D are border points reached from B and C.
    const pts = [0, 0.8, 1.6, 2.4].map((x, i) => ({ ...at(0, x), propertyId: `p${i}`, day: 0 }));
    expect(stDbscan(pts, SETTINGS)).toEqual([0, 0, 0, 0]);
    const areas = findPressureAreas(
      pts.map((p) => alert(p.propertyId, p)),
      SETTINGS,
    );
    expect(areas).toHaveLength(1);
    expect(areas[0]!.propertyIds).toHaveLength(4);
  });

  it("MinPts counts properties: one lawn's zones and episodes never make an area alone", () => {
    const alerts = [
      alert("p1", at(0, 0), "2026-07-08"),
      alert("p1", at(0, 0), "2026-07-08"), // a second zone, same day: the same point
      alert("p1", at(0, 0), "2026-07-10"), // a new episode two days later
      alert("p2", at(0.2, 0), "2026-07-09"),
    ];
    expect(findPressureAreas(alerts, SETTINGS)).toEqual([]);
    const withThird = findPressureAreas(
      [...alerts, alert("p3", at(0.2, 0.2), "2026-07-09")],
      SETTINGS,
    );
    expect(withThird).toHaveLength(1);
    expect(withThird[0]!.propertyIds).toEqual(["p1", "p2", "p3"]);
    expect(withThird[0]!.alertIds).toHaveLength(5);
  });

  it("kinds never mix, and kinds that cannot make an area are left out", () => {
    const places = [at(0, 0), at(0.3, 0), at(0, 0.3)];
    const mixed = [
      alert("p1", places[0]!, "2026-07-10", "dollar_spot_weather"),
      alert("p2", places[1]!, "2026-07-10", "brown_patch_weather"),
      alert("p3", places[2]!, "2026-07-10", "dollar_spot_weather"),
    ];
    expect(findPressureAreas(mixed, SETTINGS)).toEqual([]);
    const mowing = places.map((p, i) => alert(`p${i}`, p, "2026-07-10", "mowing_too_short"));
    expect(findPressureAreas(mowing, SETTINGS)).toEqual([]);
    const drought = places.map((p, i) => alert(`p${i}`, p, "2026-07-10", "drought_stress"));
    expect(findPressureAreas(drought, SETTINGS).map((a) => a.kind)).toEqual(["drought_stress"]);
  });

  it("an area keeps its key while it grows, and two apart make two areas", () => {
    const first = [
      alert("p1", at(0, 0), "2026-07-08"),
      alert("p2", at(0.3, 0), "2026-07-09"),
      alert("p3", at(0, 0.3), "2026-07-09"),
    ];
    const key = findPressureAreas(first, SETTINGS)[0]!.key;
    expect(key).toBe(`dollar_spot_weather:${first[0]!.alertId}`);
    const grown = findPressureAreas([...first, alert("p4", at(0.3, 0.3), "2026-07-12")], SETTINGS);
    expect(grown.map((a) => a.key)).toEqual([key]);
    const far = [0, 0.3, 0.6].map((x, i) => alert(`q${i}`, at(20, x), "2026-07-11"));
    expect(findPressureAreas([...first, ...far], SETTINGS)).toHaveLength(2);
  });

  it("a lawn within the drawn circle is inside; the circle's points lie at its radius", () => {
    const area = findPressureAreas(
      [alert("p1", at(0, 0)), alert("p2", at(0.3, 0)), alert("p3", at(0, 0.3))],
      SETTINGS,
    )[0]!;
    expect(isInsideArea(area, SETTINGS, at(0.1, 0.1))).toBe(true);
    expect(isInsideArea(area, SETTINGS, at(0.5, 0.5))).toBe(true); // 0.57 mi from the centre, drawn radius 0.72
    expect(isInsideArea(area, SETTINGS, at(1.5, 0))).toBe(false);
    const ring = circleRing(area.centre, 1);
    expect(ring[0]).toEqual(ring.at(-1));
    for (const [lng, lat] of ring)
      expect(greatCircleMiles(area.centre, { lat, lng })).toBeCloseTo(1, 3);
  });

  it("dates far apart and far from today work as any other (no window is assumed)", () => {
    const old = ["1999-12-28", "2000-01-01", "2000-01-03"].map((d, i) =>
      alert(`p${i}`, at(0, i * 0.2), d),
    );
    expect(findPressureAreas(old, SETTINGS)).toHaveLength(1);
  });
});

describe("against @turf/clusters-dbscan (time window wide open)", () => {
  /** Partition as sets of indices, independent of cluster numbering; noise as its own list. */
  const partition = (labels: number[]) => {
    const groups = new Map<number, number[]>();
    labels.forEach((l, i) => {
      if (!groups.has(l)) groups.set(l, []);
      groups.get(l)!.push(i);
    });
    return {
      noise: groups.get(-1) ?? [],
      clusters: [...groups.entries()]
        .filter(([l]) => l !== -1)
        .map(([, g]) => g.join(","))
        .sort(),
    };
  };

  for (const seed of [1, 2, 3, 4, 5, 6, 7, 8]) {
    it(`seed ${seed}: the same partition as turf on 300 lawns over a town`, () => {
      const random = seededRandom(seed);
      // Lawns around a few centres (neighbourhoods) plus scattered ones, 12 × 12 mi.
      const centres = Array.from({ length: 6 }, () => [random() * 12, random() * 12] as const);
      const places = Array.from({ length: 300 }, (_, i) => {
        if (i % 3 === 0) return at(random() * 12, random() * 12);
        const [cy, cx] = centres[i % centres.length]!;
        return at(cy + (random() - 0.5) * 1.5, cx + (random() - 0.5) * 1.5);
      });
      const eps = 0.3 + random() * 0.5;
      const minPts = 3 + Math.floor(random() * 3);
      const ours = stDbscan(
        places.map((p, i) => ({ ...p, propertyId: `p${i}`, day: Math.floor(random() * 200) })),
        { distanceMi: eps, days: Infinity, minProperties: minPts },
      );
      const turf = clustersDbscan(
        featureCollection(places.map((p) => point([p.lng, p.lat]))),
        eps,
        { units: "miles", minPoints: minPts },
      ).features.map((f) => (f.properties.cluster === undefined ? -1 : f.properties.cluster));
      const a = partition(ours);
      const b = partition(turf);
      expect(a.clusters.length).toBeGreaterThan(0); // the case is not trivial
      expect(a.noise.length).toBeGreaterThan(0);
      expect(a).toEqual(b);
    });
  }

  it("with the window closed to the same day, alerts on different days never group", () => {
    const places = [at(0, 0), at(0.1, 0), at(0, 0.1)];
    const labels = stDbscan(
      places.map((p, i) => ({ ...p, propertyId: `p${i}`, day: i * 2 })),
      { distanceMi: 1, days: 1, minProperties: 3 },
    );
    expect(labels).toEqual([-1, -1, -1]);
  });
});
