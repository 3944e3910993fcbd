// GET /api/v1/book/map?… — every property of the book's view for the map (manager): the book's
// filters (q, technician, trend, kind, severity, overdue; sort and paging are ignored), as compact
// tuples (lib/book/dto.ts, BookMapPoint).
import { route } from "@/lib/auth/guards";
import { listBookMap } from "@/lib/book/queries";
import { bookQuery } from "@/lib/book/schemas";

export const GET = route({ access: ["manager"], query: bookQuery }, async ({ actor, query }) =>
  listBookMap(actor, query),
);
