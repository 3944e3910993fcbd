// The day's route in figures: how long lib/routing/order.ts takes to order 25 stops (p50 and p95
// over many days, budget < 50 ms), and how far its order is from the best one found by exhaustive
// search on 9-stop days (every one of the 9! = 362,880 orders tried; budget: within 10 %).
// `npm run bench` runs it on days drawn from the benchmark book's properties; `npm run
// bench:routing` alone on days drawn around a town (seeded, no database).
import { estimatedMatrix, type LatLng } from "@/lib/routing/great-circle";
import { planRoute, type RouteProblem } from "@/lib/routing/order";

import { exhaustiveBestRoute, randomStops } from "../helpers/exhaustive-route";
import { seededRandom } from "../helpers/seeded-random";

export interface RoutingFigures {
  ordering25: { days: number; p50Ms: number; p95Ms: number; maxMs: number };
  gap9: {
    days: number;
    meanPct: number;
    maxPct: number;
    optimal: number;
    heuristicSeconds: number;
    bestSeconds: number;
  };
}

const quantile = (sorted: number[], q: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!;

/** A day from the yard (its first point) through the other points and back, over driving times. */
function dayProblem(points: readonly LatLng[]): RouteProblem {
  return {
    cost: estimatedMatrix(points).seconds,
    stops: points.map((_, i) => i).slice(1),
    start: 0,
    end: 0,
  };
}

/** Each day: the yard first, then its stops. */
export function routingFigures(days25: LatLng[][], days9: LatLng[][]): RoutingFigures {
  const problems = days25.map(dayProblem);
  for (const p of problems.slice(0, 5)) planRoute(p); // warm the JIT
  const times: number[] = [];
  for (const p of problems) {
    const t0 = performance.now();
    planRoute(p);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);

  let heuristicSeconds = 0;
  let bestSeconds = 0;
  let maxPct = 0;
  let optimal = 0;
  const gaps: number[] = [];
  for (const points of days9) {
    const p = dayProblem(points);
    const ours = planRoute(p).cost;
    const best = exhaustiveBestRoute(p).cost;
    const gap = best > 0 ? (ours / best - 1) * 100 : 0;
    gaps.push(gap);
    maxPct = Math.max(maxPct, gap);
    if (gap < 1e-9) optimal++;
    heuristicSeconds += ours;
    bestSeconds += best;
  }
  return {
    ordering25: {
      days: times.length,
      p50Ms: quantile(times, 0.5),
      p95Ms: quantile(times, 0.95),
      maxMs: times.at(-1)!,
    },
    gap9: {
      days: days9.length,
      meanPct: gaps.reduce((a, b) => a + b, 0) / Math.max(1, gaps.length),
      maxPct,
      optimal,
      heuristicSeconds,
      bestSeconds,
    },
  };
}

/** Days of `size` stops plus a yard, drawn from `pool` (seeded) or, without one, around a town. */
export function drawDays(
  count: number,
  size: number,
  seed: number,
  pool?: readonly LatLng[],
): LatLng[][] {
  const random = seededRandom(seed);
  return Array.from({ length: count }, () => {
    if (!pool || pool.length < size + 1) return randomStops(random, size + 1, undefined, 15);
    const picked = new Set<number>();
    while (picked.size < size + 1) picked.add(Math.floor(random() * pool.length));
    return [...picked].map((i) => pool[i]!);
  });
}

export function printRoutingFigures(f: RoutingFigures): string[] {
  return [
    `route ordering, 25 stops: p50 ${f.ordering25.p50Ms.toFixed(2)} ms, p95 ${f.ordering25.p95Ms.toFixed(2)} ms, max ${f.ordering25.maxMs.toFixed(2)} ms over ${f.ordering25.days} days (budget p50 < 50 ms)`,
    `route vs exhaustive best, 9 stops: ours ${(f.gap9.heuristicSeconds / 60).toFixed(1)} min, best ${(f.gap9.bestSeconds / 60).toFixed(1)} min of driving over ${f.gap9.days} days; mean gap ${f.gap9.meanPct.toFixed(2)} %, worst ${f.gap9.maxPct.toFixed(2)} %, optimal on ${f.gap9.optimal} of ${f.gap9.days} (budget ≤ 10 %)`,
  ];
}

if (process.argv[1]?.endsWith("routing.bench.ts")) {
  const figures = routingFigures(drawDays(200, 25, 25), drawDays(30, 9, 9));
  for (const line of printRoutingFigures(figures)) console.log(line);
  console.log(JSON.stringify(figures));
}
