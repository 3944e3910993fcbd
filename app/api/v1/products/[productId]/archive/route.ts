// POST /api/v1/products/:productId/archive — { archived: true|false } (manager). Past applications keep it.
import { z } from "zod";

import { route } from "@/lib/auth/guards";
import { setProductArchived } from "@/lib/products/mutations";
import { productIdParams } from "@/lib/products/schemas";

export const POST = route(
  {
    access: ["manager"],
    params: productIdParams,
    body: z.object({ archived: z.boolean() }).strict(),
    resource: "That product",
  },
  async ({ actor, params, body }) => setProductArchived(actor, params.productId, body.archived),
);
