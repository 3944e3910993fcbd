// The first and the latest photo of a zone side by side, and every photo over time.
import type { PhotoDto } from "@/lib/photos/dto";
import { PHOTO_FIGURES_EXPLAINED } from "@/lib/photos/words";

import { PhotoFigure } from "./photo-figure";

export function BeforeAfter({ photos, zoneName }: { photos: PhotoDto[]; zoneName: string }) {
  if (photos.length === 0)
    return (
      <p className="rounded-lg border border-line bg-card p-4">
        No photos of {zoneName} yet. Technicians add them on the zone check.
      </p>
    );
  const first = photos[0]!;
  const latest = photos[photos.length - 1]!;
  const comparable = first.lighting === "ok" && latest.lighting === "ok";
  const change =
    photos.length > 1 && comparable ? latest.greenCoverPct - first.greenCoverPct : null;
  return (
    <div className="space-y-4">
      {photos.length > 1 ? (
        <>
          <div className="grid grid-cols-2 gap-3">
            <div>
              <p className="mb-1 font-bold">Before</p>
              <PhotoFigure photo={first} size="display" showDate />
            </div>
            <div>
              <p className="mb-1 font-bold">Latest</p>
              <PhotoFigure photo={latest} size="display" showDate />
            </div>
          </div>
          {change !== null ? (
            <p className="font-semibold">
              Green canopy cover {change >= 0 ? "up" : "down"} {Math.abs(change).toFixed(1)} points
              since the first photo
              {first.dgci !== null && latest.dgci !== null
                ? `; DGCI ${first.dgci.toFixed(3)} → ${latest.dgci.toFixed(3)}`
                : ""}
              .
            </p>
          ) : (
            <p className="font-semibold">
              No change is given: the first or the latest photo was too dark or too bright to
              measure.
            </p>
          )}
        </>
      ) : (
        <div className="max-w-md">
          <PhotoFigure photo={first} size="display" showDate />
        </div>
      )}
      <p className="max-w-reading text-sm text-muted">{PHOTO_FIGURES_EXPLAINED}</p>
      <ol
        className="flex gap-2 overflow-x-auto pb-2"
        aria-label={`All photos of ${zoneName}, oldest first`}
        tabIndex={0}
      >
        {photos.map((p) => (
          <li key={p.id} className="w-40 shrink-0">
            <PhotoFigure photo={p} showDate />
          </li>
        ))}
      </ol>
    </div>
  );
}
