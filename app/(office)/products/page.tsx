import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";

import { ProductList } from "@/components/products/product-list";
import { requireActor } from "@/lib/auth/require";
import { listProducts } from "@/lib/products/queries";
import { productKeys } from "@/lib/products/query-keys";
import { makeQueryClient } from "@/lib/query-client";

export const metadata: Metadata = { title: "Products" };

export default async function ProductsPage() {
  const actor = await requireActor(["manager"]);
  const queryClient = makeQueryClient();
  await queryClient.prefetchQuery({
    queryKey: productKeys.list(),
    queryFn: () => listProducts(actor),
  });
  return (
    <>
      <h1 className="text-3xl font-bold">Products</h1>
      <p className="mt-1 mb-6 text-muted">
        The catalog technicians choose from. Each product&apos;s analysis comes from its label
        (guaranteed analysis, % by weight).
      </p>
      <HydrationBoundary state={dehydrate(queryClient)}>
        <ProductList />
      </HydrationBoundary>
    </>
  );
}
