// GET /api/v1/me/applicator — the applicator's name and license number the signed-in person last
// recorded on an application: { name, license } (empty strings until the first).
import { route } from "@/lib/auth/guards";
import { getRememberedApplicator } from "@/lib/people/queries";

export const GET = route({ access: ["manager", "technician"] }, async ({ actor }) =>
  getRememberedApplicator(actor),
);
