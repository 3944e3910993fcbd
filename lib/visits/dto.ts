// Visit and zone-check data as it leaves the server.
import type { CancelKind, PlannedService, VisitStatus } from "@/db/schema";
import type { ApplicationDto } from "@/lib/applications/dto";
import type { PhotoDto } from "@/lib/photos/dto";
import type { ZoneDto } from "@/lib/properties/dto";
import type { WateringDto } from "@/lib/watering/dto";

import type { ZoneCheckInput } from "./schemas";

export type ZoneCheckValues = Omit<ZoneCheckInput, "baseVersion">;

export interface ZoneCheckDto extends ZoneCheckValues {
  id: string;
  visitId: string;
  /** The stored Sward Index (0–100), null until the zone is rated. */
  swardIndex: number | null;
  version: number;
  updatedAt: string;
  updatedBy: string | null;
}

export interface VisitSummaryDto {
  id: string;
  propertyId: string;
  propertyName: string;
  address: string;
  scheduledFor: string;
  stopOrder: number;
  plannedService: PlannedService;
  status: VisitStatus;
  technician: { id: string; name: string } | null;
  startedAt: string | null;
  completedAt: string | null;
  checkedZones: number;
  zoneCount: number;
  /** Zone checks saved on this visit, drafts included. */
  savedChecks: number;
  /** Set when the stop was called off as a whole (status "cancelled"). */
  outcome: StopOutcomeDto | null;
}

/** A canceled stop: rained out or canceled, why, by whom, and what replaced it. */
interface StopOutcomeDto {
  /** Null for a visit canceled before outcomes were kept. */
  kind: CancelKind | null;
  reason: string;
  at: string | null;
  by: string | null;
  /** Zone checks saved before the stop was called off: kept with the visit, not counted. */
  keptChecks: number;
  rescheduled: { visitId: string; scheduledFor: string } | null;
  /** The day offered for a new visit (lib/visits/next-free-day.ts), while not rescheduled. */
  nextFreeDay: string | null;
}

/** A zone's last check at an earlier finished visit, shown beside today's ratings. */
export interface LastZoneCheckDto {
  zoneId: string;
  visitId: string;
  visitedOn: string;
  checkedBy: string | null;
  status: ZoneCheckDto["status"];
  quality: number | null;
  color: number | null;
  density: number | null;
  uniformity: number | null;
  heightOfCutIn: number | null;
  notes: string;
  skipReason: ZoneCheckDto["skipReason"];
  photo: { thumbUrl: string; displayUrl: string; width: number; height: number } | null;
}

export interface VisitDetailDto extends VisitSummaryDto {
  notes: string;
  timeZone: string;
  ruleSetId: string | null;
  /** The visit day's weather as kept with the visit, or null before it starts. */
  weather:
    | {
        status: "ok";
        tmaxF: number;
        tminF: number;
        rhMinPct: number | null;
        rhMaxPct: number | null;
        windMph: number | null;
        precipIn: number;
        isForecast: boolean;
      }
    | { status: "unavailable"; message: string }
    | null;
  version: number;
  completedBy: string | null;
  zones: ZoneDto[];
  checks: ZoneCheckDto[];
  photos: PhotoDto[];
  applications: ApplicationDto[];
  /** Waterings recorded on this visit. */
  waterings: WateringDto[];
  /** The signed-in person: their own entries can be corrected and deleted while the visit is open. */
  viewerId: string;
  /** Each zone's last check at an earlier finished visit of the property (none: not listed). */
  lastChecks: LastZoneCheckDto[];
  /** Staff may edit: technicians until the visit is finished, managers always (audited). */
  canEdit: boolean;
}

export interface TodayStopDto extends VisitSummaryDto {
  lastVisitOn: string | null;
  concerns: string[];
  /** For the Directions link (lib/day-route/links.ts). */
  location: { latitude: number; longitude: number };
  /** E.164, for the Call link; null when the property has none. */
  customerPhone: string | null;
  /** Gate code, dog in the yard. */
  accessNotes: string;
}

export interface ZoneHistoryEntryDto {
  zoneCheckId: string;
  visitId: string;
  visitedOn: string;
  swardIndex: number | null;
  status: ZoneCheckDto["status"];
  quality: number | null;
  color: number | null;
  density: number | null;
  uniformity: number | null;
  barePct: number | null;
  weedsPct: number | null;
  heightOfCutIn: number | null;
  mowedToday: boolean | null;
  heightBeforeMowingIn: number | null;
  symptoms: ZoneCheckDto["symptoms"];
  skipReason: ZoneCheckDto["skipReason"];
  technician: string | null;
}

export interface AuditEventDto {
  id: string;
  at: string;
  actor: string | null;
  entity: string;
  entityId: string;
  action: string;
  changes: Record<string, { from: unknown; to: unknown }>;
  /** Why (every correction of a finished visit has one). */
  reason: string | null;
  zoneName: string | null;
  /** When, in words: "Dec 2, 2026, 3:05 PM" (the company's locale, the property's time zone). */
  when: string;
  /** The event as a sentence (lib/visits/audit-words.ts). */
  sentence: string;
}
