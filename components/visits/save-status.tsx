"use client";

// Where the zone check stands with the server, in words and an icon (never colour alone).
import { CheckCircle2, CircleAlert, CloudOff, CloudUpload, Lock, RefreshCw } from "lucide-react";
import { useTranslations } from "next-intl";

import type { SaveState } from "./zone-check-autosave";

export function SaveStatus({
  state,
  onRetry,
  timeZone,
}: {
  state: SaveState;
  onRetry: () => void;
  timeZone: string;
}) {
  const t = useTranslations("offline");
  const base = "flex items-center gap-2 rounded-lg px-3 py-1.5 text-sm font-semibold";
  switch (state.kind) {
    case "idle":
      return null;
    case "pending":
    case "saving":
      return (
        <p className={`${base} bg-paper text-ink`} role="status">
          <CloudUpload className="size-5" aria-hidden="true" />
          {state.kind === "saving" ? "Saving…" : "Kept on this phone · saving shortly"}
        </p>
      );
    case "saved":
      return (
        <p className={`${base} bg-sward-tint text-sward-deep`} role="status">
          <CheckCircle2 className="size-5" aria-hidden="true" />
          Saved{" "}
          {new Intl.DateTimeFormat("en-US", {
            hour: "numeric",
            minute: "2-digit",
            timeZone,
          }).format(new Date(state.at))}
        </p>
      );
    case "waiting":
      return (
        <p className={`${base} bg-rain-tint text-ink`} role="status">
          <CloudOff className="size-5 shrink-0 text-rain" aria-hidden="true" />
          {t("savedWaiting")}
        </p>
      );
    case "retrying":
      return (
        <div className={`${base} bg-sun-tint text-ink`} role="alert">
          <CloudOff className="size-5 shrink-0 text-sun" aria-hidden="true" />
          <span className="flex-1">
            Not saved yet — {state.message} Kept on this phone; trying again in {state.inSeconds} s.
          </span>
          <button
            type="button"
            onClick={onRetry}
            className="inline-flex min-h-tap items-center gap-1 underline"
          >
            <RefreshCw className="size-4" aria-hidden="true" />
            Retry now
          </button>
        </div>
      );
    case "invalid":
      return (
        <p className={`${base} bg-clay-tint text-clay`} role="alert">
          <CircleAlert className="size-5 shrink-0" aria-hidden="true" />
          Not saved: {state.message} Fix the fields marked below.
        </p>
      );
    case "locked":
      return (
        <p className={`${base} bg-clay-tint text-clay`} role="alert">
          <Lock className="size-5 shrink-0" aria-hidden="true" />
          {state.message}
        </p>
      );
    case "conflict":
      return null; // shown by the conflict panel
  }
}
