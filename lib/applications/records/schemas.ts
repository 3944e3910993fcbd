// The date range of an application records export, shared by the route and the records page
// (zod/mini). A range runs forward: "To" on or after "From".
import { z } from "zod/mini";

import { isIsoDate } from "@/lib/dates";

const isoDate = (field: string) =>
  z.string().check(z.refine(isIsoDate, `${field}: a date like 2026-06-15.`));

export const recordsRangeQuery = z.strictObject({ from: isoDate("From"), to: isoDate("To") }).check(
  z.refine((q) => !isIsoDate(q.from) || !isIsoDate(q.to) || q.from <= q.to, {
    message: "To: on or after the From date (the range runs forward).",
    path: ["to"],
  }),
);
