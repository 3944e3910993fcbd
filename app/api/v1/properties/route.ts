// GET /api/v1/properties — { items: PropertySummaryDto[] } within the actor's scope.
import { ROLES } from "@/lib/auth/actor";
import { route } from "@/lib/auth/guards";
import { listProperties } from "@/lib/properties/queries";

export const GET = route({ access: ROLES }, async ({ actor }) => ({ items: await listProperties(actor) }));
