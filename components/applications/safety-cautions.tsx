// The usual cautions next to every application (PRODUCT.md "Safety"): Sward's numbers never
// replace the label, local ordinances or licensed practice.
import { ShieldAlert } from "lucide-react";

export function SafetyCautions({
  labelCautions,
  reentryGuidance,
  isPesticide,
}: {
  labelCautions?: string;
  reentryGuidance?: string;
  isPesticide?: boolean;
}) {
  return (
    <aside
      className="space-y-2 rounded-xl border-2 border-sun bg-sun-tint p-4 text-ink"
      aria-label="Safety cautions"
    >
      <p className="flex items-center gap-2 font-bold">
        <ShieldAlert className="size-5 text-sun" aria-hidden="true" />
        Before you apply
      </p>
      <ul className="list-disc space-y-1 pl-5 text-sm">
        <li>
          Read and follow the product label: the label is the law. Wear the protective equipment it
          names{isPesticide ? " — for this pesticide, every item on it" : ""}.
        </li>
        <li>Keep children and pets off treated areas until dry, or as long as the label says.</li>
        <li>
          Keep product off driveways, walks and streets — sweep granules back onto the lawn — and
          out of ponds, streams and storm drains.
        </li>
        <li>Do not apply before heavy rain or on frozen or saturated ground.</li>
        <li>
          Local fertilizer ordinances, applicator licensing and the label take precedence over
          Sward&apos;s numbers.
        </li>
      </ul>
      {labelCautions ? (
        <p className="text-sm">
          <span className="font-semibold">This product&apos;s label:</span> {labelCautions}
        </p>
      ) : null}
      {reentryGuidance ? (
        <p className="text-sm">
          <span className="font-semibold">Re-entry:</span> {reentryGuidance}
        </p>
      ) : null}
    </aside>
  );
}
