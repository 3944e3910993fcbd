// GET /api/v1/records/applications?from=YYYY-MM-DD&to=YYYY-MM-DD — the application records of a
// date range as CSV (UTF-8 with BOM, ISO dates, formula-like cells neutralised), streamed (manager).
import { z } from "zod";

import { listApplicationRecords, RECORD_COLUMNS } from "@/lib/applications/records/queries";
import { route } from "@/lib/auth/guards";
import { isIsoDate } from "@/lib/dates";
import { csvResponse } from "@/lib/http/csv";

const isoDate = z.string().refine(isIsoDate, "Use a date like 2026-06-15.");
const query = z
  .object({ from: isoDate, to: isoDate })
  .strict()
  .refine((q) => q.from <= q.to, { message: "The start must not be after the end.", path: ["to"] });

export const GET = route({ access: ["manager"], query }, async ({ actor, query }) =>
  csvResponse(
    RECORD_COLUMNS,
    listApplicationRecords(actor, query.from, query.to),
    `application-records-${query.from}-to-${query.to}.csv`,
  ),
);
