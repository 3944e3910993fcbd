// DELETE /api/v1/photos/:photoId — delete a photo ({ correctionReason } as the body, or none).
// While the visit is open: the person who took it, or a manager; after it is finished: a manager,
// with a `correctionReason` (422 without one), audited. The check's Index, the book and alerts
// follow in the same transaction; the files go from storage after the commit.
import { z } from "zod";

import { correctionOnlySchema } from "@/lib/audit/correction";
import { route } from "@/lib/auth/guards";
import { deletePhoto } from "@/lib/photos/mutations";
import { services } from "@/lib/services";

const photoIdParams = z.object({ photoId: z.uuid() });

export const DELETE = route(
  {
    access: ["manager", "technician"],
    params: photoIdParams,
    body: correctionOnlySchema,
    resource: "That photo",
  },
  async ({ actor, params, body }) => {
    await deletePhoto(actor, params.photoId, body.correctionReason, services().photoStorage);
    return new Response(null, { status: 204 });
  },
);
