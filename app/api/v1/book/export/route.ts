// GET /api/v1/book/export?… — the book's current filtered view (same query as the page) as CSV
// (UTF-8 with BOM, headers in words and dates in the company's locale, formula-like cells
// neutralised), streamed (manager).
import { route } from "@/lib/auth/guards";
import { listBookRows } from "@/lib/book/queries";
import { bookQuery } from "@/lib/book/schemas";
import { formatNumericDate } from "@/lib/dates";
import { csvResponse } from "@/lib/http/csv";
import { translator } from "@/lib/i18n/translate";
import { alertKindLabel } from "@/lib/risk/labels";

const COLUMNS = [
  "property",
  "street",
  "city",
  "technician",
  "last_visit",
  "next_visit",
  "overdue",
  "property_index",
  "trend",
  "slope_per_30_days",
  "alerts_high",
  "alerts_moderate",
  "alerts_low",
  "alert_kinds",
  "n_ytd_lb_per_1000",
  "n_top_of_range_lb",
  "needs_attention",
] as const;

export const GET = route({ access: ["manager"], query: bookQuery }, async ({ actor, query }) => {
  const t = translator(actor.companyLocale, "csv");
  const trendT = translator(actor.companyLocale, "trend");
  const date = (iso: string | null) => (iso ? formatNumericDate(iso, actor.companyLocale) : "");
  async function* rows() {
    for await (const r of listBookRows(actor, { ...query, after: undefined })) {
      yield [
        r.name,
        r.street,
        r.city,
        r.technician?.name ?? "",
        date(r.lastVisitOn),
        date(r.nextVisitOn),
        r.isOverdue ? t("yes") : t("no"),
        r.latestIndex === null ? "" : Math.round(r.latestIndex * 10) / 10,
        r.trendWord ? trendT(r.trendWord) : "",
        r.trendSlope === null ? "" : Math.round(r.trendSlope * 10) / 10,
        r.alerts.high,
        r.alerts.moderate,
        r.alerts.low,
        r.alertKinds.map(alertKindLabel).join("; "),
        Math.round(r.nYtdLb * 100) / 100,
        r.nMaxLb === null ? "" : Math.round(r.nMaxLb * 100) / 100,
        r.reasons.join("; "),
      ];
    }
  }
  return csvResponse(
    COLUMNS.map((c) => t(`book.${c}`)),
    rows(),
    `book-${new Date().toISOString().slice(0, 10)}.csv`,
  );
});
