// Rate units of an application (no zod here: client components import it).
export const RATE_UNITS = [
  "lb/1000ft2",
  "oz/1000ft2",
  "floz/1000ft2",
  "gal/1000ft2",
  "kg/ha",
  "g/m2",
  "lb/acre",
  "L/ha",
] as const;

export const RATE_UNIT_LABEL: Record<(typeof RATE_UNITS)[number], string> = {
  "lb/1000ft2": "lb / 1,000 ft²",
  "oz/1000ft2": "oz / 1,000 ft²",
  "floz/1000ft2": "fl oz / 1,000 ft²",
  "gal/1000ft2": "gal / 1,000 ft²",
  "kg/ha": "kg / ha",
  "g/m2": "g / m²",
  "lb/acre": "lb / acre",
  "L/ha": "L / ha",
};
