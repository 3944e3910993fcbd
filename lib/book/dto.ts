// One row of the manager's book (lib/book/queries.ts).
export interface BookRow {
  propertyId: string;
  name: string;
  street: string;
  city: string;
  technician: { id: string; name: string } | null;
  lastVisitOn: string | null;
  nextVisitOn: string | null;
  missedVisitOn: string | null;
  isOverdue: boolean;
  latestIndex: number | null;
  latestIndexOn: string | null;
  trendWord: "improving" | "steady" | "declining" | null;
  trendSlope: number | null;
  trendN: number;
  alerts: { high: number; moderate: number; low: number };
  alertKinds: string[];
  nYtdLb: number;
  nMaxLb: number | null;
  attentionScore: number;
  reasons: string[];
  /** Inside a pressure area without a visit in its window (lib/pressure-areas/read.ts). */
  checkSoon: boolean;
}

/** One property on the book's map: [id, name, lat, lng, Index (rounded) or null, open alerts
 * high/moderate/low, positions in `kinds` of its open alerts' kinds, 1 when "Check soon"]. */
type BookMapPoint = [
  id: string,
  name: string,
  lat: number,
  lng: number,
  index: number | null,
  alerts: [high: number, moderate: number, low: number],
  kinds: number[],
  checkSoon: 0 | 1,
];

/** The book's map data (GET /api/v1/book/map): compact tuples, kinds named once. */
export interface BookMapDto {
  kinds: string[];
  points: BookMapPoint[];
}
