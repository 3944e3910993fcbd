// What a season program looks like to the screens and the API.
import type { ProgramRoundKind, ProgramTarget } from "@/db/schema";
import type { SpreadReason } from "@/lib/agronomy/n-spread";
import type { Rate } from "@/lib/agronomy/nutrients";
import type { IsoDate } from "@/lib/dates";

export interface ProgramMethodDto {
  productId: string | null;
  target: ProgramTarget;
  /** lb N per 1,000 ft² when the target is "lb". */
  nLb: number | null;
}

export type ProgramWindowDto =
  | { kind: "dates"; startMd: string; endMd: string }
  | { kind: "gdd"; baseF: number; value: number; days: number }
  | { kind: "soil_temperature" | "air_temperature"; value: number; days: number };

export interface ProgramRoundDto {
  position: number;
  kind: ProgramRoundKind;
  window: ProgramWindowDto;
  granular: ProgramMethodDto;
  liquid: ProgramMethodDto;
}

export interface ProgramDto {
  id: string;
  name: string;
  grassSeason: "cool" | "warm";
  notes: string;
  rounds: ProgramRoundDto[];
  /** How many properties follow it. */
  propertyCount: number;
}

export interface ProgramPlanDto {
  propertyId: string;
  year: number;
  program: { id: string; name: string; grassSeason: "cool" | "warm" } | null;
  /** Why the growth-potential rounds could not be planned (the weather service), or null. */
  weatherProblem: string | null;
  normalsYears: [number, number] | null;
  ruleSetName: string | null;
  rounds: {
    position: number;
    kind: ProgramRoundKind;
    start: string | null;
    end: string | null;
    estimated: boolean;
    window: ProgramWindowDto;
  }[];
  zones: ZonePlan[];
}

export type PlanReason = SpreadReason | "no_window" | "no_weather" | "excluded";

export interface ZoneRoundPlan {
  position: number;
  nLb: number;
  gp: number | null;
  reason: PlanReason;
  allowed: { from: IsoDate; to: IsoDate } | null;
  product: { id: string; name: string } | null;
  rate: Rate | null;
  /** Product to load for the zone's area. */
  load: { lb: number; gal: number | null } | null;
}

export interface ZonePlan {
  zoneId: string;
  zoneName: string;
  areaFt2: number;
  method: "granular" | "liquid";
  excluded: { year: number; reason: string } | null;
  yearlyTargetLb: number;
  capLb: number | null;
  totalLb: number;
  unplacedLb: number;
  rounds: ZoneRoundPlan[];
}
