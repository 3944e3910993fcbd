// POST /api/v1/visits/:visitId/zone-checks/:zoneCheckId/photos — the image bytes as the body
// (image/jpeg, image/png or image/webp, checked from the content). 201 with the PhotoDto, or 200
// when the same photo is already on this check. Refused files store nothing.
//
// The body is read only inside the photo limiter (at most two uploads at once per process), and
// then streamed to a temporary file with the byte limit enforced as it arrives (413 at once, the
// file removed); the photo is processed from that file, which is removed afterwards whatever
// happens. Uploads beyond the limit wait with their bodies unread. On a finished visit (a
// manager's correction) `?correctionReason=` says why; without one: 422 before the body is read.
// A photo queued on the device while offline says when it was taken with `?capturedAt=` (ISO
// 8601, bound to the visit's times like an application's; used when the file has no EXIF time).
import { z } from "zod/mini";

import { correctionOnlySchema } from "@/lib/audit/correction";
import { route } from "@/lib/auth/guards";
import { streamBodyToFile } from "@/lib/http/stream-to-file";
import { limitPhotoWork } from "@/lib/photos/limiter";
import { addPhoto, assertCanAddPhoto } from "@/lib/photos/mutations";
import { PHOTO_LIMITS, processPhoto } from "@/lib/photos/process";
import { services } from "@/lib/services";
import { zoneCheckParams } from "@/lib/visits/schemas";

export const POST = route(
  {
    access: ["manager", "technician"],
    params: zoneCheckParams,
    query: z.extend(correctionOnlySchema, {
      capturedAt: z.optional(
        z.iso.datetime({ offset: true, error: "Use a date and time with its offset (ISO 8601)." }),
      ),
    }),
    resource: "That zone check",
  },
  async ({ actor, params, query, request }) => {
    // Before reading or decoding anything.
    await assertCanAddPhoto(actor, params.visitId, params.zoneCheckId, query.correctionReason);
    const processed = await limitPhotoWork(async () => {
      const upload = await streamBodyToFile(request, PHOTO_LIMITS.maxBytes, "The photo");
      try {
        return await processPhoto(upload);
      } finally {
        await upload.remove();
      }
    });
    const { photo, isNew } = await addPhoto(
      actor,
      params.visitId,
      params.zoneCheckId,
      processed,
      services().photoStorage,
      query.correctionReason,
      query.capturedAt ?? null,
    );
    return Response.json(photo, {
      status: isNew ? 201 : 200,
      headers: { "Cache-Control": "no-store" },
    });
  },
);
