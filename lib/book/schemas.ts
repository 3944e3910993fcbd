// The book's view state, read from the URL (unknown or malformed values fall back, never error).
import { z } from "zod";

import { ALERT_KINDS } from "@/lib/risk/labels";

const kinds = Object.keys(ALERT_KINDS) as [
  keyof typeof ALERT_KINDS,
  ...(keyof typeof ALERT_KINDS)[],
];
export const BOOK_SORTS = ["attention", "name", "index", "slope", "last", "next", "n"] as const;
export type BookSort = (typeof BOOK_SORTS)[number];

export const bookQuery = z.object({
  q: z.string().trim().max(80).optional().catch(undefined),
  technician: z.uuid().optional().catch(undefined),
  trend: z.enum(["improving", "steady", "declining", "none"]).optional().catch(undefined),
  kind: z.enum(kinds).optional().catch(undefined),
  severity: z.enum(["high", "moderate", "low"]).optional().catch(undefined),
  overdue: z.enum(["1"]).optional().catch(undefined),
  sort: z.enum(BOOK_SORTS).catch("attention").default("attention"),
  dir: z.enum(["asc", "desc"]).optional().catch(undefined),
  after: z.string().max(300).optional().catch(undefined),
  limit: z.coerce.number().int().min(1).max(100).catch(25).default(25),
});
export type BookQuery = z.infer<typeof bookQuery>;
