// The day's route as Today reads it: the stops in their stored order with each leg's distance and
// driving time, the totals, and the driving order Sward proposes.

export interface RouteLegDto {
  meters: number;
  seconds: number;
}

interface RouteStopDto {
  visitId: string;
  propertyName: string;
  /** The drive to this stop from the start (or the previous stop); null for the first stop of an open route. */
  leg: RouteLegDto | null;
}

export interface DayRouteDto {
  date: string;
  technicianId: string;
  /** Where the day starts and ends; null: an open route (no yard and no start point set). */
  start: { kind: "start_point" | "yard"; label: string } | null;
  /** The stops driven (called-off stops are left out), in their stored order. */
  stops: RouteStopDto[];
  /** The drive back to the start after the last stop; null on an open route. */
  returnLeg: RouteLegDto | null;
  total: RouteLegDto;
  /** True when the figures are great-circle estimates rather than the routing service's roads. */
  estimated: boolean;
  /** Why they are estimates, in plain words. */
  estimateReason: string | null;
  /** The order Sward proposes: stops already started or finished first as they are, then the rest. */
  proposed: { visitIds: string[]; total: RouteLegDto };
  /** The stored order drives no longer than the proposal. */
  inDrivingOrder: boolean;
}
