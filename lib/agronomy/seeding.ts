// Seeding (pure): seed rates per species for a new seeding and for overseeding, the seed to load
// for a zone's area, the seeding window read from soil temperature, and the conflict between a
// pre-emergence herbicide and seeding the same zone.
//
// Rates, lb of seed per 1,000 ft² (pure live seed as the table gives it; a seed label's rate
// comes first):
// - New seeding, cool-season: Cornell University, "Safe Sports Fields — Seeding rates" (Cornell
//   Turfgrass, sports field management pages), table "Seed or Seed Mixture / % Weight / Seed Rate
//   lbs./1,000 sq. ft.": Kentucky bluegrass 100 % 1–3, perennial ryegrass 100 % 4–6, tall fescue
//   100 % 6–8. Fine fescue 4–5 is from memory of extension lawn tables (the Cornell table has no
//   fine fescue row).
// - New seeding, warm-season: from memory of Southern extension lawn tables (hulled
//   bermudagrass 1–2, zoysiagrass 1–2, centipedegrass ¼–½, bahiagrass 5–10); St. Augustinegrass is
//   established from sod, sprigs or plugs, not seed, so it has no rate.
// - Overseeding into an existing lawn: half the new-seeding rate — Nebraska Extension column
//   "Renovating lawns in the fall" (York News-Times, 24 Aug 2021): "The full seeding rate for
//   turf-type tall fescue is 6-8 lbs./1,000 sq.ft., and 2-3 lbs. for Kentucky bluegrass. When
//   overseeding into an existing lawn, the seeding rate can be cut in half."
//
// Seeding window by soil temperature (°F, the soil near the surface): cool-season seed germinates
// well at 50–65 °F, warm-season seed needs 65–70 °F and above (the ranges extension services give,
// e.g. NC State Extension as quoted in secondary sources; from memory where not quoted). Below
// the lower figure germination stalls; cool-season seed still germinates above 65 °F (Beard,
// Turfgrass: Science and Culture, 1973, optimum alternating temperatures 59–86 °F for Kentucky
// bluegrass and 68–86 °F for tall fescue and perennial ryegrass, as tabled by Purdue Turfgrass
// Science, "Turf 101: optimum temperatures for seed germination"), but seedlings then face heat
// and summer annual weeds.
import type { GrassSpecies } from "@/lib/reference/grass-species";

import type { RuleFinding } from "./rules";

export interface SeedRate {
  /** lb of seed per 1,000 ft², lowest and highest of the table's range. */
  min: number;
  max: number;
}

export interface SpeciesSeeding {
  newSeeding: SeedRate;
  overseeding: SeedRate;
  source: string;
}

const CORNELL =
  "Cornell University, Safe Sports Fields: seeding rates table (lb/1,000 sq. ft.); overseeding at half the rate: Nebraska Extension (2021)";
const MEMORY_COOL =
  "From memory of extension lawn tables (not in the Cornell table); overseeding at half the rate: Nebraska Extension (2021)";
const MEMORY_WARM =
  "From memory of Southern extension lawn tables; overseeding at half the rate: Nebraska Extension (2021)";

const half = (r: SeedRate): SeedRate => ({ min: r.min / 2, max: r.max / 2 });
const row = (min: number, max: number, source: string): SpeciesSeeding => ({
  newSeeding: { min, max },
  overseeding: half({ min, max }),
  source,
});

/** Seed rates by the species keys of lib/reference/grass-species.ts (no entry: not seeded). */
const SEEDING_RATES: Readonly<Record<string, SpeciesSeeding>> = {
  kentucky_bluegrass: row(1, 3, CORNELL),
  perennial_ryegrass: row(4, 6, CORNELL),
  tall_fescue: row(6, 8, CORNELL),
  fine_fescue: row(4, 5, MEMORY_COOL),
  bermudagrass: row(1, 2, MEMORY_WARM),
  zoysiagrass: row(1, 2, MEMORY_WARM),
  centipedegrass: row(0.25, 0.5, MEMORY_WARM),
  bahiagrass: row(5, 10, MEMORY_WARM),
};

export type SeedingKind = "new" | "overseed";

/** The species' rate for the kind of seeding, or null when the species is not grown from seed. */
export function seedRate(speciesKey: string, kind: SeedingKind): SeedRate | null {
  const r = SEEDING_RATES[speciesKey];
  if (!r) return null;
  return kind === "new" ? r.newSeeding : r.overseeding;
}

/** lb of seed to load for an area at a rate in lb/1,000 ft²: rate × area / 1,000. */
export function seedToLoadLb(rateLbPer1000: number, areaFt2: number): number {
  if (!(rateLbPer1000 >= 0) || !(areaFt2 >= 0)) throw new RangeError("rate and area must be ≥ 0");
  return (rateLbPer1000 * areaFt2) / 1000;
}

export type RateReading = "below" | "within" | "above";

/** A recorded seed rate against the table's range for the kind of seeding. */
export function readSeedRate(rateLbPer1000: number, range: SeedRate): RateReading {
  if (rateLbPer1000 < range.min - 1e-9) return "below";
  if (rateLbPer1000 > range.max + 1e-9) return "above";
  return "within";
}

/** Soil temperatures (°F) of a seeding window by turf season. */
export const GERMINATION_SOIL_F: Readonly<
  Record<GrassSpecies["season"], { min: number; max: number }>
> = {
  cool: { min: 50, max: 65 },
  warm: { min: 65, max: 70 },
};

export type SeedingWindow = "too_cold" | "good" | "warm";

/**
 * The seeding window on a soil temperature: too cold below the season's lower figure, good
 * within its range, "warm" above it (cool-season seed still germinates, warm-season seed best).
 */
export function seedingWindow(soilTempF: number, season: GrassSpecies["season"]): SeedingWindow {
  const t = GERMINATION_SOIL_F[season];
  if (soilTempF < t.min) return "too_cold";
  if (season === "warm" || soilTempF <= t.max) return "good";
  return "warm";
}

// ---------------------------------------------------------------------------------------------
// Pre-emergence herbicides and seeding.
//
// Most pre-emergence herbicides stop seedlings of turfgrass as they stop crabgrass, so labels ask
// for weeks to months between the application and seeding. Typical intervals (the product label
// decides; these are shown only when a product's label interval was not entered):
// - prodiamine 16 weeks, pendimethalin 10 weeks, dithiopyr 11 weeks: the intervals needed before
//   slit seeding Kentucky bluegrass ("approximately 11, 10, and 16 wk" for dithiopyr,
//   pendimethalin and prodiamine; broadcast seeding "about 6, 8, and 14 wk"), "Preemergence
//   herbicide and seeding method effects on seedling growth of Kentucky bluegrass", Weed
//   Technology 19(1), 2005. Slit seeding is the longer and is how overseeding is usually done.
// - siduron: the one older pre-emergence labelled for use at seeding of cool-season grasses
//   (0 days; not on bermudagrass); mesotrione: labeled at seeding of many cool-season grasses
//   (0 days) — both per the product label, from memory of their labels.
// - any other active: no typical value; the label's interval must be entered on the product.
// The same interval is read after seeding (a pre-emergence on a zone seeded within it stops the
// seedlings): labels say not to apply until new turf is established, mowed several times — the
// interval is a stand-in for that, per the product label.

export const PRE_EMERGENCE_ACTIVES = [
  "prodiamine",
  "dithiopyr",
  "pendimethalin",
  "siduron",
  "mesotrione",
  "other",
] as const;
export type PreEmergenceActive = (typeof PRE_EMERGENCE_ACTIVES)[number];

const WEED_TECH_2005 =
  "Weed Technology 19(1), 2005: Preemergence herbicide and seeding method effects on seedling growth of Kentucky bluegrass (slit seeding)";

/** Typical days between the active and seeding, and where the figure is from. */
const TYPICAL_SEEDING_INTERVAL: Readonly<
  Record<PreEmergenceActive, { days: number | null; source: string }>
> = {
  prodiamine: { days: 112, source: WEED_TECH_2005 },
  pendimethalin: { days: 70, source: WEED_TECH_2005 },
  dithiopyr: { days: 77, source: WEED_TECH_2005 },
  siduron: { days: 0, source: "Per the product label (labeled at seeding; from memory)" },
  mesotrione: { days: 0, source: "Per the product label (labeled at seeding; from memory)" },
  other: { days: null, source: "Per the product label" },
};

export interface PreEmergenceProduct {
  active: PreEmergenceActive;
  /** The label's interval between this product and seeding (days), when entered. */
  labelIntervalDays: number | null;
}

/** The interval that applies and whether it is the label's own: null when nothing is known. */
export function seedingInterval(
  p: PreEmergenceProduct,
): { days: number; fromLabel: boolean; source: string } | null {
  if (p.labelIntervalDays !== null)
    return { days: p.labelIntervalDays, fromLabel: true, source: "Product label" };
  const t = TYPICAL_SEEDING_INTERVAL[p.active];
  return t.days === null ? null : { days: t.days, fromLabel: false, source: t.source };
}

export interface ZoneTreatment {
  date: string; // YYYY-MM-DD
  productName: string;
  /** Set for a pre-emergence herbicide. */
  preEmergence: PreEmergenceProduct | null;
  /** Set for a seed product: the species key. */
  seedSpecies: string | null;
}

export interface SeedingConflict {
  seeding: { date: string; productName: string };
  preEmergence: { date: string; productName: string; active: PreEmergenceActive };
  /** Seeding date − pre-emergence date: positive when the seed went down after. */
  daysApart: number;
  intervalDays: number;
  intervalFromLabel: boolean;
  source: string;
}

const DAY_MS = 86_400_000;
const dayDiff = (from: string, to: string) =>
  Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS);

/**
 * Every pair of a seeding and a pre-emergence herbicide on one zone closer than the herbicide's
 * interval (either order). A product that is both (seed with a pre-emergence in the bag) is not
 * paired with itself. An active with no known interval and none entered is paired at any
 * distance under 365 days: Sward cannot tell it is safe.
 */
export function seedingConflicts(treatments: ZoneTreatment[]): SeedingConflict[] {
  const seedings = treatments.filter((t) => t.seedSpecies !== null);
  const pres = treatments.filter((t) => t.preEmergence !== null);
  const out: SeedingConflict[] = [];
  for (const s of seedings)
    for (const p of pres) {
      if (p === s) continue;
      const interval = seedingInterval(p.preEmergence!);
      const days = dayDiff(p.date, s.date);
      const limit = interval?.days ?? 365;
      if (Math.abs(days) >= limit || limit === 0) continue;
      out.push({
        seeding: { date: s.date, productName: s.productName },
        preEmergence: { date: p.date, productName: p.productName, active: p.preEmergence!.active },
        daysApart: days,
        intervalDays: limit,
        intervalFromLabel: interval?.fromLabel ?? false,
        source: interval?.source ?? "Per the product label (no interval entered)",
      });
    }
  return out.sort((a, b) => Math.abs(a.daysApart) - Math.abs(b.daysApart));
}

/**
 * The soil temperature near the surface estimated from the air: the mean of the last 5 days'
 * mean air temperatures, (Tmax + Tmin)/2 (common practice — the top inch of a lawn's soil
 * follows the air's daily mean within a few degrees over several days; no published source, so
 * the screen calls it an estimate and a soil thermometer comes first). Null with fewer than 5.
 */
export function soilTempEstimateF(days: { tmaxF: number; tminF: number }[]): number | null {
  const last = days.slice(-5);
  if (last.length < 5) return null;
  return last.reduce((s, d) => s + (d.tmaxF + d.tminF) / 2, 0) / last.length;
}

/** Species keys a seed product may name: those with a seed rate. */
export const SEED_SPECIES_KEYS = Object.keys(SEEDING_RATES) as [string, ...string[]];

const fmtLb = (x: number) => String(Math.round(x * 100) / 100);
const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

export interface SeedingCheckInput {
  /** This application: its day, product and rate in lb of product per 1,000 ft². */
  application: ZoneTreatment & { productLbPer1000: number };
  /** The zone's other applications (any product) with what their products are. */
  others: ZoneTreatment[];
  zone: { speciesKey: string; areaFt2: number };
  /** First establishment (a new seeding) rather than overseeding an existing lawn. */
  isEstablishing: boolean;
  /** Dates as people read them (lib/dates.ts formatDate with the company's locale). */
  formatDate: (iso: string) => string;
}

/**
 * What the application form and the record say of a seed or pre-emergence application: the
 * conflict with a seeding or pre-emergence on the zone within the interval (a warning with the
 * other's date and product), and a seed rate outside the table's range for the zone's species.
 * Warnings only: the product label decides, and Sward defers to it.
 */
export function seedingFindings(i: SeedingCheckInput): RuleFinding[] {
  const a = i.application;
  if (a.seedSpecies === null && a.preEmergence === null) return [];
  const findings: RuleFinding[] = [];
  const conflicts = seedingConflicts([a, ...i.others]).filter(
    (c) =>
      (a.seedSpecies !== null &&
        c.seeding.date === a.date &&
        c.seeding.productName === a.productName) ||
      (a.preEmergence !== null &&
        c.preEmergence.date === a.date &&
        c.preEmergence.productName === a.productName),
  );
  const c = conflicts[0];
  if (c) {
    const isSeeding = a.seedSpecies !== null;
    const other = isSeeding ? c.preEmergence : c.seeding;
    const days = Math.abs(c.daysApart);
    const when =
      days === 0
        ? "the same day"
        : `${plural(days, "day")} ${(isSeeding ? c.daysApart > 0 : c.daysApart < 0) ? "before" : "after"} this`;
    const interval = c.intervalFromLabel
      ? `the label asks for ${plural(c.intervalDays, "day")} between it and seeding`
      : `about ${plural(c.intervalDays, "day")} between it and seeding is typical for ${c.preEmergence.active} (${c.source}); the product label decides`;
    findings.push({
      key: "seeding_conflict",
      severity: "warning",
      basis: "label",
      source: c.intervalFromLabel ? `Product label: ${c.preEmergence.productName}` : c.source,
      value: `${other.productName} on ${other.date}`,
      limit: c.intervalDays,
      message: isSeeding
        ? `Pre-emergence herbicide ${other.productName} was applied to this zone on ${i.formatDate(other.date)}, ${when}: ${interval}. The seed may not come up; follow the product label.`
        : `This zone was seeded with ${other.productName} on ${i.formatDate(other.date)}, ${when}: this pre-emergence herbicide can stop the seedlings — ${interval}. Follow the product label.`,
    });
  }
  if (a.seedSpecies !== null) {
    const kind: SeedingKind = i.isEstablishing ? "new" : "overseed";
    const species = a.seedSpecies;
    const range = seedRate(species, kind);
    if (range) {
      const reading = readSeedRate(a.productLbPer1000, range);
      if (reading !== "within")
        findings.push({
          key: "seed_rate",
          severity: "warning",
          basis: "species",
          source: SEEDING_RATES[species]!.source,
          value: Math.round(a.productLbPer1000 * 100) / 100,
          limit: `${fmtLb(range.min)}–${fmtLb(range.max)}`,
          message: `${fmtLb(a.productLbPer1000)} lb of seed per 1,000 ft² is ${reading} the ${fmtLb(range.min)}–${fmtLb(range.max)} lb usual for ${kind === "new" ? "a new seeding" : "overseeding"} of this species (${fmtLb(seedToLoadLb(range.min, i.zone.areaFt2))}–${fmtLb(seedToLoadLb(range.max, i.zone.areaFt2))} lb for the zone's ${i.zone.areaFt2.toLocaleString("en-US")} ft²). Follow the seed label.`,
        });
    }
  }
  return findings;
}
