// The book's view state, read from the URL (unknown or malformed values fall back, never error).
// zod/mini: the book's client view imports the sorts from here.
import { z } from "zod/mini";

import { stripControlCharacters } from "@/lib/http/control-characters";
import { ALERT_KINDS } from "@/lib/risk/labels";

const kinds = Object.keys(ALERT_KINDS) as [
  keyof typeof ALERT_KINDS,
  ...(keyof typeof ALERT_KINDS)[],
];
export const BOOK_SORTS = ["attention", "name", "index", "slope", "last", "next", "n"] as const;
export type BookSort = (typeof BOOK_SORTS)[number];

/** Optional, and ignored (undefined) when malformed. */
const lenient = <T extends z.ZodMiniType>(schema: T) => z.catch(z.optional(schema), undefined);

export const bookQuery = z.object({
  q: lenient(z.string().check(z.overwrite(stripControlCharacters), z.trim(), z.maxLength(80))),
  technician: lenient(z.uuid()),
  trend: lenient(z.enum(["improving", "steady", "declining", "none"])),
  kind: lenient(z.enum(kinds)),
  severity: lenient(z.enum(["high", "moderate", "low"])),
  overdue: lenient(z.enum(["1"])),
  sort: z._default(z.catch(z.enum(BOOK_SORTS), "attention"), "attention"),
  dir: lenient(z.enum(["asc", "desc"])),
  after: lenient(z.string().check(z.maxLength(300))),
  limit: z._default(z.catch(z.coerce.number().check(z.int(), z.gte(1), z.lte(100)), 25), 25),
});
export type BookQuery = z.infer<typeof bookQuery>;
