// GET/PUT /api/v1/company-settings/pressure-areas — the distance, days and fewest properties that
// make a pressure area (manager).
import { route } from "@/lib/auth/guards";
import { savePressureSettings } from "@/lib/pressure-areas/mutations";
import { getPressureSettings } from "@/lib/pressure-areas/queries";
import { pressureSettingsSchema } from "@/lib/pressure-areas/schemas";

export const GET = route({ access: ["manager"] }, async ({ actor }) => getPressureSettings(actor));

export const PUT = route(
  { access: ["manager"], body: pressureSettingsSchema },
  async ({ actor, body }) => savePressureSettings(actor, body),
);
