"use client";

// "3 changes and 2 photos waiting — last tried 10:42 AM": what the phone still has to send.
import { CloudUpload } from "lucide-react";
import { useLocale, useTranslations } from "next-intl";
import { useEffect, useState } from "react";

import { formatTime } from "@/lib/dates";
import type { OutboxOp } from "@/lib/offline/db";
import { summarize } from "@/lib/offline/rules";

function useWaitingWords(ops: OutboxOp[], timeZone: string): string | null {
  const t = useTranslations("offline");
  const locale = useLocale();
  const s = summarize(ops);
  if (!s.changes && !s.photos) return null;
  const changes = t("changes", { count: s.changes });
  const photos = t("photos", { count: s.photos });
  const what =
    s.changes && s.photos ? t("both", { changes, photos }) : s.changes ? changes : photos;
  return s.lastTriedAt
    ? t("waitingTried", { what, time: formatTime(s.lastTriedAt, timeZone, locale) })
    : t("waiting", { what });
}

/** With a signal, a change is on its way for a moment: it counts as waiting only after this long. */
const SETTLE_MS = 4000;

/**
 * What really waits: everything when offline; with a signal, what failed a try, was refused, or
 * has not gone within a few seconds (a tap on a rating is not announced as "waiting" every time).
 */
function useReallyWaiting(ops: OutboxOp[]): OutboxOp[] {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!ops.length) return;
    const timer = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(timer);
  }, [ops.length]);
  if (typeof navigator !== "undefined" && !navigator.onLine) return ops;
  return ops.filter(
    (op) => op.attempts > 0 || op.state === "held" || now - Date.parse(op.createdAt) >= SETTLE_MS,
  );
}

export function WaitingLine({
  ops,
  timeZone,
  onSendNow,
  className = "",
}: {
  ops: OutboxOp[];
  timeZone: string;
  onSendNow?: () => void;
  className?: string;
}) {
  const t = useTranslations("offline");
  const words = useWaitingWords(useReallyWaiting(ops), timeZone);
  if (!words) return null;
  return (
    <div
      className={`flex flex-wrap items-center gap-2 rounded-lg border border-rain bg-rain-tint p-3 text-ink ${className}`}
      role="status"
      data-waiting
    >
      <CloudUpload className="size-5 shrink-0 text-rain" aria-hidden="true" />
      <span className="flex-1 font-semibold">{words}</span>
      {onSendNow ? (
        <button
          type="button"
          onClick={onSendNow}
          className="inline-flex min-h-tap items-center font-semibold underline"
        >
          {t("sendNow")}
        </button>
      ) : null}
    </div>
  );
}
