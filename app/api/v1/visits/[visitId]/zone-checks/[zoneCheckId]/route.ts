// PUT /api/v1/visits/:visitId/zone-checks/:zoneCheckId — create or update one zone check.
// Idempotent by the client's id; 409 with the server's copy when the base version is stale.
import { route } from "@/lib/auth/guards";
import { saveZoneCheck } from "@/lib/visits/mutations";
import { zoneCheckParams, zoneCheckSchema } from "@/lib/visits/schemas";

export const PUT = route(
  {
    access: ["manager", "technician"],
    params: zoneCheckParams,
    body: zoneCheckSchema,
    resource: "That visit",
  },
  async ({ actor, params, body }) => saveZoneCheck(actor, params.visitId, params.zoneCheckId, body),
);
