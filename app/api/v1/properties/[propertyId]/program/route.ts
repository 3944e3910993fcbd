// GET /api/v1/properties/:propertyId/program — ProgramPlanDto: the program the property follows
//     and this season's plan, each zone's N per round and the product to load (managers and the
//     property's technicians).
// PUT /api/v1/properties/:propertyId/program — { programId | null }: the program it follows (managers).
import { route } from "@/lib/auth/guards";
import { setPropertyProgram } from "@/lib/programs/mutations";
import { propertyProgramSchema } from "@/lib/programs/schemas";
import { getSeasonPlan } from "@/lib/programs/season-plan";
import { propertyIdParams } from "@/lib/properties/schemas";
import { services } from "@/lib/services";

export const GET = route(
  { access: ["manager", "technician"], params: propertyIdParams, resource: "That property" },
  async ({ actor, params }) => getSeasonPlan(actor, params.propertyId, services().quickWeather),
);

export const PUT = route(
  {
    access: ["manager"],
    params: propertyIdParams,
    body: propertyProgramSchema,
    resource: "That property",
  },
  async ({ actor, params, body }) => {
    await setPropertyProgram(actor, params.propertyId, body.programId);
    return getSeasonPlan(actor, params.propertyId, services().quickWeather);
  },
);
