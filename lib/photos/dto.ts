// Photo data as it leaves the server. GPS and capture time are staff-only evidence.
export interface PhotoDto {
  id: string;
  visitId: string;
  zoneId: string;
  zoneCheckId: string;
  visitedOn: string;
  greenCoverPct: number;
  dgci: number | null;
  width: number;
  height: number;
  displayUrl: string;
  thumbUrl: string;
  /** Staff only (null for homeowners). */
  capturedLocal: string | null;
  gps: { latitude: number; longitude: number } | null;
}
