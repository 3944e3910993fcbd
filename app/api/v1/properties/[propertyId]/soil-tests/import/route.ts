// POST /api/v1/properties/:propertyId/soil-tests/import — { csv, preview? }: a lab's results in
// Sward's soil-test CSV format (lib/soil-tests/README.md); every row valid or nothing saved.
import { route } from "@/lib/auth/guards";
import { propertyIdParams } from "@/lib/properties/schemas";
import { importSoilTests } from "@/lib/soil-tests/mutations";
import { SOIL_TEST_IMPORT_MAX_CHARS, soilTestImportSchema } from "@/lib/soil-tests/schemas";

export const POST = route(
  {
    access: ["manager", "technician"],
    params: propertyIdParams,
    body: soilTestImportSchema,
    // The CSV text inside JSON: up to 4 bytes a character, and escaping adds a little.
    maxBodyBytes: SOIL_TEST_IMPORT_MAX_CHARS * 4 + 1024,
    resource: "That property",
  },
  async ({ actor, params, body }) =>
    importSoilTests(actor, params.propertyId, body.csv, body.preview ?? false),
);
