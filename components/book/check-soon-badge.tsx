// "Check soon": the property lies inside a pressure area and has had no visit in its window.
import { Radar } from "lucide-react";

export function CheckSoonBadge() {
  return (
    <span
      className="inline-flex items-center gap-1 rounded-full bg-rain-tint px-2.5 py-1 text-sm font-bold text-rain"
      title="Inside a pressure area, without a visit in its window"
    >
      <Radar className="size-4" aria-hidden="true" />
      Check soon
    </span>
  );
}
