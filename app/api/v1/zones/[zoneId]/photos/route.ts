// GET /api/v1/zones/:zoneId/photos — { items: PhotoDto[] } of the zone over time, oldest first.
import { ROLES } from "@/lib/auth/actor";
import { route } from "@/lib/auth/guards";
import { listZonePhotos } from "@/lib/photos/queries";
import { zoneIdParams } from "@/lib/properties/schemas";

export const GET = route(
  { access: ROLES, params: zoneIdParams, resource: "That zone" },
  async ({ actor, params }) => ({ items: await listZonePhotos(actor, params.zoneId) }),
);
