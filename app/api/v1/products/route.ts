// GET  /api/v1/products — { items: ProductDto[] } of the company's catalogue (staff).
// POST /api/v1/products — add a product (manager).
import { z } from "zod";

import { route } from "@/lib/auth/guards";
import { createProduct } from "@/lib/products/mutations";
import { listProducts } from "@/lib/products/queries";
import { productSchema } from "@/lib/products/schemas";

export const GET = route(
  {
    access: ["manager", "technician"],
    query: z.object({ archived: z.enum(["include", "exclude"]).default("exclude") }).strict(),
  },
  async ({ actor, query }) => ({
    items: await listProducts(actor, { includeArchived: query.archived === "include" }),
  }),
);

export const POST = route({ access: ["manager"], body: productSchema }, async ({ actor, body }) =>
  createProduct(actor, body),
);
