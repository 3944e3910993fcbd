"use client";

// The product catalogue through React Query: the list (prefetched by the page), and the writes,
// which refresh the list in the cache when the server accepted them.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";

import type { ProductDto } from "@/lib/products/dto";
import { productKeys } from "@/lib/products/query-keys";
import type { ProductInput } from "@/lib/products/schemas";
import { fetchJson, sendJson, type SendResult } from "@/lib/query-client";

export function useProducts() {
  return useQuery({
    queryKey: productKeys.list(),
    queryFn: async () => (await fetchJson<{ items: ProductDto[] }>("/api/v1/products")).items,
  });
}

/** Answers the server's result (field errors included); the list is fresh once it resolves. */
export function useSaveProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, values }: { id?: string; values: ProductInput }) =>
      id
        ? sendJson<ProductDto>("PUT", `/api/v1/products/${id}`, values)
        : sendJson<ProductDto>("POST", "/api/v1/products", values),
    onSuccess: (result: SendResult<ProductDto>) =>
      result.ok ? queryClient.invalidateQueries({ queryKey: productKeys.all }) : undefined,
  });
}

export function useArchiveProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) =>
      sendJson<ProductDto>("POST", `/api/v1/products/${id}/archive`, { archived: true }),
    onSuccess: (result: SendResult<ProductDto>) =>
      result.ok ? queryClient.invalidateQueries({ queryKey: productKeys.all }) : undefined,
  });
}
