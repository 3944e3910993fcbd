// A trend word as a badge with n beside it: improving / steady / declining, or no word (fewer than
// 5 checks, or checks that support no word: see trendWord in lib/scoring/trend.ts).
import { MoveRight, TrendingDown, TrendingUp } from "lucide-react";

import type { TrendWord } from "@/lib/scoring/trend";
import { MIN_CHECKS_FOR_TREND_WORD } from "@/lib/scoring/weights";

const STYLE = {
  improving: { className: "bg-sward-tint text-sward-deep", Icon: TrendingUp },
  steady: { className: "bg-paper text-ink ring-1 ring-line", Icon: MoveRight },
  declining: { className: "bg-clay-tint text-clay", Icon: TrendingDown },
} as const;

export function TrendBadge({ word, n }: { word: TrendWord | null; n: number }) {
  if (!word)
    return (
      <span className="rounded-full bg-paper px-2.5 py-1 text-sm text-muted ring-1 ring-line">
        {n < MIN_CHECKS_FOR_TREND_WORD ? "No trend yet" : "No clear trend"} ·{" "}
        {n === 1 ? "1 check" : `${n} checks`}
      </span>
    );
  const { className, Icon } = STYLE[word];
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-full px-2.5 py-1 text-sm font-semibold ${className}`}
    >
      <Icon className="size-4" aria-hidden="true" />
      <span className="capitalize">{word}</span>
      <span className="font-normal">· {n === 1 ? "1 check" : `${n} checks`}</span>
    </span>
  );
}
