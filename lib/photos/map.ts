// Photo row → DTO: staff see capture time and GPS; homeowners never do.
import type { Photo } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { lightingOf, MEASURED_BY } from "@/lib/photo-analysis/color";

import type { PhotoDto } from "./dto";

export type PhotoRow = Photo & { scheduled_for: string };

export function toPhotoDto(row: PhotoRow, actor: Actor): PhotoDto {
  const isStaff = actor.role !== "homeowner";
  return {
    id: row.id,
    visitId: row.visit_id,
    zoneId: row.zone_id,
    zoneCheckId: row.zone_check_id,
    visitedOn: row.scheduled_for,
    greenCoverPct: Math.round(row.green_cover_pct * 10) / 10,
    dgci: row.dgci === null ? null : Math.round(row.dgci * 1000) / 1000,
    lighting: lightingOf(row.dark_pct, row.clipped_pct),
    darkPct: Math.round(row.dark_pct),
    clippedPct: Math.round(row.clipped_pct),
    measuredByCanopyRule: row.measured_by === MEASURED_BY,
    width: row.width,
    height: row.height,
    displayUrl: `/api/v1/photos/${row.id}/display`,
    thumbUrl: `/api/v1/photos/${row.id}/thumb`,
    capturedLocal: isStaff ? row.captured_local : null,
    uploadedById: isStaff ? row.uploaded_by : null,
    gps:
      isStaff && row.gps_latitude !== null && row.gps_longitude !== null
        ? { latitude: row.gps_latitude, longitude: row.gps_longitude }
        : null,
  };
}
