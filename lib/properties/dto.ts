// What property data leaves the server: camelCase, no internal columns.
import type { Slope, SunExposure } from "@/db/schema";
import { en } from "@/lib/i18n/messages/en";
import type { GrassSeason } from "@/lib/reference/grass-species";

export interface PropertySummaryDto {
  id: string;
  name: string;
  address: { street: string; city: string; region: string; postalCode: string };
  location: { latitude: number; longitude: number };
  timeZone: string;
  technician: { id: string; name: string } | null;
  ruleSet: { id: string; name: string } | null;
  zoneCount: number;
  lawnAreaFt2: number;
  isArchived: boolean;
}

export interface ZoneDto {
  id: string;
  name: string;
  areaFt2: number;
  grassSpecies: { key: string; name: string; season: GrassSeason | null };
  sunExposure: SunExposure;
  isIrrigated: boolean;
  slope: Slope;
}

export interface PropertyDetailDto extends PropertySummaryDto {
  zones: ZoneDto[];
  /** Staff only; empty for a homeowner. */
  homeowners: { id: string; name: string; email: string }[];
  /** Office notes; staff only, empty for a homeowner. */
  notes: string;
  /** E.164 (+16095550142); staff only, null for a homeowner. */
  customerPhone: string | null;
  /** Gate code, dog in the yard; staff only, empty for a homeowner. */
  accessNotes: string;
}

export const SUN_EXPOSURE_LABEL: Record<SunExposure, string> = en.terms.sunExposure;

export const SLOPE_LABEL: Record<Slope, string> = en.terms.slope;

/** One place the geocoder matched for an address (lib/services/geocoder/contract.ts). */
export interface AddressMatchDto {
  /** As the service matched it, e.g. "14 QUILLWORT LN, LARKFIELD, NJ, 08561". */
  matchedAddress: string;
  latitude: number;
  longitude: number;
  state: string | null;
  zip: string | null;
}

/** GET /api/v1/geocode: proposals the manager confirms on the property form. */
export type GeocodeResult =
  | { status: "found"; address: string; matches: AddressMatchDto[] }
  | { status: "no_match"; address: string; matches: []; message: string }
  | { status: "unavailable"; address: string; matches: []; message: string };
