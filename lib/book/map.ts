// Book rows: a property with its summary row (lib/book/queries.ts) → the book's row DTO.
import type { Selectable } from "kysely";

import type { Property, PropertySummariesTable } from "@/db/schema";

import type { BookMapDto, BookRow } from "./dto";

export type BookPageRow = Selectable<PropertySummariesTable> &
  Pick<Property, "id" | "name" | "street" | "city" | "technician_id"> &
  Partial<Pick<Property, "latitude" | "longitude">> & {
    technician_name: string | null;
  };

export const toBookRow = (r: BookPageRow): BookRow => ({
  propertyId: r.id,
  name: r.name,
  street: r.street,
  city: r.city,
  technician:
    r.technician_id && r.technician_name ? { id: r.technician_id, name: r.technician_name } : null,
  lastVisitOn: r.last_visit_on,
  nextVisitOn: r.next_visit_on,
  missedVisitOn: r.missed_visit_on,
  isOverdue: r.is_overdue,
  latestIndex: r.latest_index,
  latestIndexOn: r.latest_index_on,
  trendWord: r.trend_word,
  trendSlope: r.trend_slope,
  trendN: r.trend_n,
  alerts: { high: r.alerts_high, moderate: r.alerts_moderate, low: r.alerts_low },
  alertKinds: r.alert_kinds,
  nYtdLb: r.n_ytd_lb,
  nMaxLb: r.n_max_lb,
  attentionScore: r.attention_score,
  reasons: r.attention_reasons,
  checkSoon: false,
});

/** Coordinates to 5 decimals (about 1 m), which is all a map point needs. */
const round5 = (x: number) => Math.round(x * 1e5) / 1e5;

export interface BookMapRow {
  id: string;
  name: string;
  latitude: number;
  longitude: number;
  latest_index: number | null;
  alerts_high: number;
  alerts_moderate: number;
  alerts_low: number;
  alert_kinds: string[];
}

/** Rows → the map's compact points, each kind named once in `kinds`. */
export function toBookMap(rows: BookMapRow[], checkSoon: Set<string>): BookMapDto {
  const kinds: string[] = [];
  const kindAt = new Map<string, number>();
  const position = (kind: string) => {
    let i = kindAt.get(kind);
    if (i === undefined) {
      i = kinds.push(kind) - 1;
      kindAt.set(kind, i);
    }
    return i;
  };
  return {
    kinds,
    points: rows.map((r) => [
      r.id,
      r.name,
      round5(r.latitude),
      round5(r.longitude),
      r.latest_index === null ? null : Math.round(r.latest_index),
      [r.alerts_high, r.alerts_moderate, r.alerts_low],
      r.alert_kinds.map(position),
      checkSoon.has(r.id) ? 1 : 0,
    ]),
  };
}
