// POST /api/v1/properties/:propertyId/archive — { archived: true|false }: archive or restore (manager). History is kept.
import { z } from "zod";

import { route } from "@/lib/auth/guards";
import { setPropertyArchived } from "@/lib/properties/mutations";
import { propertyIdParams } from "@/lib/properties/schemas";

export const POST = route(
  {
    access: ["manager"],
    params: propertyIdParams,
    body: z.object({ archived: z.boolean() }).strict(),
    resource: "That property",
  },
  async ({ actor, params, body }) => setPropertyArchived(actor, params.propertyId, body.archived),
);
