// The page the service worker shows for a page that needs the network when there is none (it is
// precached by app/serwist/[path]/route.ts). Public: it says nothing about anyone.
import { WifiOff } from "lucide-react";
import type { Metadata } from "next";
import Link from "next/link";

import { SwardMark } from "@/components/ui/sward-mark";

export const metadata: Metadata = { title: "No connection" };

export default function OfflinePage() {
  return (
    <main className="mx-auto max-w-xl space-y-4 px-4 py-10">
      <div className="flex items-center gap-2">
        <SwardMark />
        <span className="text-xl font-bold">Sward</span>
      </div>
      <h1 className="flex items-center gap-2 text-3xl font-bold">
        <WifiOff className="size-7 shrink-0" aria-hidden="true" />
        No connection
      </h1>
      <p>This page needs the network, and this phone has no signal right now.</p>
      <h2 className="text-xl font-bold">What works without a signal</h2>
      <ul className="list-disc space-y-1 pl-6">
        <li>Today, with the stops that were on it when you last opened it with a signal.</li>
        <li>Each of those visits and its zones, with the last check of every zone.</li>
        <li>Rating zones, taking photos and recording applications during those visits.</li>
      </ul>
      <p>
        What you enter is kept on this phone and sent by itself when the signal returns. Keep the
        app signed in until it has been sent: signing out deletes what this phone keeps.
      </p>
      <p>
        <Link href="/today" className="font-semibold text-sward">
          Go to Today
        </Link>
      </p>
    </main>
  );
}
