// Pressure areas as the Alerts page, the map and the property page show them.
import type { AlertSeverity } from "@/db/schema";
import type { Evidence } from "@/lib/risk/rules";

export interface PressureSettingsDto {
  distanceMi: number;
  days: number;
  minProperties: number;
}

interface PressureAreaProperty {
  id: string;
  name: string;
  street: string;
  city: string;
  lat: number;
  lng: number;
  lastVisitOn: string | null;
  /** Has an alert of the area's kind among the area's alerts. */
  isMember: boolean;
  /** Inside the area, without a visit in the window (lib/pressure-areas/read.ts). */
  checkSoon: boolean;
}

export interface PressureAreaDto {
  key: string;
  kind: string;
  kindLabel: string;
  firstOn: string;
  latestOn: string;
  centre: { lat: number; lng: number };
  /** The drawn circle's radius (miles): the farthest member plus half the company's distance. */
  radiusMi: number;
  properties: PressureAreaProperty[];
  alerts: {
    id: string;
    propertyId: string;
    propertyName: string;
    severity: AlertSeverity;
    raisedOn: string;
    summary: string;
    evidence: Evidence;
  }[];
}

export interface PressureAreasView {
  today: string;
  since: string;
  settings: PressureSettingsDto;
  areas: PressureAreaDto[];
}
