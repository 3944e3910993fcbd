// Photo data as it leaves the server. GPS and capture time are staff-only evidence.
import type { Lighting } from "@/lib/photo-analysis/color";

export interface PhotoDto {
  id: string;
  visitId: string;
  zoneId: string;
  zoneCheckId: string;
  visitedOn: string;
  /** Green canopy cover, % of the frame (Patrignani & Ochsner 2015 pixel rule). */
  greenCoverPct: number;
  /** Mean DGCI over the canopy pixels (Karcher & Richardson 2003). */
  dgci: number | null;
  /** "ok", or why the figures are shown with a caution and left out of the Index. */
  lighting: Lighting;
  /** Shares of pixels too dark to read and clipped, %. */
  darkPct: number;
  clippedPct: number;
  /** False while the figures still come from the retired hue window (awaiting a remeasure). */
  measuredByCanopyRule: boolean;
  width: number;
  height: number;
  displayUrl: string;
  thumbUrl: string;
  /** Who took it (staff only): they may delete it while the visit is open. */
  uploadedById: string | null;
  /** Staff only (null for homeowners). */
  capturedLocal: string | null;
  gps: { latitude: number; longitude: number } | null;
}
