// GET /api/v1/zones/:zoneId/checks — the zone's history: every check, newest first (staff).
import { route } from "@/lib/auth/guards";
import { zoneIdParams } from "@/lib/properties/schemas";
import { getZoneHistory } from "@/lib/visits/queries";

export const GET = route(
  { access: ["manager", "technician"], params: zoneIdParams, resource: "That zone" },
  async ({ actor, params }) => getZoneHistory(actor, params.zoneId),
);
