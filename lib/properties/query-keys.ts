// React Query keys for property reads, shared by server prefetch and client hooks.
export const propertyKeys = {
  all: ["properties"] as const,
  list: () => [...propertyKeys.all, "list"] as const,
  detail: (propertyId: string) => [...propertyKeys.all, "detail", propertyId] as const,
};
