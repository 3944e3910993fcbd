// PUT /api/v1/people/:personId/license — { number, category, expiresOn } (manager): a technician's
// applicator license; all three empty removes it.
import { route } from "@/lib/auth/guards";
import { setLicense } from "@/lib/people/mutations";
import { licenseSchema, personParams } from "@/lib/people/schemas";

export const PUT = route(
  { access: ["manager"], params: personParams, body: licenseSchema, resource: "That person" },
  async ({ actor, params, body }) => {
    await setLicense(actor, params.personId, body);
    return { saved: true };
  },
);
