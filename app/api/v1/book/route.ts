// GET /api/v1/book?… — one page of the book (manager): the same query as the page (filters, sort,
// keyset cursor in `after`), the next page's cursor and how many rows the view has.
import { route } from "@/lib/auth/guards";
import { listBook } from "@/lib/book/queries";
import { bookQuery } from "@/lib/book/schemas";

export const GET = route({ access: ["manager"], query: bookQuery }, async ({ actor, query }) =>
  listBook(actor, query),
);
