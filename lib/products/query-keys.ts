// React Query keys for the product catalogue, shared by server prefetch and client hooks.
export const productKeys = {
  all: ["products"] as const,
  /** The live catalogue (archived products left out), as GET /api/v1/products answers it. */
  list: () => [...productKeys.all, "list"] as const,
};
