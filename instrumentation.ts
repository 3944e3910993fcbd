// Runs once when the server starts. In production it refuses to serve unless the configuration
// is valid (lib/env.ts: AUTH_URL, …) and the client-address edge (lib/http/edge-address.mjs) was
// loaded before Next: without it, X-Forwarded-For would be whatever a client sends, and the
// sign-in throttles could be dodged or turned against others.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs" || process.env.NODE_ENV !== "production") return;
  const { serverEnv } = await import("@/lib/env");
  serverEnv();
  if (!(globalThis as Record<symbol, unknown>)[Symbol.for("sward.clientAddressAtEdge")])
    throw new Error(
      "Start the server with `node --import ./lib/http/edge-address.mjs node_modules/next/dist/bin/next start` (npm start does): client addresses must be settled before Next reads them.",
    );
}
