// Severity by text and icon as well as colour.
import { AlertOctagon, AlertTriangle, Info } from "lucide-react";

import type { AlertSeverity } from "@/db/schema";
import { SEVERITIES } from "@/lib/risk/labels";

const STYLE = {
  high: { className: "bg-clay-tint text-clay", Icon: AlertOctagon },
  moderate: { className: "bg-sun-tint text-sun", Icon: AlertTriangle },
  low: { className: "bg-paper text-ink ring-1 ring-line", Icon: Info },
} as const;

export function SeverityBadge({ severity }: { severity: AlertSeverity }) {
  const { className, Icon } = STYLE[severity];
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-full px-2.5 py-1 text-sm font-bold ${className}`}
    >
      <Icon className="size-4" aria-hidden="true" />
      {SEVERITIES[severity]}
    </span>
  );
}
