// Photo reads, scoped: staff of the company within their reach; a homeowner only their own
// property's photos, and only from completed visits. Out of scope = not found.
import "server-only";

import type { ExpressionBuilder, Kysely } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { notFound } from "@/lib/http/app-error";
import { findZoneInScope } from "@/lib/properties/queries";

import type { PhotoDto } from "./dto";
import { toPhotoDto } from "./map";

/** Photos the actor may see: staff through the property or visit scope; homeowners finished visits only. */
function photoInScope(actor: Actor) {
  return (eb: ExpressionBuilder<Database, "photos" | "visits" | "properties">) => {
    const base = eb.and([
      eb("photos.company_id", "=", actor.companyId),
      propertyInScope(actor)(eb as never),
    ]);
    if (actor.role === "homeowner") return eb.and([base, eb("visits.status", "=", "completed")]);
    if (actor.role === "technician") {
      return eb.and([
        eb("photos.company_id", "=", actor.companyId),
        eb.or([
          propertyInScope(actor)(eb as never),
          eb("visits.technician_id", "=", actor.userId),
          eb("visits.started_by", "=", actor.userId),
        ]),
      ]);
    }
    return base;
  };
}

function scopedPhotos(actor: Actor, executor: Kysely<Database> = db()) {
  return executor
    .selectFrom("photos")
    .innerJoin("visits", "visits.id", "photos.visit_id")
    .innerJoin("properties", "properties.id", "photos.property_id")
    .selectAll("photos")
    .select("visits.scheduled_for")
    .where(photoInScope(actor));
}

export async function getPhotoFile(actor: Actor, photoId: string, variant: "display" | "thumb") {
  const row = await scopedPhotos(actor)
    .select("properties.name as property_name")
    .where("photos.id", "=", photoId)
    .executeTakeFirst();
  if (!row) throw notFound("That photo");
  return {
    key: variant === "display" ? row.display_key : row.thumb_key,
    hash: row.content_hash,
    fileName: `${row.property_name}-${row.scheduled_for}-${variant}.webp`,
  };
}

export async function listZonePhotos(actor: Actor, zoneId: string): Promise<PhotoDto[]> {
  await findZoneInScope(actor, zoneId); // an unknown or foreign zone is 404, as its history is
  const rows = await scopedPhotos(actor)
    .where("photos.zone_id", "=", zoneId)
    .orderBy("visits.scheduled_for")
    .orderBy("photos.created_at")
    .limit(500)
    .execute();
  return rows.map((r) => toPhotoDto(r, actor));
}

export async function listVisitPhotos(
  actor: Actor,
  visitId: string,
  executor: Kysely<Database> = db(),
): Promise<PhotoDto[]> {
  const rows = await scopedPhotos(actor, executor)
    .where("photos.visit_id", "=", visitId)
    .orderBy("photos.created_at")
    .execute();
  return rows.map((r) => toPhotoDto(r, actor));
}

/** The latest photo of each zone of a property (for the property view). */
export async function listLatestPhotoPerZone(
  actor: Actor,
  propertyId: string,
): Promise<PhotoDto[]> {
  const rows = await scopedPhotos(actor)
    .where("photos.property_id", "=", propertyId)
    .distinctOn("photos.zone_id")
    .orderBy("photos.zone_id")
    .orderBy("visits.scheduled_for", "desc")
    .orderBy("photos.created_at", "desc")
    .execute();
  return rows.map((r) => toPhotoDto(r, actor));
}

export async function findZoneCheckPhoto(
  zoneCheckId: string,
  contentHash: string,
  actor: Actor,
): Promise<PhotoDto | undefined> {
  const row = await scopedPhotos(actor)
    .where("photos.zone_check_id", "=", zoneCheckId)
    .where("photos.content_hash", "=", contentHash)
    .executeTakeFirst();
  return row ? toPhotoDto(row, actor) : undefined;
}

/** The photos of the given zone checks, oldest first, within the actor's reach. */
export async function listCheckPhotos(actor: Actor, zoneCheckIds: string[]): Promise<PhotoDto[]> {
  if (zoneCheckIds.length === 0) return [];
  const rows = await scopedPhotos(actor)
    .where("photos.zone_check_id", "in", zoneCheckIds)
    .orderBy("photos.created_at")
    .limit(500)
    .execute();
  return rows.map((r) => toPhotoDto(r, actor));
}
