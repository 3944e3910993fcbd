// After the crashes: what the database holds, compared with what the client was told.
//   - every submission answered with 2xx is stored exactly once under its client id, with the
//     values that were sent, at version 1 (a retried submission must not be applied twice);
//   - no zone is checked twice on a visit, and no row appears that nobody sent;
//   - every photo answered with 2xx has its row, and no photo row (the seed's included) names a
//     file that is missing, empty or not a WebP image in the photo folder;
//   - the stored Sward Index of each acknowledged check is the one its stored values and photos give.
import { closeSync, openSync, readSync, statSync } from "node:fs";
import path from "node:path";
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";
import { indexInputOf } from "@/lib/scoring/from-check";
import { swardIndex } from "@/lib/scoring/sward-index";
import { diffValues, valuesOf } from "@/lib/visits/map";
import type { ZoneCheckInput } from "@/lib/visits/schemas";

export interface Submission {
  n: number;
  visitId: string;
  zoneCheckId: string;
  body: ZoneCheckInput;
  /** Final answer: 2xx = acknowledged; 0 = gave up on network errors / 5xx; else refused. */
  status?: number;
  attempts?: number;
  /** When the last attempt was sent (this machine's clock, which the database shares). */
  lastSentAt?: number;
  photo?: { bytes: Buffer; status?: number; attempts?: number; photoId?: string };
}

export interface Findings {
  acknowledged: number;
  ackedAfterRetry: number;
  /** Retries answered from the stored row: an earlier attempt had committed, its answer was lost. */
  answeredFromStoredRow: number;
  lost: string[];
  duplicated: string[];
  storedDifferently: string[];
  photosAcknowledged: number;
  photosLost: string[];
  photoRowsChecked: number;
  photoRowsMissingFiles: string[];
  indexOutOfDate: string[];
}

const ok = (status: number | undefined) => status !== undefined && status >= 200 && status < 300;

/** A stored WebP: present, not empty, RIFF....WEBP header (files are renamed into place whole). */
function isWebpFile(file: string): boolean {
  try {
    if (statSync(file).size < 12) return false;
    const fd = openSync(file, "r");
    const head = Buffer.alloc(12);
    readSync(fd, head, 0, 12, 0);
    closeSync(fd);
    return head.toString("latin1", 0, 4) === "RIFF" && head.toString("latin1", 8, 12) === "WEBP";
  } catch {
    return false;
  }
}

export async function verify(
  db: Kysely<Database>,
  submissions: Submission[],
  visitIds: string[],
  preexisting: Set<string>,
  photoDir: string,
): Promise<Findings> {
  const rows = await db
    .selectFrom("zone_checks")
    .selectAll()
    .where("visit_id", "in", visitIds)
    .execute();
  const byId = new Map<string, typeof rows>();
  for (const r of rows) byId.set(r.id, [...(byId.get(r.id) ?? []), r]);
  const sent = new Map(submissions.map((s) => [s.zoneCheckId, s]));
  const acked = submissions.filter((s) => ok(s.status));

  const lost: string[] = [];
  const duplicated: string[] = [];
  const storedDifferently: string[] = [];
  for (const s of acked) {
    const found = byId.get(s.zoneCheckId) ?? [];
    if (found.length === 0) {
      lost.push(`#${s.n} ${s.zoneCheckId}: acknowledged with ${s.status}, not in the database`);
      continue;
    }
    if (found.length > 1) duplicated.push(`#${s.n} ${s.zoneCheckId}: ${found.length} rows`);
    const row = found[0]!;
    if (row.version !== 1)
      duplicated.push(
        `#${s.n} ${s.zoneCheckId}: applied ${row.version} times (version ${row.version})`,
      );
    const { baseVersion: _base, ...values } = s.body;
    const diff = diffValues(valuesOf(row), values);
    if (row.visit_id !== s.visitId) diff.visitId = { from: s.visitId, to: row.visit_id };
    if (Object.keys(diff).length)
      storedDifferently.push(`#${s.n} ${s.zoneCheckId}: ${JSON.stringify(diff)}`);
  }
  // A row created before the last attempt was sent was written by an earlier attempt: the last one
  // was a replay, answered from the stored row (the idempotent path of PUT).
  const retried = acked.filter((s) => (s.attempts ?? 1) > 1);
  const answeredFromStoredRow = retried.filter((s) => {
    const row = byId.get(s.zoneCheckId)?.[0];
    return row && s.lastSentAt !== undefined && new Date(row.created_at).getTime() < s.lastSentAt;
  }).length;

  // The same zone twice on one visit, or a row that no submission sent.
  const perZone = new Map<string, number>();
  for (const r of rows)
    perZone.set(`${r.visit_id}/${r.zone_id}`, (perZone.get(`${r.visit_id}/${r.zone_id}`) ?? 0) + 1);
  for (const [key, count] of perZone)
    if (count > 1) duplicated.push(`zone ${key}: ${count} checks on one visit`);
  for (const r of rows)
    if (!sent.has(r.id) && !preexisting.has(r.id))
      duplicated.push(`${r.id}: a row no submission sent`);

  // Photos: every acknowledged upload has its row; every row in the database has its files.
  const photos = await db
    .selectFrom("photos")
    .select([
      "id",
      "zone_check_id",
      "content_hash",
      "display_key",
      "thumb_key",
      "green_cover_pct",
      "dgci",
      "dark_pct",
      "clipped_pct",
    ])
    .execute();
  const photoById = new Map(photos.map((p) => [p.id, p]));
  const photosAcked = submissions.filter((s) => ok(s.photo?.status));
  const photosLost: string[] = [];
  for (const s of photosAcked) {
    const row = s.photo?.photoId ? photoById.get(s.photo.photoId) : undefined;
    if (!row || row.zone_check_id !== s.zoneCheckId)
      photosLost.push(
        `#${s.n} photo ${s.photo?.photoId}: acknowledged with ${s.photo?.status}, no such row on ${s.zoneCheckId}`,
      );
    const onCheck = photos.filter((p) => p.zone_check_id === s.zoneCheckId).length;
    if (onCheck > 1)
      duplicated.push(`#${s.n} ${s.zoneCheckId}: ${onCheck} photo rows for one upload`);
  }
  const photoRowsMissingFiles: string[] = [];
  for (const p of photos) {
    for (const key of [p.display_key, p.thumb_key])
      if (!isWebpFile(path.join(photoDir, key)))
        photoRowsMissingFiles.push(`photo ${p.id}: ${key}`);
  }

  // The stored Index is what the stored values and photos give (a photo counts once it is stored).
  const indexOutOfDate: string[] = [];
  for (const s of acked) {
    const row = byId.get(s.zoneCheckId)?.[0];
    if (!row) continue;
    const own = photos
      .filter((p) => p.zone_check_id === row.id)
      .map((p) => ({
        greenCoverPct: p.green_cover_pct,
        dgci: p.dgci,
        darkPct: p.dark_pct,
        clippedPct: p.clipped_pct,
      }));
    const input = indexInputOf(valuesOf(row), own);
    const expected = input ? swardIndex(input).index : null;
    if (
      (row.sward_index === null) !== (expected === null) ||
      Math.abs((row.sward_index ?? 0) - (expected ?? 0)) > 0.051
    )
      indexOutOfDate.push(
        `#${s.n} ${row.id}: stored ${row.sward_index}, its values give ${expected}${own.length ? " (with its photo)" : ""}`,
      );
  }

  return {
    acknowledged: acked.length,
    ackedAfterRetry: retried.length,
    answeredFromStoredRow,
    lost,
    duplicated,
    storedDifferently,
    photosAcknowledged: photosAcked.length,
    photosLost,
    photoRowsChecked: photos.length,
    photoRowsMissingFiles,
    indexOutOfDate,
  };
}
