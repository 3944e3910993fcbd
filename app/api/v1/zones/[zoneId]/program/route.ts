// PUT /api/v1/zones/:zoneId/program — { method, excludedYear, excludedReason }: how the zone is
//     fed in its property's program, or the season it is left out and why (managers); answers
//     the setting as saved.
import { route } from "@/lib/auth/guards";
import { setZoneProgram } from "@/lib/programs/mutations";
import { zoneProgramSchema } from "@/lib/programs/schemas";
import { zoneIdParams } from "@/lib/properties/schemas";

export const PUT = route(
  { access: ["manager"], params: zoneIdParams, body: zoneProgramSchema, resource: "That zone" },
  async ({ actor, params, body }) => {
    await setZoneProgram(actor, params.zoneId, body);
    return { zoneId: params.zoneId, ...body };
  },
);
