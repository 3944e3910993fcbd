import type { Metadata, Viewport } from "next";
import { NextIntlClientProvider } from "next-intl";
import { getLocale } from "next-intl/server";
import localFont from "next/font/local";
import { connection } from "next/server";
import type { ReactNode } from "react";

import { Providers } from "@/components/providers";

import "./globals.css";

// Atkinson Hyperlegible Next (SIL OFL 1.1, app/fonts/), shipped with the app.
const sward = localFont({
  src: [
    {
      path: "./fonts/atkinson-hyperlegible-next-latin-wght-normal.woff2",
      style: "normal",
      weight: "200 800",
    },
    {
      path: "./fonts/atkinson-hyperlegible-next-latin-wght-italic.woff2",
      style: "italic",
      weight: "200 800",
    },
  ],
  variable: "--font-sward",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Sward", template: "%s · Sward" },
  description: "Turf health journal for lawn-care companies",
  // app/manifest.ts and app/apple-icon.png are linked by Next; iPhones read their own tags too.
  appleWebApp: { capable: true, title: "Sward", statusBarStyle: "default" },
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: "#2f6b3a",
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page renders per request (the not-found page too), so Next can put this request's
  // Content-Security-Policy nonce (proxy.ts) on its scripts; a prerendered page would have none.
  await connection();
  // The company's locale (lib/auth/request-locale.ts): the page's language, and the locale, time zone and
  // formats of client components. Words reach the client only where a page hands its namespace
  // to a provider of its own (the catalogue is not sent with every page).
  const locale = await getLocale();
  return (
    <html lang={locale} className={sward.variable}>
      <body className="min-h-dvh font-sans">
        <NextIntlClientProvider messages={{}}>
          <Providers>{children}</Providers>
        </NextIntlClientProvider>
      </body>
    </html>
  );
}
