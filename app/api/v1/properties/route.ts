// GET  /api/v1/properties — { items: PropertySummaryDto[] } within the actor's scope (?archived=include for managers).
// POST /api/v1/properties — create a property (manager) → PropertyDetailDto.
import { z } from "zod";

import { ROLES } from "@/lib/auth/actor";
import { route } from "@/lib/auth/guards";
import { createProperty } from "@/lib/properties/mutations";
import { listProperties } from "@/lib/properties/queries";
import { propertySchema } from "@/lib/properties/schemas";

export const GET = route(
  {
    access: ROLES,
    query: z.object({ archived: z.enum(["include", "exclude"]).default("exclude") }).strict(),
  },
  async ({ actor, query }) => ({
    items: await listProperties(actor, { includeArchived: query.archived === "include" }),
  }),
);

export const POST = route({ access: ["manager"], body: propertySchema }, async ({ actor, body }) =>
  createProperty(actor, body),
);
