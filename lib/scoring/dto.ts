// Index histories as the reads of lib/scoring/queries.ts return them.
import type { DerivedDay } from "@/lib/weather/derived";

import type {
  CheckPoint,
  NitrogenEvent,
  PropertyVisitIndex,
  SeasonChange,
  Trend,
  ZoneCorrelations,
} from "./history";

interface DailyWater {
  date: string;
  wateringIn: number;
}

export interface ZoneScoreHistory {
  zoneId: string;
  name: string;
  areaFt2: number;
  points: CheckPoint[];
  applications: NitrogenEvent[];
  waterings: DailyWater[];
  trend: Trend | null;
  season: SeasonChange | null;
  correlations: ZoneCorrelations;
}

export interface PropertyScoreHistory {
  propertyId: string;
  today: string;
  from: string;
  weather: { status: "ok" | "cached" | "unavailable"; message: string | null; days: DerivedDay[] };
  visits: (PropertyVisitIndex & { hasPhoto: boolean })[];
  applications: NitrogenEvent[];
  trend: Trend | null;
  season: SeasonChange | null;
  zones: ZoneScoreHistory[];
}

export interface BookScoring {
  /** Properties in the book, and how many have an Index. */
  total: number;
  scored: number;
  median: number | null;
  distribution: { from: number; to: number; count: number }[];
  /** Declining properties, steepest first. */
  declining: { propertyId: string; name: string; slopePer30Days: number }[];
  zonesWithEnoughChecks: number;
  zonesRespondingToN: number;
  zonesTotal: number;
}
