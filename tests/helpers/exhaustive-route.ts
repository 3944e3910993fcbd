// The reference the routing heuristic is measured against: every order of the stops tried
// (n! of them — 362,880 for 9 stops), the cheapest kept. Exact, and only usable for a handful of
// stops; the unit test and the benchmark compare lib/routing/order.ts with it.
import { pathCost, type PlannedRoute, type RouteProblem } from "@/lib/routing/order";

export function exhaustiveBestRoute(problem: RouteProblem): PlannedRoute {
  const stops = [...problem.stops];
  let best: PlannedRoute = { order: stops, cost: pathCost(problem, stops) };
  const order: number[] = [];
  const used = new Array<boolean>(stops.length).fill(false);
  const visit = () => {
    if (order.length === stops.length) {
      const cost = pathCost(problem, order);
      if (cost < best.cost) best = { order: [...order], cost };
      return;
    }
    for (let k = 0; k < stops.length; k++) {
      if (used[k]) continue;
      used[k] = true;
      order.push(stops[k]!);
      visit();
      order.pop();
      used[k] = false;
    }
  };
  visit();
  return best;
}

/** Random points in a square of `sizeMiles` around a town (seeded), as latitude/longitude. */
export function randomStops(
  random: () => number,
  count: number,
  center = { latitude: 40.35, longitude: -74.66 },
  sizeMiles = 12,
): { latitude: number; longitude: number }[] {
  // 1° of latitude ≈ 69 mi; 1° of longitude ≈ 69 mi × cos(latitude).
  const dLat = sizeMiles / 69;
  const dLon = sizeMiles / (69 * Math.cos((center.latitude * Math.PI) / 180));
  return Array.from({ length: count }, () => ({
    latitude: center.latitude + (random() - 0.5) * dLat,
    longitude: center.longitude + (random() - 0.5) * dLon,
  }));
}
