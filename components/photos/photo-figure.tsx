// One zone photo with its measured cover and colour (and date when asked).
import Image from "next/image";

import { formatDate } from "@/lib/dates";
import type { PhotoDto } from "@/lib/photos/dto";

export function PhotoFigure({
  photo,
  size = "thumb",
  showDate = false,
}: {
  photo: PhotoDto;
  size?: "thumb" | "display";
  showDate?: boolean;
}) {
  const isThumb = size === "thumb";
  return (
    <figure className="overflow-hidden rounded-lg border border-line bg-card">
      <a href={photo.displayUrl} target="_blank" rel="noreferrer" className="block">
        <Image
          src={isThumb ? photo.thumbUrl : photo.displayUrl}
          alt={`Zone photo${showDate ? ` of ${formatDate(photo.visitedOn)}` : ""}: ${photo.greenCoverPct.toFixed(0)} % green cover`}
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
        <span className="font-semibold">{photo.greenCoverPct.toFixed(1)} %</span> green cover · DGCI{" "}
        {photo.dgci === null ? "—" : photo.dgci.toFixed(3)}
      </figcaption>
    </figure>
  );
}
