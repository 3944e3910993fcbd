// Rate units of an application and the override categories (no zod here: client components
// import it).
import { RATE_UNITS } from "@/lib/agronomy/nutrients";
import { en } from "@/lib/i18n/messages/en";

export { RATE_UNITS };

export const RATE_UNIT_LABEL: Record<(typeof RATE_UNITS)[number], string> = en.terms.rateUnits;

/** Units a product can be measured in: a liquid by volume only; a dry product by weight, or by volume when its density is known. */
export function rateUnitsFor(product: {
  form: "granular" | "liquid" | "soluble";
  densityLbPerGal: number | null;
}): (typeof RATE_UNITS)[number][] {
  const byVolume = (u: string) => u === "floz/1000ft2" || u === "gal/1000ft2" || u === "L/ha";
  if (product.form === "liquid") return RATE_UNITS.filter(byVolume);
  return RATE_UNITS.filter((u) => !byVolume(u) || product.densityLbPerGal !== null);
}

/** Why a manager records an application a state rule refuses (a label refusal has no override). */
export const OVERRIDE_CATEGORIES = [
  "documented_exemption",
  "research_plot",
  "regulator_permission",
  "other",
] as const;
export type OverrideCategory = (typeof OVERRIDE_CATEGORIES)[number];

export const OVERRIDE_CATEGORY_LABEL: Record<OverrideCategory, string> =
  en.terms.overrideCategories;
