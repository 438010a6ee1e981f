/**
 * One-dimensional cutting: how many stock lengths (boards, mouldings, strips) yield a list of cuts.
 * Up to EXACT_LIMIT cuts: exact, by branch and bound. Beyond: the better of first-fit decreasing
 * (proven: FFD ≤ 11/9·OPT + 6/9, Dósa 2007) and a sequential pattern heuristic (repeat the pattern
 * that wastes least, after Haessler's sequential heuristic procedure, within a node budget) — both
 * feasible, so the answer is never below the true optimum and never worse than FFD.
 */

export const EXACT_LIMIT = 20;
const EPS = 1e-7;
// Node cap for the exact search; reached only by adversarial input, and then FFD's answer stands.
const MAX_NODES = 2_000_000;
// Node cap for one pattern of the sequential heuristic, and for all its patterns together: a list of
// many thousands of different lengths would otherwise take seconds; past it, FFD's answer stands.
const PATTERN_NODES = 20_000;
const SEQUENTIAL_NODES = 500_000;

function check(cuts: number[], stockLength: number, kerf: number): void {
  if (!(Number.isFinite(stockLength) && stockLength > 0)) throw new RangeError('stockPiecesNeeded: stockLength must be a positive number of inches');
  if (!(Number.isFinite(kerf) && kerf >= 0)) throw new RangeError('stockPiecesNeeded: kerf must be zero or a positive number of inches');
  for (const c of cuts) {
    if (!(Number.isFinite(c) && c > 0)) throw new RangeError('stockPiecesNeeded: every cut must be a positive number of inches');
    if (c > stockLength + EPS) throw new RangeError(`stockPiecesNeeded: a cut of ${c} in is longer than the ${stockLength} in stock`);
  }
}

/**
 * First-fit decreasing on kerf-grown sizes; returns the bins as lists of indexes into `sizes`.
 * The leftmost bin with room is found in a max-tree over the bins' room (O(n log n) rather than a
 * scan of every open bin): bins not yet opened hold a whole stock length and sit right of every
 * open one, so the leftmost bin that fits is exactly the one plain first fit would pick.
 */
function firstFitDecreasing(sizes: number[], cap: number): number[][] {
  const order = sizes.map((_, i) => i).sort((a, b) => sizes[b]! - sizes[a]!);
  let leaves = 1;
  while (leaves < sizes.length) leaves *= 2;
  // tree[1] is the root; leaf b sits at tree[leaves + b]; each node holds the most room below it.
  const tree = new Float64Array(2 * leaves).fill(cap);
  const bins: number[][] = [];
  for (const i of order) {
    const s = sizes[i]!;
    let node = 1;
    while (node < leaves) node = tree[2 * node]! + EPS >= s ? 2 * node : 2 * node + 1;
    const b = node - leaves;
    if (b === bins.length) bins.push([]);
    bins[b]!.push(i);
    tree[node] = tree[node]! - s;
    for (node >>= 1; node >= 1; node >>= 1) tree[node] = Math.max(tree[2 * node]!, tree[2 * node + 1]!);
  }
  return bins;
}

/**
 * Exact minimum number of bins for a short list (sizes already kerf-grown), or null if no layout beats
 * `upper` (then `upper` is the minimum) or the search gave up (then `status.gaveUp` is set).
 */
function exactBins(sizes: number[], cap: number, upper: number, status?: { gaveUp: boolean }): number[][] | null {
  const order = sizes.map((_, i) => i).sort((a, b) => sizes[b]! - sizes[a]!);
  const total = sizes.reduce((s, x) => s + x, 0);
  const lower = Math.max(1, Math.ceil(total / cap - EPS));
  let best = upper;
  let bestAssign: number[] | null = null;
  const room: number[] = [];
  const assign = new Array<number>(order.length).fill(-1);
  let nodes = 0;
  let gaveUp = false;

  const dfs = (k: number): void => {
    if (best === lower || gaveUp) return;
    if (++nodes > MAX_NODES) {
      gaveUp = true;
      return;
    }
    if (k === order.length) {
      if (room.length < best) {
        best = room.length;
        bestAssign = assign.slice();
      }
      return;
    }
    const s = sizes[order[k]!]!;
    const tried = new Set<number>();
    for (let b = 0; b < room.length; b++) {
      const r = room[b]!;
      if (r + EPS < s) continue;
      // Bins with the same room left are interchangeable; try one of them.
      const key = Math.round(r * 1e6);
      if (tried.has(key)) continue;
      tried.add(key);
      room[b] = r - s;
      assign[k] = b;
      dfs(k + 1);
      room[b] = r;
    }
    if (room.length + 1 < best) {
      room.push(cap - s);
      assign[k] = room.length - 1;
      dfs(k + 1);
      room.pop();
    }
  };
  dfs(0);
  if (status) status.gaveUp = gaveUp;
  if (gaveUp && bestAssign === null) return null;
  if (bestAssign === null) return null;
  const bins: number[][] = Array.from({ length: best }, () => []);
  const chosen: number[] = bestAssign;
  chosen.forEach((b, k) => bins[b]!.push(order[k]!));
  return bins;
}

/** Best single pattern for the sequential heuristic: the subset of remaining cuts that fills one stock most. */
function bestPattern(lengths: number[], remaining: number[], cap: number, budget: { nodes: number }): number[] {
  const n = lengths.length;
  // suffix[i]: total length of every remaining cut from group i on (an upper bound on what they add).
  const suffix = new Array<number>(n + 1).fill(0);
  for (let i = n - 1; i >= 0; i--) suffix[i] = suffix[i + 1]! + lengths[i]! * remaining[i]!;
  let best: number[] = new Array<number>(n).fill(0);
  let bestFill = -1;
  const cur = new Array<number>(n).fill(0);
  let nodes = 0;
  const dfs = (i: number, fill: number): void => {
    if (++nodes > PATTERN_NODES) return;
    budget.nodes -= 1;
    if (fill > bestFill + EPS) {
      bestFill = fill;
      best = cur.slice();
    }
    if (i === n || bestFill >= cap - EPS) return;
    if (fill + Math.min(cap - fill, suffix[i]!) <= bestFill + EPS) return;
    const maxTake = Math.min(remaining[i]!, Math.floor((cap - fill) / lengths[i]! + EPS));
    for (let t = maxTake; t >= 0; t--) {
      cur[i] = t;
      dfs(i + 1, fill + t * lengths[i]!);
      if (bestFill >= cap - EPS) break;
    }
    cur[i] = 0;
  };
  dfs(0, 0);
  return best;
}

/** Stock lengths the sequential heuristic uses; Infinity when it ran out of its node budget. */
function sequentialPatterns(sizes: number[], cap: number): number {
  const groups = new Map<number, number>();
  for (const s of sizes) {
    const key = Math.round(s * 1e6) / 1e6;
    groups.set(key, (groups.get(key) ?? 0) + 1);
  }
  const lengths = [...groups.keys()].sort((a, b) => b - a);
  const remaining = lengths.map((l) => groups.get(l)!);
  const budget = { nodes: SEQUENTIAL_NODES };
  let left = sizes.length;
  let used = 0;
  while (left > 0) {
    if (budget.nodes <= 0) return Infinity;
    const pattern = bestPattern(lengths, remaining, cap, budget);
    // Use the pattern as often as the remaining demand allows.
    let times = Infinity;
    pattern.forEach((c, i) => {
      if (c > 0) times = Math.min(times, Math.floor(remaining[i]! / c));
    });
    if (!Number.isFinite(times) || times < 1) times = 1;
    pattern.forEach((c, i) => {
      remaining[i] = remaining[i]! - c * times;
      left -= c * times;
    });
    used += times;
  }
  return used;
}

/**
 * Plans the cuts: which cuts come from which stock length. Same rules and answer size as
 * `stockPiecesNeeded`, but returns the cut lengths per stock piece (FFD's plan beyond EXACT_LIMIT).
 */
export function planStockCuts(cuts: number[], stockLength: number, kerf = 0): number[][] {
  check(cuts, stockLength, kerf);
  if (cuts.length === 0) return [];
  const sizes = cuts.map((c) => c + kerf);
  const cap = stockLength + kerf;
  const ffd = firstFitDecreasing(sizes, cap);
  const bins = cuts.length <= EXACT_LIMIT ? (exactBins(sizes, cap, ffd.length) ?? ffd) : ffd;
  return bins.map((b) => b.map((i) => cuts[i]!).sort((x, y) => y - x));
}

/**
 * The fewest stock lengths that yield all the cuts (inches). `kerf` (default 0) is lost at each cut:
 * cuts c₁…cₙ come from one stock of length L when Σc + (n − 1)·kerf ≤ L.
 * Exact up to 20 cuts (branch and bound); beyond, a proven heuristic (see module note).
 */
export function stockPiecesNeeded(cuts: number[], stockLength: number, kerf = 0): number {
  return stockPiecesSolved(cuts, stockLength, kerf).count;
}

/**
 * `stockPiecesNeeded` with how the count was found: `exact` when the branch and bound finished (up to
 * EXACT_LIMIT cuts), so the count is the true minimum; false when a heuristic answered (more cuts, or
 * the search hit its node cap), so the count may be above the minimum.
 */
export function stockPiecesSolved(cuts: number[], stockLength: number, kerf = 0): { count: number; exact: boolean } {
  check(cuts, stockLength, kerf);
  if (cuts.length === 0) return { count: 0, exact: true };
  const sizes = cuts.map((c) => c + kerf);
  const cap = stockLength + kerf;
  const ffd = firstFitDecreasing(sizes, cap).length;
  if (cuts.length <= EXACT_LIMIT) {
    const status = { gaveUp: false };
    const exact = exactBins(sizes, cap, ffd, status);
    // No layout beat first fit and the search finished: first fit's count is the minimum.
    return { count: exact ? exact.length : ffd, exact: !status.gaveUp };
  }
  return { count: Math.min(ffd, sequentialPatterns(sizes, cap)), exact: false };
}
