// POST /api/v1/visits/:visitId/zone-checks/:zoneCheckId/photos — the image bytes as the body
// (image/jpeg, image/png or image/webp, checked from the content). 201 with the PhotoDto, or 200
// when the same photo is already on this check. Refused files store nothing.
import { route } from "@/lib/auth/guards";
import { readBodyLimited } from "@/lib/http/read-body";
import { limitPhotoWork } from "@/lib/photos/limiter";
import { addPhoto, assertCanAddPhoto } from "@/lib/photos/mutations";
import { PHOTO_LIMITS, processPhoto } from "@/lib/photos/process";
import { services } from "@/lib/services";
import { zoneCheckParams } from "@/lib/visits/schemas";

export const POST = route(
  { access: ["manager", "technician"], params: zoneCheckParams, resource: "That zone check" },
  async ({ actor, params, request }) => {
    await assertCanAddPhoto(actor, params.visitId, params.zoneCheckId); // before reading or decoding anything
    const bytes = await readBodyLimited(request, PHOTO_LIMITS.maxBytes, "The photo");
    const processed = await limitPhotoWork(() => processPhoto(bytes));
    const { photo, isNew } = await addPhoto(
      actor,
      params.visitId,
      params.zoneCheckId,
      processed,
      services().photoStorage,
    );
    return Response.json(photo, {
      status: isNew ? 201 : 200,
      headers: { "Cache-Control": "no-store" },
    });
  },
);
