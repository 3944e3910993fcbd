// Serves the service worker (app/sw.ts) at /serwist/sw.js: @serwist/turbopack bundles it with
// esbuild at build time and injects the precache list (the build's static files, public/, and the
// entries below). Its headers (no-cache, its own policy) are in next.config.ts.
import { createSerwistRoute } from "@serwist/turbopack";

// Each build is a new version of the offline page (its scripts change with the build).
const revision = process.env.SWARD_BUILD_REVISION ?? crypto.randomUUID();

export const { dynamic, dynamicParams, revalidate, generateStaticParams, GET } = createSerwistRoute(
  {
    swSrc: "app/sw.ts",
    useNativeEsbuild: true,
    // A classic script (not a module worker): every phone browser with service workers runs it.
    esbuildOptions: { format: "iife" },
    additionalPrecacheEntries: [
      { url: "/offline", revision },
      { url: "/manifest.webmanifest", revision },
    ],
    // The build's scripts, styles, fonts and images (Serwist's default list leaves fonts out) and
    // public/; source maps stay out of the phone's storage.
    globPatterns: [".next/static/**/*.{js,css,woff2,png,svg,ico,webp,json}", "public/**/*"],
    globIgnores: ["**/*.map"],
  },
);
