// Input schemas for properties and zones, shared by the route handlers and the manager's forms
// (zod/mini: the forms' bundles stay small; the server parses the same schemas).
import { z } from "zod/mini";

import { isValidTimeZone } from "@/lib/dates";
import { grassSpeciesKeys } from "@/lib/reference/grass-species";
import { usPhoneE164 } from "@/lib/reference/us-phone";
import { findUsState, ZIP_PATTERN } from "@/lib/reference/us-states";

/** The bound of a property's access notes (also a database check). */
export const ACCESS_NOTES_MAX = 500;

export const propertyIdParams = z.object({ propertyId: z.uuid() });
export const zoneIdParams = z.object({ zoneId: z.uuid() });

const text = (label: string, max: number) =>
  z
    .string(`${label} is required.`)
    .check(
      z.trim(),
      z.minLength(1, `${label} is required.`),
      z.maxLength(max, `${label}: at most ${max} characters.`),
    );

export const propertySchema = z.strictObject({
  name: text("Name", 200),
  street: text("Street address", 200),
  city: text("Town or city", 100),
  /** USPS two-letter code (lib/reference/us-states.ts); typed "nj" is kept as "NJ". */
  region: z.string("State is required.").check(
    z.trim(),
    z.toUpperCase(),
    z.minLength(1, "State is required."),
    z.refine(
      (v) => v === "" || findUsState(v) !== undefined,
      "State: use the two-letter USPS code of a US state or territory, e.g. NJ.",
    ),
  ),
  /** 12345 or 12345-6789. A ZIP whose first digits belong to another state is a warning on the form, not a refusal. */
  postalCode: z.string("ZIP code is required.").check(
    z.trim(),
    z.minLength(1, "ZIP code is required."),
    z.refine(
      (v) => v === "" || ZIP_PATTERN.test(v),
      "ZIP code: five digits, e.g. 08540, or ZIP+4, e.g. 08540-1234.",
    ),
  ),
  latitude: z
    .number("Enter the latitude as a number, e.g. 40.3342.")
    .check(
      z.gte(-90, "Latitude is between -90 and 90."),
      z.lte(90, "Latitude is between -90 and 90."),
    ),
  longitude: z
    .number("Enter the longitude as a number, e.g. -74.7391.")
    .check(
      z.gte(-180, "Longitude is between -180 and 180."),
      z.lte(180, "Longitude is between -180 and 180."),
    ),
  timeZone: z.string().check(z.refine(isValidTimeZone, "Choose a time zone from the list.")),
  ruleSetId: z.nullable(z.uuid("Choose a rule set.")),
  technicianId: z.nullable(z.uuid("Choose a technician.")),
  notes: z._default(
    z.string().check(z.trim(), z.maxLength(4000, "Keep notes under 4,000 characters.")),
    "",
  ),
  /** Empty, or a US number (lib/reference/us-phone.ts); stored in E.164 form. */
  customerPhone: z._default(
    z.string().check(
      z.trim(),
      z.maxLength(30, "Customer phone: a US number of 10 digits, e.g. (609) 555-0142."),
      z.refine(
        (v) => v === "" || usPhoneE164(v) !== null,
        "Customer phone: a US number of 10 digits, e.g. (609) 555-0142.",
      ),
    ),
    "",
  ),
  /** Shown on the technician's stop: gate code, dog in the yard. */
  accessNotes: z._default(
    z
      .string()
      .check(
        z.trim(),
        z.maxLength(ACCESS_NOTES_MAX, `Access notes: at most ${ACCESS_NOTES_MAX} characters.`),
      ),
    "",
  ),
});
export type PropertyInput = z.infer<typeof propertySchema>;

export const M2_PER_FT2 = 0.09290304; // exact: 1 ft = 0.3048 m

export const zoneSchema = z.strictObject({
  name: text("Zone name", 120),
  area: z
    .number("Enter the area as a number.")
    .check(
      z.positive("Area must be above 0."),
      z.lte(10_000_000, "That area is too large for one zone."),
    ),
  areaUnit: z._default(z.enum(["ft2", "m2"]), "ft2"),
  grassSpecies: z.enum(grassSpeciesKeys, "Choose a grass species."),
  sunExposure: z.enum(["full_sun", "part_shade", "shade"], "Choose the sun exposure."),
  isIrrigated: z.boolean(),
  slope: z.enum(["flat", "moderate", "steep"], "Choose the slope."),
  sortOrder: z.optional(z.int().check(z.gte(0), z.lte(1000))),
});
export type ZoneInput = z.infer<typeof zoneSchema>;

/** Areas are stored in ft²; m² are converted on the way in (to 0.1 ft²). */
export function areaInFt2(area: number, unit: "ft2" | "m2"): number {
  const ft2 = unit === "m2" ? area / M2_PER_FT2 : area;
  return Math.round(ft2 * 10) / 10;
}

export const homeownerParams = z.object({ propertyId: z.uuid(), userId: z.uuid() });
