// GET  /api/v1/properties/:propertyId/soil-tests — { items: SoilTestDto[] }, newest sample first, each with its reading.
// POST /api/v1/properties/:propertyId/soil-tests — record a lab's results (managers and the property's technicians).
import { route } from "@/lib/auth/guards";
import { propertyIdParams } from "@/lib/properties/schemas";
import { recordSoilTest } from "@/lib/soil-tests/mutations";
import { listSoilTests } from "@/lib/soil-tests/queries";
import { soilTestSchema } from "@/lib/soil-tests/schemas";

export const GET = route(
  { access: ["manager", "technician"], params: propertyIdParams, resource: "That property" },
  async ({ actor, params }) => ({ items: await listSoilTests(actor, params.propertyId) }),
);

export const POST = route(
  {
    access: ["manager", "technician"],
    params: propertyIdParams,
    body: soilTestSchema,
    resource: "That property",
  },
  async ({ actor, params, body }) =>
    Response.json(await recordSoilTest(actor, params.propertyId, body), { status: 201 }),
);
