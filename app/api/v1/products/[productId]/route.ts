// PUT /api/v1/products/:productId — replace a product's fields (manager).
import { route } from "@/lib/auth/guards";
import { updateProduct } from "@/lib/products/mutations";
import { productIdParams, productSchema } from "@/lib/products/schemas";

export const PUT = route(
  { access: ["manager"], params: productIdParams, body: productSchema, resource: "That product" },
  async ({ actor, params, body }) => updateProduct(actor, params.productId, body),
);
