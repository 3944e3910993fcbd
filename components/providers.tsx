"use client";

// Client-side providers shared by every page, and the service worker's installer.
import { QueryClientProvider } from "@tanstack/react-query";
import type { ReactNode } from "react";

import { AppUpdates } from "@/components/pwa/app-updates";
import { getQueryClient } from "@/lib/query-client";

export function Providers({ children }: { children: ReactNode }) {
  const queryClient = getQueryClient();
  return (
    <QueryClientProvider client={queryClient}>
      {children}
      <AppUpdates />
    </QueryClientProvider>
  );
}
