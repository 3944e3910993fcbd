// Book rows: a property with its summary row (lib/book/queries.ts) → the book's row DTO.
import type { Selectable } from "kysely";

import type { Property, PropertySummariesTable } from "@/db/schema";

import type { BookRow } from "./dto";

export type BookPageRow = Selectable<PropertySummariesTable> &
  Pick<Property, "id" | "name" | "street" | "city" | "technician_id"> & {
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
});
