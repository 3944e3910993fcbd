"use client";

// Operations the server refused as they were, each with what the phone has and the server's
// answer, and the choices: open the zone (a zone check changed elsewhere: both copies side by side
// there), send again, or drop it — dropping asks first. Nothing leaves the phone unasked.
import { CircleAlert } from "lucide-react";
import { useTranslations } from "next-intl";

import { Button } from "@/components/ui/button";
import { outbox } from "@/lib/offline/client";
import type { OutboxOp } from "@/lib/offline/db";

export function HeldOps({
  ops,
  zoneName,
  onOpenZone,
}: {
  ops: OutboxOp[];
  zoneName: (zoneId: string | null) => string;
  onOpenZone: (zoneId: string) => void;
}) {
  const t = useTranslations("offline");
  const held = ops.filter((op) => op.state === "held" && op.held);
  if (!held.length) return null;
  const words = (op: OutboxOp) => {
    const message = op.held!.message;
    switch (op.held!.reason) {
      case "conflict":
        return t("heldConflict", { zone: zoneName(op.zoneId) });
      case "closed":
        return t("heldClosed", { message });
      case "gone":
        return t("heldGone", { message });
      case "refused":
        return t("heldRefused", { message });
    }
  };
  return (
    <section
      className="mb-4 space-y-2 rounded-xl border-2 border-clay bg-clay-tint p-3 text-ink"
      aria-label={t("heldTitle")}
    >
      <p className="flex items-center gap-2 font-bold text-clay">
        <CircleAlert className="size-5 shrink-0" aria-hidden="true" />
        {t("needsYou", { count: held.length })}
      </p>
      <ul className="space-y-2">
        {held.map((op) => (
          <li key={op.seq} className="rounded-lg border border-line bg-card p-3">
            <p className="font-semibold">
              {t(`kinds.${op.kind}`)}
              {op.zoneId ? ` · ${zoneName(op.zoneId)}` : ""}
            </p>
            <p className="text-sm">{words(op)}</p>
            <div className="mt-2 flex flex-wrap gap-2">
              {op.held!.reason === "conflict" && op.zoneId ? (
                <Button type="button" onClick={() => onOpenZone(op.zoneId!)}>
                  {t("openZone", { zone: zoneName(op.zoneId) })}
                </Button>
              ) : (
                <>
                  <Button type="button" onClick={() => void outbox().retry(op.seq!)}>
                    {t("retry")}
                  </Button>
                  <Button
                    type="button"
                    variant="secondary"
                    onClick={() => {
                      if (window.confirm(t("discardConfirm"))) void outbox().discard(op.seq!);
                    }}
                  >
                    {t("discard")}
                  </Button>
                </>
              )}
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}
