// Runs once when the server starts. It refuses to serve unless the client-address edge
// (lib/http/edge-address.mjs) was loaded before Next — `npm start` and `npm run dev` both load it
// — and, in production, unless the configuration is valid (lib/env.ts: AUTH_URL, …). Without the
// edge, X-Forwarded-For would be whatever a client sends (the sign-in throttles could be dodged or
// turned against others) and a forged X-Forwarded-Host would reach Next and Auth.js.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs" || process.env.NODE_ENV === "test") return;
  if (process.env.NODE_ENV === "production") {
    const { serverEnv } = await import("@/lib/env");
    serverEnv();
  }
  if (!(globalThis as Record<symbol, unknown>)[Symbol.for("sward.clientAddressAtEdge")])
    throw new Error(
      "Start the server with `node --import ./lib/http/edge-address.mjs node_modules/next/dist/bin/next start` (or `dev`; npm start and npm run dev do): client addresses must be settled before Next reads them.",
    );
}
