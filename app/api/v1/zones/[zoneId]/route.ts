// PUT /api/v1/zones/:zoneId — replace a zone's fields (manager).
import { route } from "@/lib/auth/guards";
import { updateZone } from "@/lib/properties/mutations";
import { zoneIdParams, zoneSchema } from "@/lib/properties/schemas";

export const PUT = route(
  { access: ["manager"], params: zoneIdParams, body: zoneSchema, resource: "That zone" },
  async ({ actor, params, body }) => updateZone(actor, params.zoneId, body),
);
