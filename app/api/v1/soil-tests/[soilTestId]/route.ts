// DELETE /api/v1/soil-tests/:soilTestId — managers delete a soil test recorded by mistake (audited).
import { route } from "@/lib/auth/guards";
import { deleteSoilTest } from "@/lib/soil-tests/mutations";
import { soilTestIdParams } from "@/lib/soil-tests/schemas";

export const DELETE = route(
  { access: ["manager"], params: soilTestIdParams, resource: "That soil test" },
  async ({ actor, params }) => {
    await deleteSoilTest(actor, params.soilTestId);
    return new Response(null, { status: 204 });
  },
);
