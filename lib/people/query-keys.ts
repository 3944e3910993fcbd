// React Query keys for the signed-in person's own data, shared by server prefetch and client hooks.
export const meKeys = {
  /** GET /api/v1/me/applicator: the applicator remembered from the last application. */
  applicator: () => ["me", "applicator"] as const,
};
