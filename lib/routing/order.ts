// The order of a day's stops that drives least (pure): a travelling-salesman path over a matrix of
// travel costs (seconds or meters, any matrix, symmetric or not) that starts and ends at a depot —
// the company's yard or the technician's own start point — or is open at either end when there is
// none. An exact answer needs exponential time; a day has a few dozen stops at most, and these
// published heuristics come within a few percent of it in milliseconds:
//
// 1. Nearest neighbour: from the start, always drive to the closest stop not yet visited
//    (D. J. Rosenkrantz, R. E. Stearns & P. M. Lewis, "An analysis of several heuristics for the
//    traveling salesman problem", SIAM Journal on Computing 6 (3), 1977, 563–581), once with each
//    of the eight stops nearest the start taken first ("repetitive" nearest neighbour, ibid.,
//    bounded); each path then goes through 2 and 3 and the cheapest result is kept.
// 2. 2-opt: take out two links of the path and reconnect it the other way, which reverses the
//    stops between them, whenever that shortens it; repeat until no such exchange helps
//    (G. A. Croes, "A method for solving traveling-salesman problems", Operations Research 6 (6),
//    1958, 791–812; S. Lin, "Computer solutions of the traveling salesman problem", Bell System
//    Technical Journal 44 (10), 1965, 2245–2269, which names it 2-opt within the k-opt family).
// 3. Or-opt: move a run of one, two or three consecutive stops, as it is or reversed, to another
//    place in the path whenever that shortens it (I. Or, "Traveling salesman-type combinatorial
//    problems and their relation to the logistics of regional blood banking", PhD thesis,
//    Northwestern University, 1976) — a restricted 3-opt move, as in Lin 1965.
// Steps 2 and 3 repeat until neither finds an improvement. A move is priced in constant time from
// running sums of the path's links driven forward and backward (class Path), which stays exact for
// one-way (asymmetric) times; `npm run bench` prints the time for 25 stops.

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

/**
 * The path as the moves see it: [start?, ...order, end?], with running sums of its links driven
 * forward (F) and backward (B), so that a move is priced in constant time however long the path is,
 * one-way costs included: the links between positions i and j cost F[j] − F[i] forward and
 * B[j] − B[i] when that stretch is driven reversed.
 */
class Path {
  readonly nodes: number[];
  readonly lo: number; // first movable position
  readonly hi: number; // last movable position
  readonly forward: number[];
  readonly backward: number[];

  constructor(
    readonly problem: RouteProblem,
    order: readonly number[],
  ) {
    const { start, end } = problem;
    this.nodes = [...(start !== null ? [start] : []), ...order, ...(end !== null ? [end] : [])];
    this.lo = start !== null ? 1 : 0;
    this.hi = this.nodes.length - 1 - (end !== null ? 1 : 0);
    this.forward = [0];
    this.backward = [0];
    for (let m = 0; m + 1 < this.nodes.length; m++) {
      this.forward.push(this.forward[m]! + this.c(this.nodes[m]!, this.nodes[m + 1]!));
      this.backward.push(this.backward[m]! + this.c(this.nodes[m + 1]!, this.nodes[m]!));
    }
  }

  /** The cost of a link; nothing when either end is missing (an open start or end). */
  c(from: number | undefined, to: number | undefined): number {
    return from === undefined || to === undefined ? 0 : this.problem.cost[from]![to]!;
  }

  get cost(): number {
    return this.forward.at(-1)!;
  }

  get order(): number[] {
    return this.nodes.slice(this.lo, this.hi + 1);
  }

  /** 2-opt: the change in cost when positions i…j are driven in reverse. */
  reverseDelta(i: number, j: number): number {
    const n = this.nodes;
    const before = n[i - 1];
    const after = n[j + 1];
    return (
      this.c(before, n[j]) +
      (this.backward[j]! - this.backward[i]!) +
      this.c(n[i], after) -
      (this.c(before, n[i]) + (this.forward[j]! - this.forward[i]!) + this.c(n[j], after))
    );
  }

  /**
   * Or-opt: the change in cost when the run at positions i…i+length−1 (reversed or not) is taken
   * out and put between positions a and a+1 (a outside the run and not its own place).
   */
  moveDelta(i: number, length: number, a: number, reversed: boolean): number {
    const n = this.nodes;
    const last = i + length - 1;
    const prev = n[i - 1];
    const next = n[last + 1];
    const out = this.c(prev, n[i]) + this.c(n[last], next) - this.c(prev, next);
    const [head, tail] = reversed ? [n[last], n[i]] : [n[i], n[last]];
    const x = n[a];
    const y = n[a + 1];
    const inside = reversed
      ? this.backward[last]! - this.backward[i]! - (this.forward[last]! - this.forward[i]!)
      : 0;
    return this.c(x, head) + this.c(tail, y) - this.c(x, y) + inside - out;
  }

  reversed(i: number, j: number): number[] {
    const n = this.nodes;
    return [...n.slice(0, i), ...n.slice(i, j + 1).reverse(), ...n.slice(j + 1)];
  }

  moved(i: number, length: number, a: number, reversed: boolean): number[] {
    const n = this.nodes;
    const run = n.slice(i, i + length);
    if (reversed) run.reverse();
    const rest = [...n.slice(0, i), ...n.slice(i + length)];
    const at = a < i ? a + 1 : a + 1 - length; // position in `rest` the run goes before
    return [...rest.slice(0, at), ...run, ...rest.slice(at)];
  }
}

/**
 * Improves `order` by 2-opt and Or-opt moves until neither shortens it: each sweep tries every
 * move in turn and makes each one that helps at once (the path keeps its length, so the sweep
 * goes on over the changed path).
 */
function improveRoute(problem: RouteProblem, order: readonly number[]): PlannedRoute {
  let path = new Path(problem, order);
  const take = (nodes: number[]) => {
    path = new Path(problem, nodes.slice(path.lo, path.hi + 1));
  };
  let improved = true;
  while (improved) {
    improved = false;
    for (let i = path.lo; i < path.hi; i++)
      for (let j = i + 1; j <= path.hi; j++)
        if (path.reverseDelta(i, j) < -EPSILON) {
          take(path.reversed(i, j));
          improved = true;
        }
    for (let length = 1; length <= 3; length++)
      for (let i = path.lo; i + length - 1 <= path.hi; i++)
        for (let a = path.lo - 1; a <= path.hi; a++) {
          if (a >= i - 1 && a <= i + length - 1) continue; // inside the run, or its own place
          for (const reversed of length > 1 ? [false, true] : [false])
            if (path.moveDelta(i, length, a, reversed) < -EPSILON) {
              take(path.moved(i, length, a, reversed));
              improved = true;
            }
        }
  }
  return { order: path.order, cost: pathCost(problem, path.order) };
}

/** How many first stops planRoute tries (each a nearest-neighbour path improved by 2-opt and Or-opt). */
const STARTS = 8;

/**
 * The driving order of `problem.stops`: nearest neighbour from each of the STARTS stops nearest
 * the start (all stops, up to STARTS, on an open route) taken first in turn — the repetitive
 * nearest neighbour of Rosenkrantz, Stearns & Lewis 1977, bounded — each improved by 2-opt and
 * Or-opt; the cheapest result is kept.
 */
export function planRoute(problem: RouteProblem): PlannedRoute {
  if (problem.stops.length === 0) return { order: [], cost: pathCost(problem, []) };
  const { start, cost } = problem;
  const firsts =
    start === null
      ? problem.stops.slice(0, STARTS)
      : [...problem.stops].sort((a, b) => cost[start]![a]! - cost[start]![b]!).slice(0, STARTS);
  let best: PlannedRoute | null = null;
  for (const first of firsts) {
    const route = improveRoute(problem, nearestNeighbour(problem, first));
    if (!best || route.cost < best.cost - EPSILON) best = route;
  }
  return best!;
}

/** Nearest neighbour alone (the first step of planRoute), for the tests and the benchmark. */
export function nearestNeighbourRoute(problem: RouteProblem): PlannedRoute {
  const order = problem.stops.length ? nearestNeighbour(problem, null) : [];
  return { order, cost: pathCost(problem, order) };
}
