// PUT    /api/v1/waterings/:wateringId — correct a watering (the whole entry again, same checks
//        as a new one; the id in the body is the path's).
// DELETE /api/v1/waterings/:wateringId — delete it ({ correctionReason } as the body, or none).
// Its author or a manager; homeowners their own entries on their own lawn. A watering recorded
// on a finished visit: a manager only, with a `correctionReason` (422 without one), audited.
import { correctionOnlySchema } from "@/lib/audit/correction";
import { route } from "@/lib/auth/guards";
import { correctWatering, deleteWatering } from "@/lib/watering/mutations";
import { wateringIdParams, wateringSchema } from "@/lib/watering/schemas";

export const PUT = route(
  {
    access: ["manager", "technician", "homeowner"],
    params: wateringIdParams,
    body: wateringSchema,
    resource: "That watering",
  },
  async ({ actor, params, body }) => correctWatering(actor, params.wateringId, body),
);

export const DELETE = route(
  {
    access: ["manager", "technician", "homeowner"],
    params: wateringIdParams,
    body: correctionOnlySchema,
    resource: "That watering",
  },
  async ({ actor, params, body }) => {
    await deleteWatering(actor, params.wateringId, body.correctionReason);
    return new Response(null, { status: 204 });
  },
);
