// PUT    /api/v1/visits/:visitId/zone-checks/:zoneCheckId — create or update one zone check.
//        Idempotent by the client's id; 409 with the server's copy when the base version is stale.
// DELETE /api/v1/visits/:visitId/zone-checks/:zoneCheckId — remove it (its photos with it).
// On a finished visit both are a manager's correction and need `correctionReason` (422 without
// one); they are audited in the same transaction as the change.
import { correctionOnlySchema } from "@/lib/audit/correction";
import { route } from "@/lib/auth/guards";
import { services } from "@/lib/services";
import { deleteZoneCheck, saveZoneCheck } from "@/lib/visits/mutations";
import { zoneCheckBodySchema, zoneCheckParams } from "@/lib/visits/schemas";

export const PUT = route(
  {
    access: ["manager", "technician"],
    params: zoneCheckParams,
    body: zoneCheckBodySchema,
    resource: "That visit",
  },
  async ({ actor, params, body }) => {
    const { correctionReason, ...check } = body;
    return saveZoneCheck(actor, params.visitId, params.zoneCheckId, check, correctionReason);
  },
);

export const DELETE = route(
  {
    access: ["manager", "technician"],
    params: zoneCheckParams,
    body: correctionOnlySchema,
    resource: "That zone check",
  },
  async ({ actor, params, body }) => {
    await deleteZoneCheck(
      actor,
      params.visitId,
      params.zoneCheckId,
      body.correctionReason,
      services().photoStorage,
    );
    return new Response(null, { status: 204 });
  },
);
