// POST /api/v1/zones/:zoneId/archive — { archived: true|false } (manager). Its checks stay in history.
import { z } from "zod";

import { route } from "@/lib/auth/guards";
import { setZoneArchived } from "@/lib/properties/mutations";
import { zoneIdParams } from "@/lib/properties/schemas";

export const POST = route(
  {
    access: ["manager"],
    params: zoneIdParams,
    body: z.object({ archived: z.boolean() }).strict(),
    resource: "That zone",
  },
  async ({ actor, params, body }) => {
    await setZoneArchived(actor, params.zoneId, body.archived);
    return { ok: true };
  },
);
