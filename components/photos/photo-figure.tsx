// One zone photo with its measured green canopy cover and color (and date when asked), and the
// lighting caution when the photo was too dark or too bright to measure.
import { TriangleAlert } from "lucide-react";
import Image from "next/image";

import { formatDate } from "@/lib/dates";
import type { PhotoDto } from "@/lib/photos/dto";
import { lightingCaution } from "@/lib/photos/words";

export function PhotoFigure({
  photo,
  size = "thumb",
  showDate = false,
  forHomeowner = false,
}: {
  photo: PhotoDto;
  size?: "thumb" | "display";
  showDate?: boolean;
  /** A homeowner reads the green cover only, without the imaging index (DGCI). */
  forHomeowner?: boolean;
}) {
  const isThumb = size === "thumb";
  const caution = lightingCaution(photo);
  return (
    <figure className="overflow-hidden rounded-lg border border-line bg-card">
      <a href={photo.displayUrl} target="_blank" rel="noreferrer" className="block">
        <Image
          src={isThumb ? photo.thumbUrl : photo.displayUrl}
          alt={`Zone photo${showDate ? ` of ${formatDate(photo.visitedOn)}` : ""}: ${photo.greenCoverPct.toFixed(0)} % green canopy cover`}
          width={isThumb ? 320 : 800}
          height={
            isThumb
              ? Math.round((320 * photo.height) / photo.width)
              : Math.round((800 * photo.height) / photo.width)
          }
          unoptimized
          className="aspect-[4/3] w-full object-cover"
        />
      </a>
      <figcaption className="p-2 text-sm">
        {showDate ? <span className="block font-bold">{formatDate(photo.visitedOn)}</span> : null}
        <span className="font-semibold">{photo.greenCoverPct.toFixed(1)} %</span> green canopy cover
        {forHomeowner
          ? null
          : ` · DGCI ${photo.dgci === null ? "— (no green canopy)" : photo.dgci.toFixed(3)}`}
        {photo.measuredByCanopyRule ? null : (
          <span className="block text-muted">Measured by an earlier method; update pending.</span>
        )}
        {caution ? (
          <span role="note" className="mt-1 block rounded bg-sun-tint p-1.5 text-ink">
            <span className="flex items-center gap-1 font-bold text-sun">
              <TriangleAlert className="size-4 shrink-0" aria-hidden="true" />
              {caution.title}
            </span>
            {caution.detail}
          </span>
        ) : null}
      </figcaption>
    </figure>
  );
}
