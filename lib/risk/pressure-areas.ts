// Pressure areas (pure): risk alerts of one kind raised on properties close to each other in place
// and date, grouped by ST-DBSCAN over great-circle distance and the day each alert was raised.
//
// The method
//   Ester, Kriegel, Sander & Xu (1996), "A density-based algorithm for discovering clusters in
//   large spatial databases with noise", KDD-96, pp. 226–231 (DBSCAN), definitions 1–5:
//     Def. 1  "The Eps-neighborhood of a point p, denoted by N_Eps(p), is defined by
//             N_Eps(p) = {q ∈ D | dist(p,q) ≤ Eps}."
//     Def. 2  p is directly density-reachable from q if p ∈ N_Eps(q) and |N_Eps(q)| ≥ MinPts
//             (the core point condition).
//     Def. 3  density-reachable: a chain of directly density-reachable points.
//     Def. 5  noise: the points of D that belong to no cluster.
//   A point whose neighbourhood holds at least MinPts points is a *core point*; a point within
//   Eps of a core point but not itself one is a *border point*; a cluster is every point
//   density-reachable from one core point.
//   Birant & Kut (2007), "ST-DBSCAN: An algorithm for clustering spatial–temporal data", Data &
//   Knowledge Engineering 60(1), pp. 208–221, generalise the neighbourhood to two distances:
//     "Eps1: Distance parameter for spatial attributes (latitude and longitude).
//      Eps2: Distance parameter for non-spatial attributes.
//      MinPts: Minimum number of points within Eps1 and Eps2 distance of a point."
//   so a neighbour is within Eps1 in place AND within Eps2 in the other attribute — here the day
//   the alert was raised (|Δdays| ≤ Eps2). Their fourth parameter, ΔЄ (the density-difference
//   threshold between a cluster's mean non-spatial value and a new point), is not used: the only
//   non-spatial attribute is the date, which Eps2 already bounds. (Definitions quoted from memory
//   of both papers; the algorithm below is DBSCAN's, with ST-DBSCAN's two-distance neighbourhood.)
//
// Sward's choices
// - One point per (property, day raised): alerts of the same kind on two zones of one lawn, the
//   same day, are one point. MinPts counts distinct *properties* in the neighbourhood (the point's
//   own included), so one lawn with many zones or many episodes cannot make an area on its own.
//   With one point per property (as in tests/unit/pressure-areas.test.ts) this is DBSCAN's count.
// - Points are visited in input order and a border point joins the first cluster that reaches it,
//   as in Ester et al.'s algorithm (and @turf/clusters-dbscan, which the tests compare against).
// - Distance: haversine great-circle distance on a sphere of the mean Earth radius 6,371,008.8 m
//   (IUGG mean radius R1; Moritz 1980, "Geodetic Reference System 1980", Bulletin Géodésique 54);
//   haversine formula after Sinnott (1984), "Virtues of the Haversine", Sky & Telescope 68(2), 159.
// - A spatial grid of cells one Eps1 high limits the distance checks to neighbouring cells.
import { addDays, daysBetween } from "@/lib/dates";

/** Alert kinds that can make a pressure area: the disease weather models and drought stress
 * (lib/risk/rules.ts raises no grub alert, so grubs are not among them). */
export const PRESSURE_KINDS = [
  "dollar_spot_weather",
  "brown_patch_weather",
  "pythium_weather",
  "drought_stress",
] as const;
type PressureKind = (typeof PRESSURE_KINDS)[number];

/** The company's settings (`companies.pressure_*`), with Sward's defaults. */
export interface PressureSettings {
  /** Eps1 in miles. */
  distanceMi: number;
  /** Eps2 in days. */
  days: number;
  /** MinPts, counted in properties. */
  minProperties: number;
}

/**
 * Defaults (common practice, Sward's choice): a mile is a few streets of one neighbourhood, a week
 * is about one turn of a disease weather model's 5-day window, and three lawns is the smallest
 * number that reads as "around here" rather than two neighbours.
 */
const DEFAULT_PRESSURE_SETTINGS: PressureSettings = {
  distanceMi: 1,
  days: 7,
  minProperties: 3,
};

/** Bounds of the settings form (lib/company-settings/schemas.ts checks them). */
export const PRESSURE_BOUNDS = {
  distanceMi: { min: 0.1, max: 25 },
  days: { min: 1, max: 30 },
  minProperties: { min: 2, max: 20 },
} as const;

/** How far back the areas look (days before today): alerts raised earlier are history. */
const PRESSURE_LOOKBACK_DAYS = 28;

export interface PressureAlert {
  alertId: string;
  kind: string;
  propertyId: string;
  lat: number;
  lng: number;
  /** The day the alert was raised (YYYY-MM-DD). */
  raisedOn: string;
}

export interface PressureArea {
  /** Stable while the area grows: the kind and the id of its earliest alert (then smallest id). */
  key: string;
  kind: PressureKind;
  propertyIds: string[];
  alertIds: string[];
  firstOn: string;
  latestOn: string;
  /** Mean of its properties' positions, and the distance to the farthest (miles). */
  centre: { lat: number; lng: number };
  radiusMi: number;
}

const EARTH_RADIUS_M = 6_371_008.8;
const METRES_PER_MILE = 1_609.344; // international mile (exact)
const EARTH_RADIUS_MI = EARTH_RADIUS_M / METRES_PER_MILE;
const rad = (deg: number) => (deg * Math.PI) / 180;

/** Great-circle distance in miles (haversine). */
export function greatCircleMiles(a: { lat: number; lng: number }, b: { lat: number; lng: number }) {
  const dLat = rad(b.lat - a.lat);
  const dLng = rad(b.lng - a.lng);
  const h =
    Math.sin(dLat / 2) ** 2 + Math.cos(rad(a.lat)) * Math.cos(rad(b.lat)) * Math.sin(dLng / 2) ** 2;
  return 2 * EARTH_RADIUS_MI * Math.asin(Math.min(1, Math.sqrt(h)));
}

interface Point {
  lat: number;
  lng: number;
  propertyId: string;
  day: number;
  raisedOn: string;
  alertIds: string[];
}

/** Cluster labels: undefined = unvisited, NOISE, or a cluster number. */
const NOISE = -1;

/**
 * ST-DBSCAN over the points: for each point, the cluster it belongs to (0, 1, …) or NOISE.
 * `days` = Infinity opens the time window (plain DBSCAN over great-circle distance).
 */
export function stDbscan(
  points: readonly { lat: number; lng: number; propertyId: string; day: number }[],
  settings: PressureSettings,
): number[] {
  const eps1 = settings.distanceMi;
  const eps2 = settings.days;
  const n = points.length;
  // Grid: rows one Eps1 of latitude high, columns one Eps1 wide at the data's highest latitude,
  // and (with a finite Eps2) slices Eps2 days long; a neighbour lies in the 3 × 3 (× 3) around.
  const epsLatDeg = (eps1 / EARTH_RADIUS_MI) * (180 / Math.PI);
  const maxAbsLat = points.reduce((m, p) => Math.max(m, Math.abs(p.lat)), 0);
  const epsLngDeg = epsLatDeg / Math.max(Math.cos(rad(Math.min(maxAbsLat + epsLatDeg, 89))), 1e-6);
  const timed = Number.isFinite(eps2) && eps2 > 0;
  const row = new Int32Array(n);
  const col = new Int32Array(n);
  const slice = new Int32Array(n);
  const latR = new Float64Array(n);
  const lngR = new Float64Array(n);
  const cosLat = new Float64Array(n);
  const day = new Float64Array(n);
  const property = new Int32Array(n);
  const propertyIndex = new Map<string, number>();
  // Cell keys as numbers (rows and columns stay far below 10⁶ for any latitude and Eps1 ≥ 0.1 mi).
  const cellKey = (r: number, c: number, t: number) => (r * 2_000_003 + c) * 4_096 + t;
  const grid = new Map<number, number[]>();
  points.forEach((p, i) => {
    row[i] = Math.floor(p.lat / epsLatDeg);
    col[i] = Math.floor(p.lng / epsLngDeg);
    slice[i] = timed ? Math.floor(p.day / eps2) : 0;
    latR[i] = rad(p.lat);
    lngR[i] = rad(p.lng);
    cosLat[i] = Math.cos(latR[i]!);
    day[i] = p.day;
    let k = propertyIndex.get(p.propertyId);
    if (k === undefined) propertyIndex.set(p.propertyId, (k = propertyIndex.size));
    property[i] = k;
    const key = cellKey(row[i]!, col[i]!, slice[i]!);
    const cell = grid.get(key);
    if (cell) cell.push(i);
    else grid.set(key, [i]);
  });
  // The haversine of Eps1: h ≤ sin²(Eps1 / 2R) ⇔ great-circle distance ≤ Eps1 (same formula as
  // greatCircleMiles, without the square root and arcsine per pair).
  const hMax = Math.sin(eps1 / EARTH_RADIUS_MI / 2) ** 2;
  const dt = timed ? [-1, 0, 1] : [0];

  /** Def. 1 with ST-DBSCAN's two distances: within Eps1 miles and Eps2 days (the point itself included). */
  const epsRad = eps1 / EARTH_RADIUS_MI;
  const neighbourhood = (i: number): number[] => {
    const out: number[] = [];
    const di = day[i]!;
    const li = latR[i]!;
    for (let dr = -1; dr <= 1; dr++)
      for (let dc = -1; dc <= 1; dc++)
        for (const ds of dt) {
          const cell = grid.get(cellKey(row[i]! + dr, col[i]! + dc, slice[i]! + ds));
          if (!cell) continue;
          for (const j of cell) {
            if (Math.abs(day[j]! - di) > eps2 || Math.abs(latR[j]! - li) > epsRad) continue;
            const h =
              Math.sin((latR[j]! - li) / 2) ** 2 +
              cosLat[i]! * cosLat[j]! * Math.sin((lngR[j]! - lngR[i]!) / 2) ** 2;
            if (h <= hMax) out.push(j);
          }
        }
    return out;
  };
  /** The core point condition (Def. 2), MinPts counted in distinct properties. */
  const seen = new Int32Array(propertyIndex.size).fill(-1);
  let stamp = 0;
  const isCore = (neighbours: number[]) => {
    if (neighbours.length < settings.minProperties) return false;
    stamp++;
    let distinct = 0;
    for (const j of neighbours)
      if (seen[property[j]!] !== stamp) {
        seen[property[j]!] = stamp;
        if (++distinct >= settings.minProperties) return true;
      }
    return false;
  };

  const UNVISITED = -2;
  const labels = new Int32Array(n).fill(UNVISITED);
  let cluster = 0;
  for (let i = 0; i < n; i++) {
    if (labels[i] !== UNVISITED) continue;
    const seeds = neighbourhood(i);
    if (!isCore(seeds)) {
      labels[i] = NOISE; // may become a border point of a later cluster
      continue;
    }
    labels[i] = cluster;
    const queue: number[] = [];
    for (const j of seeds) if (labels[j] === UNVISITED || labels[j] === NOISE) queue.push(j);
    for (let k = 0; k < queue.length; k++) {
      const j = queue[k]!;
      if (labels[j] === NOISE) labels[j] = cluster; // border point (Def. 3: reachable, not core)
      if (labels[j] !== UNVISITED) continue;
      labels[j] = cluster;
      const more = neighbourhood(j);
      if (isCore(more))
        for (const m of more) if (labels[m] === UNVISITED || labels[m] === NOISE) queue.push(m);
    }
    cluster++;
  }
  return Array.from(labels);
}

/** Pressure areas among the alerts: per kind, the ST-DBSCAN clusters, sorted by latest day (newest first). */
export function findPressureAreas(
  alerts: readonly PressureAlert[],
  settings: PressureSettings = DEFAULT_PRESSURE_SETTINGS,
): PressureArea[] {
  const areas: PressureArea[] = [];
  for (const kind of PRESSURE_KINDS) {
    const byPoint = new Map<string, Point>();
    const ofKind = alerts
      .filter((a) => a.kind === kind && Number.isFinite(a.lat) && Number.isFinite(a.lng))
      .sort((a, b) =>
        a.raisedOn < b.raisedOn ? -1 : a.raisedOn > b.raisedOn ? 1 : a.alertId < b.alertId ? -1 : 1,
      );
    if (!ofKind.length) continue;
    const origin = ofKind[0]!.raisedOn;
    for (const a of ofKind) {
      const key = `${a.propertyId}:${a.raisedOn}`;
      const point = byPoint.get(key);
      if (point) point.alertIds.push(a.alertId);
      else
        byPoint.set(key, {
          lat: a.lat,
          lng: a.lng,
          propertyId: a.propertyId,
          day: daysBetween(origin, a.raisedOn),
          raisedOn: a.raisedOn,
          alertIds: [a.alertId],
        });
    }
    const points = [...byPoint.values()];
    const labels = stDbscan(points, settings);
    const clusters = new Map<number, Point[]>();
    points.forEach((p, i) => {
      const l = labels[i]!;
      if (l === NOISE) return;
      const members = clusters.get(l);
      if (members) members.push(p);
      else clusters.set(l, [p]);
    });
    for (const members of clusters.values()) areas.push(toArea(kind, members));
  }
  return areas.sort((a, b) =>
    a.latestOn !== b.latestOn ? (a.latestOn < b.latestOn ? 1 : -1) : a.key < b.key ? -1 : 1,
  );
}

function toArea(kind: PressureKind, members: Point[]): PressureArea {
  // One position per property (a property's episodes share its location).
  const places = new Map<string, { lat: number; lng: number }>();
  for (const m of members) places.set(m.propertyId, { lat: m.lat, lng: m.lng });
  const ps = [...places.values()];
  const centre = {
    lat: ps.reduce((s, p) => s + p.lat, 0) / ps.length,
    lng: ps.reduce((s, p) => s + p.lng, 0) / ps.length,
  };
  const alertIds = members.flatMap((m) => m.alertIds);
  const days = members.map((m) => m.raisedOn).sort();
  // members are in input order (earliest first), so the first alert is the area's oldest.
  return {
    key: `${kind}:${members[0]!.alertIds[0]!}`,
    kind,
    propertyIds: [...places.keys()].sort(),
    alertIds,
    firstOn: days[0]!,
    latestOn: days.at(-1)!,
    centre,
    radiusMi: Math.max(...ps.map((p) => greatCircleMiles(centre, p))),
  };
}

/** The window of alerts the areas read: raised from this day on. */
export const pressureSince = (today: string) => addDays(today, -PRESSURE_LOOKBACK_DAYS);

/**
 * Is the place within the area's drawn circle? The circle is the area's radius plus a margin of
 * half the company's distance, so a lawn on the edge of the group counts as inside.
 */
export const drawnRadiusMi = (area: PressureArea, settings: PressureSettings) =>
  area.radiusMi + settings.distanceMi / 2;

export const isInsideArea = (
  area: PressureArea,
  settings: PressureSettings,
  place: { lat: number; lng: number },
) => greatCircleMiles(area.centre, place) <= drawnRadiusMi(area, settings);

/**
 * The drawn circle as a GeoJSON ring: the destination point at each bearing (the spherical
 * "destination given distance and bearing from start point" formula, e.g. Williams, Aviation
 * Formulary, §"Lat/lon given radial and distance").
 */
export function circleRing(
  centre: { lat: number; lng: number },
  radiusMi: number,
  steps = 48,
): [number, number][] {
  const d = radiusMi / EARTH_RADIUS_MI;
  const lat1 = rad(centre.lat);
  const lng1 = rad(centre.lng);
  const ring: [number, number][] = [];
  for (let i = 0; i <= steps; i++) {
    const brng = (2 * Math.PI * (i % steps)) / steps;
    const lat2 = Math.asin(
      Math.sin(lat1) * Math.cos(d) + Math.cos(lat1) * Math.sin(d) * Math.cos(brng),
    );
    const lng2 =
      lng1 +
      Math.atan2(
        Math.sin(brng) * Math.sin(d) * Math.cos(lat1),
        Math.cos(d) - Math.sin(lat1) * Math.sin(lat2),
      );
    ring.push([round6((lng2 * 180) / Math.PI), round6((lat2 * 180) / Math.PI)]);
  }
  return ring;
}

const round6 = (x: number) => Math.round(x * 1e6) / 1e6;
