// GET /api/v1/records/applications?from=YYYY-MM-DD&to=YYYY-MM-DD — the application records of a
// date range as CSV (UTF-8 with BOM, headers in words and dates in the company's locale, formula-like
// cells neutralised), streamed (manager).
import { listApplicationRecords, RECORD_COLUMNS } from "@/lib/applications/records/queries";
import { recordsRangeQuery } from "@/lib/applications/records/schemas";
import { route } from "@/lib/auth/guards";
import { csvResponse } from "@/lib/http/csv";
import { translator } from "@/lib/i18n/translate";

export const GET = route(
  { access: ["manager"], query: recordsRangeQuery },
  async ({ actor, query }) => {
    const t = translator(actor.companyLocale, "csv");
    return csvResponse(
      RECORD_COLUMNS.map((c) => t(`records.${c}`)),
      listApplicationRecords(actor, query.from, query.to),
      `application-records-${query.from}-to-${query.to}.csv`,
    );
  },
);
