// Visit and zone-check status in words with an icon.
import clsx from "clsx";
import {
  Ban,
  CheckCircle2,
  CircleDashed,
  Clock,
  CloudRain,
  PencilLine,
  XCircle,
} from "lucide-react";

import type { CancelKind, VisitStatus, ZoneCheckStatus } from "@/db/schema";

const VISIT = {
  scheduled: { label: "Not started", icon: Clock, tone: "bg-paper text-ink ring-1 ring-line" },
  in_progress: { label: "In progress", icon: PencilLine, tone: "bg-rain-tint text-ink" },
  completed: { label: "Finished", icon: CheckCircle2, tone: "bg-sward-tint text-sward-deep" },
  cancelled: { label: "Canceled", icon: XCircle, tone: "bg-clay-tint text-clay" },
} as const;

const RAINED_OUT = { label: "Rained out", icon: CloudRain, tone: "bg-rain-tint text-ink" } as const;

const ZONE = {
  none: { label: "Not started", icon: CircleDashed, tone: "bg-paper text-ink ring-1 ring-line" },
  draft: { label: "In progress", icon: PencilLine, tone: "bg-rain-tint text-ink" },
  done: { label: "Done", icon: CheckCircle2, tone: "bg-sward-tint text-sward-deep" },
  skipped: { label: "Skipped", icon: Ban, tone: "bg-sun-tint text-ink" },
} as const;

function Badge({ label, icon: Icon, tone }: { label: string; icon: typeof Clock; tone: string }) {
  return (
    <span
      className={clsx(
        "inline-flex items-center gap-1 rounded-full px-2.5 py-1 text-sm font-semibold whitespace-nowrap",
        tone,
      )}
    >
      <Icon className="size-4" aria-hidden="true" />
      {label}
    </span>
  );
}

export const VisitStatusBadge = ({
  status,
  cancelKind,
}: {
  status: VisitStatus;
  /** A canceled stop's outcome: "rained_out" reads "Rained out". */
  cancelKind?: CancelKind | null;
}) => (
  <Badge
    {...(status === "cancelled" && cancelKind === "rained_out" ? RAINED_OUT : VISIT[status])}
  />
);
export const ZoneStatusBadge = ({ status }: { status: ZoneCheckStatus | null }) => (
  <Badge {...ZONE[status ?? "none"]} />
);
