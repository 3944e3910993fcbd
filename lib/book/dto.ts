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
}
