// Input schemas of the People page's writes (zod/mini: the forms' bundles stay small). Messages
// name the field and what is expected.
import { z } from "zod/mini";

import { isIsoDate } from "@/lib/dates";

export const personParams = z.object({ personId: z.uuid("That person was not found.") });

/** A change of one person: a staff role (manager ↔ technician), or disabling / re-enabling. */
export const personChangeSchema = z.strictObject({
  role: z.optional(z.enum(["manager", "technician"], "Role: choose technician or manager.")),
  disabled: z.optional(z.boolean("Disabled: true or false.")),
});
export type PersonChange = z.infer<typeof personChangeSchema>;

/** A technician's applicator license; all three fields empty removes it. */
export const licenseSchema = z.strictObject({
  number: z
    .string("License number is required.")
    .check(z.trim(), z.maxLength(80, "License number: at most 80 characters.")),
  category: z
    .string("License category is required.")
    .check(z.trim(), z.maxLength(120, "License category: at most 120 characters.")),
  expiresOn: z.string("Expiry date is required.").check(
    z.trim(),
    z.refine((v) => v === "" || isIsoDate(v), "Expiry date: a date like 2027-03-31."),
  ),
});
export type LicenseInput = z.infer<typeof licenseSchema>;

/** Moving properties (and their future scheduled stops) from one technician to another. */
export const reassignSchema = z.strictObject({
  fromTechnicianId: z.uuid("From: choose a technician."),
  toTechnicianId: z.uuid("To: choose a technician."),
});
export type ReassignInput = z.infer<typeof reassignSchema>;
