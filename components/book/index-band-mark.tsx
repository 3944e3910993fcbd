// An Index band's marker as on the map (shape and colour) with its word: legends and tables.
import { BAND_STYLE, type IndexBand } from "@/lib/scoring/bands";

export function IndexBandShape({ band, alert = false }: { band: IndexBand; alert?: boolean }) {
  const { color, shape } = BAND_STYLE[band];
  return (
    <svg viewBox="0 0 28 28" className="size-6 shrink-0" aria-hidden="true">
      {shape === "circle" ? (
        <circle cx="13" cy="14" r="8" fill={color} stroke="#fff" strokeWidth="2.5" />
      ) : shape === "ring" ? (
        <circle cx="13" cy="14" r="7" fill="#fff" stroke={color} strokeWidth="4" />
      ) : shape === "diamond" ? (
        <path d="M13 4 L22 14 L13 24 L4 14 Z" fill={color} stroke="#fff" strokeWidth="2.5" />
      ) : (
        <rect x="5.5" y="6.5" width="15" height="15" fill={color} stroke="#fff" strokeWidth="2.5" />
      )}
      {alert ? (
        <>
          <circle cx="21" cy="7" r="6" fill="#18211b" stroke="#fff" strokeWidth="1.5" />
          <rect x="20.1" y="3.2" width="1.8" height="4.6" fill="#fff" />
          <rect x="20.1" y="8.8" width="1.8" height="1.8" fill="#fff" />
        </>
      ) : null}
    </svg>
  );
}

export function IndexBandMark({ band }: { band: IndexBand }) {
  return (
    <span className="inline-flex items-center gap-1 font-semibold">
      <IndexBandShape band={band} />
      {BAND_STYLE[band].word}
    </span>
  );
}
