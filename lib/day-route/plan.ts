// The day's route worked out (pure): the legs of the stored order, and the driving order proposed
// by lib/routing/order.ts over the matrix of driving times. Stops already started or finished stay
// first, as they were driven; the stops still to do are ordered from the last of them (or from the
// start point) and back to the start point. Without a yard or start point the route is open.
import type { LatLng, TravelMatrix } from "@/lib/routing/great-circle";
import { planRoute } from "@/lib/routing/order";

import type { DayRouteDto, RouteLegDto } from "./dto";

export interface DayStop extends LatLng {
  visitId: string;
  propertyName: string;
  /** Only "scheduled" stops are reordered; the others stay first, as they were driven. */
  started: boolean;
}

export interface Depot extends LatLng {
  kind: "start_point" | "yard";
  label: string;
}

/** The points of the matrix: the depot first when there is one, then the stops. */
export function routePoints(stops: readonly DayStop[], depot: Depot | null): LatLng[] {
  const at = (p: LatLng) => ({ latitude: p.latitude, longitude: p.longitude });
  return [...(depot ? [at(depot)] : []), ...stops.map(at)];
}

type Computed = Omit<
  DayRouteDto,
  "date" | "technicianId" | "start" | "estimated" | "estimateReason"
>;

/** Legs, totals and the proposed order of `stops` (in stored order) over `matrix` (of routePoints). */
export function dayRoute(
  stops: readonly DayStop[],
  depot: Depot | null,
  matrix: TravelMatrix,
): Computed {
  const offset = depot ? 1 : 0;
  const depotIndex = depot ? 0 : null;
  const leg = (from: number, to: number): RouteLegDto => ({
    meters: matrix.meters[from]![to]!,
    seconds: matrix.seconds[from]![to]!,
  });
  /** Legs of an order of stop indices (into `stops`). */
  const legsOf = (order: readonly number[]) => {
    const legs = order.map((s, k) => {
      const from = k === 0 ? depotIndex : order[k - 1]! + offset;
      return from === null ? null : leg(from, s + offset);
    });
    const last = order.at(-1);
    const returnLeg =
      depotIndex !== null && last !== undefined ? leg(last + offset, depotIndex) : null;
    const total = [...legs, returnLeg].reduce<RouteLegDto>(
      (sum, l) => (l ? { meters: sum.meters + l.meters, seconds: sum.seconds + l.seconds } : sum),
      { meters: 0, seconds: 0 },
    );
    return { legs, returnLeg, total };
  };

  const stored = stops.map((_, i) => i);
  const current = legsOf(stored);

  const fixed = stored.filter((i) => stops[i]!.started);
  const movable = stored.filter((i) => !stops[i]!.started);
  const lastFixed = fixed.at(-1);
  const planned = planRoute({
    cost: matrix.seconds,
    stops: movable.map((i) => i + offset),
    start: lastFixed !== undefined ? lastFixed + offset : depotIndex,
    end: depotIndex,
  });
  const proposedOrder = [...fixed, ...planned.order.map((p) => p - offset)];
  const proposed = legsOf(proposedOrder);

  return {
    stops: stops.map((s, i) => ({
      visitId: s.visitId,
      propertyName: s.propertyName,
      leg: current.legs[i] ?? null,
    })),
    returnLeg: current.returnLeg,
    total: current.total,
    proposed: { visitIds: proposedOrder.map((i) => stops[i]!.visitId), total: proposed.total },
    // Half a second: the same drive priced in another order can differ by rounding only.
    inDrivingOrder: current.total.seconds <= proposed.total.seconds + 0.5,
  };
}
