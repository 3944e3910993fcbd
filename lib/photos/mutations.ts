// Attaching a processed photo to a zone check. The visit must be in scope and open for the
// actor; derivatives are stored under content-hash keys per company, so the same photo is
// stored once; the same photo on the same check is one row (a retry returns it).
import "server-only";

import { db } from "@/db";
import { afterWrite } from "@/lib/after-write";
import { bindAppliedAt } from "@/lib/applications/applied-at";
import { correctionReasonFor } from "@/lib/audit/correction";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { visitInScope } from "@/lib/auth/scope";
import { AppError, notFound } from "@/lib/http/app-error";
import { log } from "@/lib/log";
import { MEASURED_BY } from "@/lib/photo-analysis/color";
import type { PhotoStorage } from "@/lib/services/storage";
import { assertEditable, lockVisit } from "@/lib/visit-state/lock";

import type { PhotoDto } from "./dto";
import type { ProcessedPhoto } from "./process";
import { findZoneCheckPhoto } from "./queries";

/**
 * The device's capture time, bound to the visit as an application's time is
 * (lib/applications/applied-at.ts: from two hours before the start to two hours after the finish,
 * never beyond a few minutes ahead of the server's clock), written like the camera's own EXIF
 * time: the wall-clock time at the property, "YYYY-MM-DD HH:MM:SS". 422 naming the field otherwise.
 */
function deviceCaptureLocal(
  capturedAt: string,
  visit: { started_at: Date | null; completed_at: Date | null; time_zone: string },
  now: Date,
): string {
  const bound = bindAppliedAt(
    new Date(capturedAt),
    { startedAt: visit.started_at, completedAt: visit.completed_at },
    now,
  );
  if (!bound.ok)
    throw new AppError("invalid_input", "Some values need attention.", {
      capturedAt: [
        `The photo's time must fall within the visit: between ${bound.from.toISOString()} and ${bound.to.toISOString()} (check the phone's clock).`,
      ],
    });
  const parts = Object.fromEntries(
    new Intl.DateTimeFormat("en-US", {
      timeZone: visit.time_zone,
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      second: "2-digit",
      hourCycle: "h23",
    })
      .formatToParts(bound.at)
      .map((p) => [p.type, p.value]),
  );
  return `${parts.year}-${parts.month}-${parts.day} ${parts.hour}:${parts.minute}:${parts.second}`;
}

/** Checks that the actor may add a photo to this zone check, before any work is done. */
export async function assertCanAddPhoto(
  actor: Actor,
  visitId: string,
  zoneCheckId: string,
  correctionReason?: string | null,
) {
  const row = await db()
    .selectFrom("visits")
    .innerJoin("zone_checks", "zone_checks.visit_id", "visits.id")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .select([
      "visits.status",
      "visits.property_id",
      "visits.started_at",
      "visits.completed_at",
      "properties.time_zone",
      "zone_checks.zone_id",
      "zone_checks.status as check_status",
    ])
    .where(visitInScope(actor))
    .where("visits.id", "=", visitId)
    .where("zone_checks.id", "=", zoneCheckId)
    .where("zone_checks.company_id", "=", actor.companyId)
    .executeTakeFirst();
  if (!row) throw notFound("That zone check");
  if (row.status === "cancelled")
    throw new AppError("conflict", "This visit was canceled; photos can no longer be added.");
  if (row.status === "completed" && actor.role !== "manager")
    throw new AppError(
      "forbidden",
      "This visit is finished and locked. Ask your manager to add the photo.",
    );
  // A photo added to a finished visit is a correction: it says why, before the upload is read.
  correctionReasonFor({ status: row.status }, correctionReason);
  return row;
}

export async function addPhoto(
  actor: Actor,
  visitId: string,
  zoneCheckId: string,
  photo: ProcessedPhoto,
  storage: PhotoStorage,
  correctionReason?: string | null,
  /** When the device took it (a photo queued offline arrives later and without EXIF). */
  capturedAt?: string | null,
  now: Date = new Date(),
): Promise<{ photo: PhotoDto; isNew: boolean }> {
  const target = await assertCanAddPhoto(actor, visitId, zoneCheckId, correctionReason);
  // A replay of the same photo answers with the stored one (before any other decision).
  const existing = await findZoneCheckPhoto(zoneCheckId, photo.contentHash, actor);
  if (existing) return { photo: existing, isNew: false };
  const capturedLocal =
    photo.capturedLocal ?? (capturedAt ? deviceCaptureLocal(capturedAt, target, now) : null);

  const prefix = `${actor.companyId}/${photo.contentHash}`;
  const displayKey = `${prefix}-display.webp`;
  const thumbKey = `${prefix}-thumb.webp`;
  if (!(await storage.has(displayKey)))
    await storage.put(displayKey, photo.display.data, "image/webp");
  if (!(await storage.has(thumbKey))) await storage.put(thumbKey, photo.thumb.data, "image/webp");

  // The row and what it changes (the check's Index, the book, the alerts of a finished visit)
  // commit together: were they apart, a crash between them would leave the photo stored and the
  // Index without it, and the retry (which finds the row) would answer 200 without correcting it.
  const inserted = await db()
    .transaction()
    .execute(async (trx) => {
      // The visit, locked: a finish or a cancel that committed while the photo was processed
      // is seen here (a technician's photo is then refused, as it would be on a finished visit).
      const locked = await lockVisit(trx, actor, visitId);
      assertEditable(actor, locked);
      const reason = correctionReasonFor(locked, correctionReason);
      const row = await trx
        .insertInto("photos")
        .values({
          company_id: actor.companyId,
          visit_id: visitId,
          zone_check_id: zoneCheckId,
          zone_id: target.zone_id,
          property_id: target.property_id,
          content_hash: photo.contentHash,
          original_format: photo.format,
          original_bytes: photo.bytes,
          width: photo.width,
          height: photo.height,
          display_key: displayKey,
          display_width: photo.display.width,
          display_height: photo.display.height,
          thumb_key: thumbKey,
          green_cover_pct: photo.greenCoverPct,
          dgci: photo.dgci,
          measured_by: MEASURED_BY,
          dark_pct: photo.darkPct,
          clipped_pct: photo.clippedPct,
          captured_local: capturedLocal,
          gps_latitude: photo.gps?.latitude ?? null,
          gps_longitude: photo.gps?.longitude ?? null,
          uploaded_by: actor.userId,
        })
        .onConflict((oc) => oc.columns(["zone_check_id", "content_hash"]).doNothing())
        .returning("id")
        .executeTakeFirst();
      if (row && locked.status === "completed")
        await recordAudit(trx, actor, {
          entity: "photo",
          entityId: row.id,
          action: "add_after_finish",
          reason,
          visitId,
          zoneId: target.zone_id,
        });
      if (row)
        await afterWrite(trx, {
          companyId: actor.companyId,
          propertyId: target.property_id,
          recheckIndexOf: [zoneCheckId], // photo cover and colour are part of the Index
          alerts: locked.status === "completed" ? "evaluate" : "keep",
        });
      return row !== undefined;
    });
  // A deletion of the same photo elsewhere may have removed the shared files between the check
  // above and the row's commit (keys are content hashes): put them back, the bytes are in hand.
  if (!(await storage.has(displayKey)))
    await storage.put(displayKey, photo.display.data, "image/webp");
  if (!(await storage.has(thumbKey))) await storage.put(thumbKey, photo.thumb.data, "image/webp");
  const saved = await findZoneCheckPhoto(zoneCheckId, photo.contentHash, actor);
  if (!saved) throw new Error("photo row missing after insert");
  // A retry that raced the first upload finds the row the first one wrote: 200, not a second 201.
  return { photo: saved, isNew: inserted };
}

/**
 * Deletes a photo: its uploader while the visit is open, a manager (with a reason, audited) after
 * it is finished. The row, the check's Index without it, the book and (on a finished visit) the
 * alerts change in one transaction; the files are removed after the commit, unless another photo
 * row still points at them (the same picture on another check shares its content-hash keys). A
 * removal that fails leaves an unreferenced file behind and is logged; nothing reads it.
 */
export async function deletePhoto(
  actor: Actor,
  photoId: string,
  correctionReason: string | null | undefined,
  storage: PhotoStorage,
): Promise<void> {
  const found = await db()
    .selectFrom("photos")
    .innerJoin("visits", "visits.id", "photos.visit_id")
    .select(["photos.visit_id"])
    .where(visitInScope(actor))
    .where("photos.company_id", "=", actor.companyId)
    .where("photos.id", "=", photoId)
    .executeTakeFirst();
  if (!found) throw notFound("That photo");
  const keys = await db()
    .transaction()
    .execute(async (trx) => {
      const visit = await lockVisit(trx, actor, found.visit_id);
      const photo = await trx
        .selectFrom("photos")
        .selectAll()
        .where("company_id", "=", actor.companyId)
        .where("id", "=", photoId)
        .forUpdate()
        .executeTakeFirst();
      if (!photo) throw notFound("That photo");
      assertEditable(actor, visit);
      if (actor.role !== "manager" && photo.uploaded_by !== actor.userId)
        throw new AppError(
          "forbidden",
          "Only the person who took this photo, or a manager, can delete it.",
        );
      const reason = correctionReasonFor(visit, correctionReason);
      await trx.deleteFrom("photos").where("id", "=", photoId).execute();
      await recordAudit(trx, actor, {
        entity: "photo",
        entityId: photoId,
        action: visit.status === "completed" ? "delete_after_finish" : "delete",
        changes: {
          greenCoverPct: { from: Number(photo.green_cover_pct), to: null },
        },
        reason,
        visitId: photo.visit_id,
        zoneId: photo.zone_id,
      });
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: photo.property_id,
        recheckIndexOf: [photo.zone_check_id], // the photo's cover and color leave the Index
        alerts: visit.status === "completed" ? "evaluate" : "keep",
      });
      return [photo.display_key, photo.thumb_key];
    });
  await removeUnreferencedFiles(keys, storage);
}

/** Removes stored files no photo row points at any more (after the deleting transaction committed). */
export async function removeUnreferencedFiles(keys: string[], storage: PhotoStorage) {
  for (const key of keys) {
    const still = await db()
      .selectFrom("photos")
      .select("id")
      .where((eb) => eb.or([eb("display_key", "=", key), eb("thumb_key", "=", key)]))
      .executeTakeFirst();
    if (still) continue;
    await storage.remove(key).catch((err: unknown) => {
      log.warn({ key, error: String(err) }, "photo file not removed");
    });
  }
}
