// A property's season plan (pure): each round's window in a given year and, for each zone, the
// nitrogen of each round and the product to load for the zone's area. The computations are the
// agronomy cores' (growth-potential.ts, n-spread.ts, nutrients.ts); this file only puts a
// program, a property's zones, its rule set, its products and the monthly normals together.
//
// - A round's window: its dates in that year, or from a trigger the first day the normals reach
//   it (expectedTriggerDay) and the days it stays open. °F settings are read in °C (GDD on a °F
//   base: °C·days = °F·days × 5/9).
// - The per-application cap of a zone's round: the rule set's maximum lb N per application and
//   the label's maximum rate of the zone's product in N, the lower. The yearly limit: the label's
//   yearly maximum in N (a rule set has none of its own).
// - A zone left out for the year gets nothing; a zone's method picks the round's granular or
//   liquid product and target.
import { expectedTriggerDay, type MonthlyMeansC } from "@/lib/agronomy/growth-potential";
import { spreadNitrogen, yearlyNTarget, type RoundTarget } from "@/lib/agronomy/n-spread";
import {
  productForArea,
  productLbPer1000,
  rateForNitrogen,
  type ProductAnalysis,
  type RateUnit,
} from "@/lib/agronomy/nutrients";
import { addDays, type IsoDate } from "@/lib/dates";
import { findGrassSpecies } from "@/lib/reference/grass-species";

import type { PlanReason, ProgramMethodDto, ProgramRoundDto, ZonePlan, ZoneRoundPlan } from "./dto";

export interface PlanProduct extends ProductAnalysis {
  id: string;
  name: string;
  labelMaxRate: number | null;
  labelMaxYearly: number | null;
  labelRateUnit: RateUnit | null;
}

export interface PlanZone {
  id: string;
  name: string;
  areaFt2: number;
  species: string;
  sun: "full_sun" | "part_shade" | "shade";
  irrigated: boolean;
  method: "granular" | "liquid";
  excluded: { year: number; reason: string } | null;
}

export interface PlanInput {
  year: number;
  grassSeason: "cool" | "warm";
  rounds: readonly ProgramRoundDto[];
  /** Monthly mean air temperatures, °C; null when the weather service could not give them. */
  normals: MonthlyMeansC | null;
  ruleSet: { maxNLbPer1000: number | null; proBlackout: readonly [string, string] | null } | null;
  zones: readonly PlanZone[];
  products: ReadonlyMap<string, PlanProduct>;
}

export interface RoundWindow {
  position: number;
  start: IsoDate | null;
  end: IsoDate | null;
  /** True when the window comes from a trigger read on the normals (an estimate). */
  estimated: boolean;
}

const f2c = (f: number) => ((f - 32) * 5) / 9;

function roundWindows(
  year: number,
  rounds: readonly ProgramRoundDto[],
  normals: MonthlyMeansC | null,
): RoundWindow[] {
  return rounds.map((r) => {
    if (r.window.kind === "dates")
      return {
        position: r.position,
        start: `${year}-${r.window.startMd}`,
        end: `${year}-${r.window.endMd}`,
        estimated: false,
      };
    if (!normals) return { position: r.position, start: null, end: null, estimated: true };
    const w = r.window;
    const start = expectedTriggerDay(
      year,
      normals,
      w.kind === "gdd"
        ? { kind: "gdd", baseC: f2c(w.baseF), threshold: (w.value * 5) / 9 }
        : { kind: "temperature", thresholdC: f2c(w.value) },
    );
    if (!start) return { position: r.position, start: null, end: null, estimated: true };
    const end = addDays(start, w.days - 1);
    return {
      position: r.position,
      start,
      end: end.startsWith(String(year)) ? end : `${year}-12-31`,
      estimated: true,
    };
  });
}

/** lb of product per 1,000 ft² in one label unit (null when the unit cannot be read for this product). */
function lbPerLabelUnit(p: PlanProduct): number | null {
  if (!p.labelRateUnit) return null;
  try {
    return productLbPer1000(p, { amount: 1, unit: p.labelRateUnit });
  } catch {
    return null;
  }
}

function minOrNull(...xs: (number | null)[]): number | null {
  const known = xs.filter((x): x is number => x !== null);
  return known.length ? Math.min(...known) : null;
}

export function planZones(input: PlanInput): { windows: RoundWindow[]; zones: ZonePlan[] } {
  const windows = roundWindows(input.year, input.rounds, input.normals);
  const zones = input.zones.map((zone): ZonePlan => {
    const species = findGrassSpecies(zone.species);
    const season = species?.season ?? input.grassSeason;
    const excluded = zone.excluded?.year === input.year ? zone.excluded : null;
    const methodOf = (r: ProgramRoundDto): ProgramMethodDto => r[zone.method];
    const productOf = (r: ProgramRoundDto) => {
      const id = methodOf(r).productId;
      return id ? (input.products.get(id) ?? null) : null;
    };
    // The caps of the zone's products: the rule set's per application, the labels' in N.
    let capLb = input.ruleSet?.maxNLbPer1000 ?? null;
    let yearlyLimitLb: number | null = null;
    for (const r of input.rounds) {
      const p = productOf(r);
      const unit = p ? lbPerLabelUnit(p) : null;
      if (!p || unit === null || p.nPct <= 0) continue;
      if (p.labelMaxRate !== null) capLb = minOrNull(capLb, (p.labelMaxRate * unit * p.nPct) / 100);
      if (p.labelMaxYearly !== null)
        yearlyLimitLb = minOrNull(yearlyLimitLb, (p.labelMaxYearly * unit * p.nPct) / 100);
    }
    const yearly = species
      ? yearlyNTarget({
          annualNitrogenLb: species.annualNitrogenLb,
          sun: zone.sun,
          irrigated: zone.irrigated,
          yearlyLimitLb,
        }).lb
      : 0;

    const placeable = input.rounds.filter((_, i) => windows[i]!.start && windows[i]!.end);
    const targetOf = (r: ProgramRoundDto): RoundTarget => {
      const m = methodOf(r);
      if (m.target === "none" || !productOf(r) || productOf(r)!.nPct <= 0) return { kind: "none" };
      if (m.target === "lb") return { kind: "lb", lb: m.nLb ?? 0 };
      return { kind: "growth_potential" };
    };
    const spread =
      !excluded && input.normals
        ? spreadNitrogen({
            season,
            normals: input.normals,
            yearlyTargetLb: yearly,
            perApplicationMaxLb: capLb,
            noFertilizerWindow: input.ruleSet?.proBlackout ?? null,
            rounds: placeable.map((r) => {
              const w = windows[input.rounds.indexOf(r)]!;
              return { key: String(r.position), start: w.start!, end: w.end!, target: targetOf(r) };
            }),
          })
        : null;

    const rounds = input.rounds.map((r, i): ZoneRoundPlan => {
      const product = productOf(r);
      const base = {
        position: r.position,
        product: product ? { id: product.id, name: product.name } : null,
      };
      const none = (reason: PlanReason): ZoneRoundPlan => ({
        ...base,
        nLb: 0,
        gp: null,
        reason,
        allowed: null,
        rate: null,
        load: null,
      });
      if (excluded) return none("excluded");
      if (!windows[i]!.start) return none(input.normals ? "no_window" : "no_weather");
      const planned = spread?.rounds.find((p) => p.key === String(r.position));
      if (!planned) {
        // Without the normals a fixed target still stands (its window is dates).
        const t = targetOf(r);
        if (t.kind !== "lb") return none(t.kind === "none" ? "no_nitrogen" : "no_weather");
        const nLb = capLb !== null ? Math.min(t.lb, capLb) : t.lb;
        return withLoad(
          { ...none("fixed"), nLb, reason: nLb < t.lb ? "capped" : "fixed" },
          product,
          zone.areaFt2,
        );
      }
      return withLoad(
        { ...none(planned.reason), nLb: planned.nLb, gp: planned.gp, allowed: planned.allowed },
        product,
        zone.areaFt2,
      );
    });
    const totalLb = rounds.reduce((s, r) => s + r.nLb, 0);
    return {
      zoneId: zone.id,
      zoneName: zone.name,
      areaFt2: zone.areaFt2,
      method: zone.method,
      excluded,
      yearlyTargetLb: excluded ? 0 : yearly,
      capLb,
      totalLb,
      unplacedLb: spread?.unplacedLb ?? 0,
      rounds,
    };
  });
  return { windows, zones };
}

function withLoad(
  plan: ZoneRoundPlan,
  product: PlanProduct | null,
  areaFt2: number,
): ZoneRoundPlan {
  if (!product || plan.nLb <= 0 || product.nPct <= 0) return plan;
  const rate = rateForNitrogen(product, plan.nLb);
  return { ...plan, rate, load: productForArea(product, rate, areaFt2) };
}
