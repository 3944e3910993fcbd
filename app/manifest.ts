// The web app manifest (served at /manifest.webmanifest): what a phone needs to install Sward as
// an app that opens on the day's stops. Colors are the palette's (tailwind.config.ts); the icons
// are the app's own mark (public/icons, rendered by tools/make-icons.ts).
import type { MetadataRoute } from "next";

import { palette } from "@/tailwind.config";

export default function manifest(): MetadataRoute.Manifest {
  return {
    id: "/today",
    name: "Sward",
    short_name: "Sward",
    description:
      "Turf health journal: the day's stops, zone checks and applications, with or without a signal.",
    start_url: "/today",
    scope: "/",
    display: "standalone",
    orientation: "portrait",
    theme_color: palette.sward.DEFAULT,
    background_color: palette.paper,
    lang: "en-US",
    categories: ["business", "productivity"],
    icons: [
      { src: "/icons/icon-192.png", sizes: "192x192", type: "image/png", purpose: "any" },
      { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "any" },
      {
        src: "/icons/icon-maskable-512.png",
        sizes: "512x512",
        type: "image/png",
        purpose: "maskable",
      },
    ],
  };
}
