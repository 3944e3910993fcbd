// A trend word as a badge: improving / steady / declining (or no trend yet).
import { MoveRight, TrendingDown, TrendingUp } from "lucide-react";

import type { TrendWord } from "@/lib/scoring/trend";

const STYLE = {
  improving: { className: "bg-sward-tint text-sward-deep", Icon: TrendingUp },
  steady: { className: "bg-paper text-ink ring-1 ring-line", Icon: MoveRight },
  declining: { className: "bg-clay-tint text-clay", Icon: TrendingDown },
} as const;

export function TrendBadge({ word }: { word: TrendWord | null }) {
  if (!word)
    return (
      <span className="rounded-full bg-paper px-2.5 py-1 text-sm text-muted ring-1 ring-line">
        No trend yet
      </span>
    );
  const { className, Icon } = STYLE[word];
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-full px-2.5 py-1 text-sm font-semibold ${className}`}
    >
      <Icon className="size-4" aria-hidden="true" />
      <span className="capitalize">{word}</span>
    </span>
  );
}
