// GET/PUT /api/v1/company-settings — the company's locale and time zone (manager).
import { route } from "@/lib/auth/guards";
import { saveCompanySettings } from "@/lib/company-settings/mutations";
import { getCompanySettings } from "@/lib/company-settings/queries";
import { companySettingsSchema } from "@/lib/company-settings/schemas";

export const GET = route({ access: ["manager"] }, async ({ actor }) => getCompanySettings(actor));

export const PUT = route(
  { access: ["manager"], body: companySettingsSchema },
  async ({ actor, body }) => saveCompanySettings(actor, body),
);
