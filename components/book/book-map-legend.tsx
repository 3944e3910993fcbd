// What the map's marks mean: each Index band by shape, colour and word; the alert badge; the
// "Check soon" ring; a pressure area.
import { BAND_STYLE, INDEX_BANDS } from "@/lib/scoring/bands";

import { IndexBandShape } from "./index-band-mark";

export function BookMapLegend() {
  return (
    <section
      aria-labelledby="map-legend-title"
      className="rounded-xl border border-line bg-card p-3"
    >
      <h2 id="map-legend-title" className="font-bold">
        Legend
      </h2>
      <ul className="mt-2 grid gap-x-4 gap-y-1.5 text-sm sm:grid-cols-2">
        {INDEX_BANDS.map((band) => (
          <li key={band} className="flex items-center gap-2">
            <IndexBandShape band={band} />
            <span>
              <span className="font-semibold">{BAND_STYLE[band].word}</span> —{" "}
              {band === "none" ? BAND_STYLE[band].range : `Sward Index ${BAND_STYLE[band].range}`}
            </span>
          </li>
        ))}
        <li className="flex items-center gap-2">
          <IndexBandShape band="good" alert />
          <span>Dark badge: open risk alerts</span>
        </li>
        <li className="flex items-center gap-2">
          <svg viewBox="0 0 28 28" className="size-6 shrink-0" aria-hidden="true">
            <circle cx="14" cy="14" r="11" fill="none" stroke="#2a6496" strokeWidth="3" />
          </svg>
          <span>Blue ring: check soon (in a pressure area, no recent visit)</span>
        </li>
        <li className="flex items-center gap-2">
          <svg viewBox="0 0 28 28" className="size-6 shrink-0" aria-hidden="true">
            <circle
              cx="14"
              cy="14"
              r="11"
              fill="#a8321f"
              fillOpacity="0.14"
              stroke="#a8321f"
              strokeWidth="2"
              strokeDasharray="4 3"
            />
          </svg>
          <span>Dashed circle: a pressure area</span>
        </li>
      </ul>
    </section>
  );
}
