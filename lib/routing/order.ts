// The order of a day's stops that drives least (pure): a travelling-salesman path over a matrix of
// travel costs (seconds or meters, any matrix, symmetric or not) that starts and ends at a depot —
// the company's yard or the technician's own start point — or is open at either end when there is
// none. An exact answer needs exponential time; a day has a few dozen stops at most, and these
// published heuristics come within a few percent of it in well under a millisecond a stop:
//
// 1. Nearest neighbour: from the start, always drive to the closest stop not yet visited
//    (D. J. Rosenkrantz, R. E. Stearns & P. M. Lewis, "An analysis of several heuristics for the
//    traveling salesman problem", SIAM Journal on Computing 6 (3), 1977, 563–581). With an open
//    start every stop is tried as the first and the cheapest path kept.
// 2. 2-opt: take out two links of the path and reconnect it the other way, which reverses the
//    stops between them, whenever that shortens it; repeat until no such exchange helps
//    (G. A. Croes, "A method for solving traveling-salesman problems", Operations Research 6 (6),
//    1958, 791–812; S. Lin, "Computer solutions of the traveling salesman problem", Bell System
//    Technical Journal 44 (10), 1965, 2245–2269, which names it 2-opt within the k-opt family).
// 3. Or-opt: move a run of one, two or three consecutive stops, as it is or reversed, to another
//    place in the path whenever that shortens it (I. Or, "Traveling salesman-type combinatorial
//    problems and their relation to the logistics of regional blood banking", PhD thesis,
//    Northwestern University, 1976) — a restricted 3-opt move, as in Lin 1965.
// Steps 2 and 3 repeat until neither finds an improvement. Each candidate path is priced whole
// (O(n) each), which keeps the code plain and stays correct for one-way (asymmetric) times; for
// 25 stops it still runs in about a millisecond (npm run bench).

export interface RouteProblem {
  /** cost[i][j]: the cost of driving from point i to point j (stops and depots alike). */
  cost: readonly (readonly number[])[];
  /** The points to visit, as indices into `cost`. */
  stops: readonly number[];
  /** Where the day starts (an index into `cost`), or null for an open start. */
  start: number | null;
  /** Where the day ends, or null for an open end (the route stops at the last stop). */
  end: number | null;
}

export interface PlannedRoute {
  /** The stops in driving order (indices into `cost`). */
  order: number[];
  /** The path's cost, start and end included. */
  cost: number;
}

/** Improvements smaller than this are rounding noise, not a shorter path. */
const EPSILON = 1e-9;

/** The cost of driving the stops in `order`, from `start` and back to `end` when they are set. */
export function pathCost(problem: RouteProblem, order: readonly number[]): number {
  const { cost, start, end } = problem;
  if (order.length === 0) return start !== null && end !== null ? cost[start]![end]! : 0;
  let total = start === null ? 0 : cost[start]![order[0]!]!;
  for (let k = 1; k < order.length; k++) total += cost[order[k - 1]!]![order[k]!]!;
  if (end !== null) total += cost[order[order.length - 1]!]![end]!;
  return total;
}

/** Nearest neighbour from `first` (or from the start when `first` is null). */
function nearestNeighbour(problem: RouteProblem, first: number | null): number[] {
  const left = new Set(problem.stops);
  const order: number[] = [];
  let at = problem.start;
  if (first !== null) {
    order.push(first);
    left.delete(first);
    at = first;
  }
  while (left.size > 0) {
    let best = -1;
    let bestCost = Infinity;
    for (const s of left) {
      // Ties go to the stop listed first, so the answer never depends on chance.
      const c = at === null ? 0 : problem.cost[at]![s]!;
      if (c < bestCost - EPSILON) {
        best = s;
        bestCost = c;
      }
    }
    order.push(best);
    left.delete(best);
    at = best;
  }
  return order;
}

/** One pass of 2-opt: the first reversal of order[i..j] that shortens the path, or null. */
function twoOptMove(problem: RouteProblem, order: number[], current: number): number[] | null {
  for (let i = 0; i < order.length - 1; i++) {
    for (let j = i + 1; j < order.length; j++) {
      const candidate = [
        ...order.slice(0, i),
        ...order.slice(i, j + 1).reverse(),
        ...order.slice(j + 1),
      ];
      if (pathCost(problem, candidate) < current - EPSILON) return candidate;
    }
  }
  return null;
}

/** One pass of Or-opt: the first move of a run of 1–3 stops (kept or reversed) that shortens the path. */
function orOptMove(problem: RouteProblem, order: number[], current: number): number[] | null {
  for (let length = 1; length <= 3; length++) {
    for (let i = 0; i + length <= order.length; i++) {
      const run = order.slice(i, i + length);
      const rest = [...order.slice(0, i), ...order.slice(i + length)];
      for (let at = 0; at <= rest.length; at++) {
        if (at === i) continue; // the run's own place
        for (const piece of length > 1 ? [run, [...run].reverse()] : [run]) {
          const candidate = [...rest.slice(0, at), ...piece, ...rest.slice(at)];
          if (pathCost(problem, candidate) < current - EPSILON) return candidate;
        }
      }
    }
  }
  return null;
}

/** Improves `order` by 2-opt and Or-opt moves until neither shortens it. */
function improveRoute(problem: RouteProblem, order: readonly number[]): PlannedRoute {
  let best = [...order];
  let cost = pathCost(problem, best);
  for (;;) {
    const next = twoOptMove(problem, best, cost) ?? orOptMove(problem, best, cost);
    if (!next) return { order: best, cost };
    best = next;
    cost = pathCost(problem, best);
  }
}

/** The driving order of `problem.stops`: nearest neighbour, then 2-opt and Or-opt. */
export function planRoute(problem: RouteProblem): PlannedRoute {
  if (problem.stops.length === 0) return { order: [], cost: pathCost(problem, []) };
  const starts = problem.start === null ? problem.stops : [null];
  let best: PlannedRoute | null = null;
  for (const first of starts) {
    const order = nearestNeighbour(problem, first);
    const cost = pathCost(problem, order);
    if (!best || cost < best.cost - EPSILON) best = { order, cost };
  }
  return improveRoute(problem, best!.order);
}

/** Nearest neighbour alone (the first step of planRoute), for the tests and the benchmark. */
export function nearestNeighbourRoute(problem: RouteProblem): PlannedRoute {
  const order = problem.stops.length ? nearestNeighbour(problem, null) : [];
  return { order, cost: pathCost(problem, order) };
}
