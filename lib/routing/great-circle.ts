// Great-circle distance between two points on the Earth, by the haversine formula, and the
// estimate of a road trip from it (pure).
//
// Haversine formula — R. W. Sinnott, "Virtues of the Haversine", Sky and Telescope 68 (2), 1984,
// p. 159:
//   a = sin²(Δφ/2) + cos φ1 · cos φ2 · sin²(Δλ/2),   d = 2 R · asin(√a)
// with φ latitude, λ longitude in radians. The sphere's radius is the Earth's mean radius
// R1 = 6,371,008.8 m of the Geodetic Reference System 1980 (H. Moritz, "Geodetic Reference System
// 1980", Bulletin Géodésique 54, 1980). On the ellipsoid a great-circle figure is off by up to
// about 0.5 %, far below what a road trip adds.
//
// Road distance ≈ great-circle distance × circuity factor. For the United States, Ballou,
// Rahardja & Sakai, "Selected country circuity factors for road travel distance estimation",
// Transportation Research Part A 36 (2002) 843–848, give about 1.20 (the figure is quoted here from
// memory of the paper's table). The driving speed is our own assumption for suburban stops
// (30 mph), not a published figure: it only serves when no routing service answers.

export interface LatLng {
  latitude: number;
  longitude: number;
}

/** The Earth's mean radius R1 of GRS 80, in meters. */
export const EARTH_MEAN_RADIUS_M = 6_371_008.8;

/** The international mile (1959): exactly 1,609.344 m. */
export const METERS_PER_MILE = 1609.344;

/** US road circuity factor (Ballou, Rahardja & Sakai 2002; from memory, see above). */
export const US_ROAD_CIRCUITY = 1.2;

/** Our assumed average driving speed between suburban stops: 30 mph, in meters per second. */
export const ASSUMED_SPEED_M_PER_S = (30 * METERS_PER_MILE) / 3600;

const toRadians = (degrees: number) => (degrees * Math.PI) / 180;

/** Great-circle distance in meters on a sphere of `radius` meters (default: the Earth's mean radius). */
export function haversineMeters(a: LatLng, b: LatLng, radius = EARTH_MEAN_RADIUS_M): number {
  const phi1 = toRadians(a.latitude);
  const phi2 = toRadians(b.latitude);
  const dPhi = phi2 - phi1;
  const dLambda = toRadians(b.longitude - a.longitude);
  const h = Math.sin(dPhi / 2) ** 2 + Math.cos(phi1) * Math.cos(phi2) * Math.sin(dLambda / 2) ** 2;
  // min(1, …): rounding can push h a hair above 1 for antipodal points.
  return 2 * radius * Math.asin(Math.sqrt(Math.min(1, h)));
}

export interface TravelMatrix {
  /** meters[i][j]: road distance from point i to point j. */
  meters: number[][];
  /** seconds[i][j]: driving time from point i to point j. */
  seconds: number[][];
}

/**
 * The estimated matrix when no routing service answers: great-circle distance × the US circuity
 * factor, driven at the assumed speed.
 */
export function estimatedMatrix(points: readonly LatLng[]): TravelMatrix {
  const meters = points.map((a) => points.map((b) => haversineMeters(a, b) * US_ROAD_CIRCUITY));
  return { meters, seconds: meters.map((row) => row.map((m) => m / ASSUMED_SPEED_M_PER_S)) };
}
