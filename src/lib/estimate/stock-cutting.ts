/**
 * One-dimensional cutting: how many stock lengths (boards, mouldings, strips) yield a list of cuts.
 * Up to EXACT_LIMIT cuts: exact, by branch and bound. Beyond: the better of first-fit decreasing
 * (proven: FFD ≤ 11/9·OPT + 6/9, Dósa 2007) and a sequential pattern heuristic (repeat the pattern
 * that wastes least, after Haessler's sequential heuristic procedure, within a node budget) — both
 * feasible, so the answer is never below the true optimum and never worse than FFD; and where that
 * stops above the lower bound, an exact table over the "what is left" states when they are few
 * enough, else an exact search over the distinct lengths within a node budget (docs/sources.md §50).
 */

export const EXACT_LIMIT = 20;
const EPS = 1e-7;
// Node cap for the exact search; reached only by adversarial input, and then FFD's answer stands.
const MAX_NODES = 2_000_000;
// Node cap for one pattern of the sequential heuristic, and for all its patterns together: a list of
// many thousands of different lengths would otherwise take seconds; past it, FFD's answer stands.
const PATTERN_NODES = 20_000;
const SEQUENTIAL_NODES = 500_000;
// Node cap for the exact search on a list longer than EXACT_LIMIT (`fewestByFilling`), run only when
// the heuristics stop above the lower bound: a heuristic's count can fall when a cut grows (first fit
// places the longer cut differently), so a longer wall could need fewer lengths; the optimum never falls.
// 10,000 nodes missed a plan the property found (37 cuts of five lengths: 11 pieces where 10 do, found
// within 50,000 nodes); 60,000 it is, and the stronger lower bound spares the search where the
// heuristic's count is already proven, which is where most of its time went.
const LONG_LIST_NODES = 60_000;
const MAX_FILL_DEPTH = 2_000;
// Limits of the exact search over "what is left" states (`fewestByStates`): a wall's cut list has a
// handful of distinct lengths, so its states number in the thousands; beyond these, the bounded
// search above stands.
const STATE_LIMIT = 150_000;
const STATE_STEPS = 2_000_000;

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

/** A lower bound on the bins: the total length, and the cuts longer than half a stock (one each). */
function lowerBound(sizes: number[], cap: number): number {
  const total = sizes.reduce((s, x) => s + x, 0);
  return Math.max(1, Math.ceil(total / cap - EPS), sizes.filter((x) => x > cap / 2 + EPS).length);
}

/**
 * A stronger lower bound for long lists (Martello and Toth's L2, "Knapsack Problems", Wiley 1990,
 * §8.3.1; from memory): for each α up to half a stock, the cuts longer than stock − α each need a
 * piece of their own, the cuts between half and stock − α one each too, and the cuts from α to half
 * a stock need whatever the second group's offcuts cannot hold. It lets the search below stop at
 * once where a heuristic already meets it, instead of spending its budget proving that.
 */
function strongLowerBound(sizes: number[], cap: number): number {
  const half = cap / 2;
  let best = lowerBound(sizes, cap);
  const alphas = [0, ...new Set(sizes.filter((x) => x <= half + EPS))];
  for (const alpha of alphas) {
    let n1 = 0;
    let n2 = 0;
    let sum2 = 0;
    let sum3 = 0;
    for (const x of sizes) {
      if (x > cap - alpha + EPS) n1++;
      else if (x > half + EPS) {
        n2++;
        sum2 += x;
      } else if (x + EPS >= alpha) sum3 += x;
    }
    const spill = sum3 - (n2 * cap - sum2);
    best = Math.max(best, n1 + n2 + Math.max(0, Math.ceil(spill / cap - EPS)));
  }
  return best;
}

/**
 * Exact minimum number of bins for a short list (sizes already kerf-grown), or null if no layout beats
 * `upper` (then `upper` is the minimum) or the search gave up (then `status.gaveUp` is set).
 */
function exactBins(sizes: number[], cap: number, upper: number, status?: { gaveUp: boolean }): number[][] | null {
  const order = sizes.map((_, i) => i).sort((a, b) => sizes[b]! - sizes[a]!);
  const lower = lowerBound(sizes, cap);
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
  if (bestAssign === null) return null;
  const bins: number[][] = Array.from({ length: best }, () => []);
  const chosen: number[] = bestAssign;
  chosen.forEach((b, k) => bins[b]!.push(order[k]!));
  return bins;
}

/**
 * The fewest stock pieces for a list of at most EXACT_LIMIT cuts (sizes kerf-grown): the exact search,
 * started from first fit's count; `finished` is false when the search hit its node cap (then first
 * fit's count, or the best found, stands).
 */
function fewestOfShortList(sizes: number[], cap: number): { count: number; finished: boolean } {
  const ffd = firstFitDecreasing(sizes, cap).length;
  const status = { gaveUp: false };
  const exact = exactBins(sizes, cap, ffd, status);
  // No layout beat first fit and the search finished: first fit's count is the minimum.
  return { count: exact ? exact.length : ffd, finished: !status.gaveUp };
}

/** The distinct sizes (to a millionth of an inch), longest first, with how many of each. */
function distinctLengths(sizes: number[]): { lengths: number[]; counts: number[] } {
  const groups = new Map<number, number>();
  for (const s of sizes) {
    const key = Math.round(s * 1e6) / 1e6;
    groups.set(key, (groups.get(key) ?? 0) + 1);
  }
  const lengths = [...groups.keys()].sort((a, b) => b - a);
  return { lengths, counts: lengths.map((l) => groups.get(l)!) };
}

/**
 * Exact minimum for a long list with few distinct lengths (sizes kerf-grown), or null when the search
 * gave up or found nothing below `upper`. Stock pieces are filled one at a time, each starting with
 * the longest cut left and holding a maximal set of the rest (no cut left over would still fit), and
 * the search stops once the offcuts so far exceed what a plan one piece shorter than the best can waste.
 */
function fewestByFilling(sizes: number[], cap: number, upper: number, maxNodes: number): number | null {
  const { lengths: len, counts: cnt } = distinctLengths(sizes);
  // The search recurses once per distinct length per stock piece: keep it well inside the call stack.
  if (upper * (len.length + 2) > MAX_FILL_DEPTH) return null;
  const total = sizes.reduce((s, x) => s + x, 0);
  const lower = strongLowerBound(sizes, cap);
  let best = upper;
  let nodes = 0;
  let gaveUp = false;
  const go = (): boolean => {
    if (gaveUp || best <= lower) return false;
    if (++nodes > maxNodes) {
      gaveUp = true;
      return false;
    }
    return true;
  };
  const fill = (used: number, waste: number): void => {
    if (gaveUp || best <= lower) return;
    const first = cnt.findIndex((c) => c > 0);
    if (first < 0) {
      best = Math.min(best, used);
      return;
    }
    if (used + 1 >= best) return;
    cnt[first] = cnt[first]! - 1;
    // Each piece of a plan with best − 1 pieces can waste, on average, no more than this.
    const maxWaste = (best - 1) * cap - total;
    forEachMaximalFill(len, cnt, first, cap, go, (offcut) => {
      if (waste + offcut > maxWaste + EPS && cnt.some((c) => c > 0)) return;
      fill(used + 1, waste + offcut);
    });
    cnt[first] = cnt[first]! + 1;
  };
  fill(0, 0);
  return best < upper ? best : null;
}

/**
 * Exact minimum for a long list whose distinct lengths and counts give at most `maxStates` "what is
 * left" states (sizes kerf-grown), or null beyond that or past `maxSteps`. Each state's answer is
 * worked out once: the next stock piece takes the longest cut left and a maximal set of the rest
 * (bin completion, as in `fewestByFilling`), and the fewest pieces for what remains is looked up.
 * Where it answers, the count is the optimum, which never falls as cuts grow (docs/sources.md §50).
 */
function fewestByStates(sizes: number[], cap: number, maxStates: number, maxSteps: number): number | null {
  const { lengths: len, counts: left } = distinctLengths(sizes);
  const stride: number[] = [];
  let states = 1;
  for (const c of left) {
    stride.push(states);
    states *= c + 1;
    if (states > maxStates) return null;
  }
  const memo = new Int32Array(states).fill(-1);
  memo[0] = 0;
  let steps = 0;
  const go = (): boolean => {
    if (++steps > maxSteps) throw new RangeError('too many steps');
    return true;
  };
  const indexOf = (): number => left.reduce((s, c, g) => s + c * stride[g]!, 0);
  const solve = (index: number): number => {
    const known = memo[index]!;
    if (known >= 0) return known;
    const first = left.findIndex((c) => c > 0);
    let best = Infinity;
    left[first] = left[first]! - 1;
    forEachMaximalFill(len, left, first, cap, go, () => {
      best = Math.min(best, 1 + solve(indexOf()));
    });
    left[first] = left[first]! + 1;
    memo[index] = best;
    return best;
  };
  try {
    return solve(indexOf());
  } catch (error) {
    if (error instanceof RangeError) return null;
    throw error;
  }
}

/**
 * Every maximal fill of one stock piece that holds a cut of length `len[first]` (already taken out of
 * `left`, the counts of each distinct length still to cut): `visit(offcut)` is called for each with
 * the fill's other cuts taken out of `left` too, and they are put back after. A fill is maximal when
 * no cut still left fits its offcut; some optimal plan is made only of such pieces (bin completion,
 * docs/sources.md §50). `go()` is asked at every step of the enumeration, and false ends that branch.
 */
function forEachMaximalFill(len: number[], left: number[], first: number, cap: number, go: () => boolean, visit: (offcut: number) => void): void {
  const take = new Array<number>(len.length).fill(0);
  // rest[i]: the total length of the cuts still to cut in groups i on, the most they can take out
  // of the offcut. A group passed over with cuts left must not fit the final offcut, so a branch
  // whose offcut stays at least that long even if every later cut goes in holds no maximal fill
  // and is not walked (the fills visited are the same, found with fewer steps).
  const rest = new Array<number>(len.length + 1).fill(0);
  for (let g = len.length - 1; g >= 0; g--) rest[g] = rest[g + 1]! + len[g]! * left[g]!;
  const choose = (i: number, room: number, shortestPassed: number): void => {
    if (!go()) return;
    if (room - rest[i]! >= shortestPassed - EPS) return;
    if (i === len.length) {
      for (let g = 0; g < len.length; g++) if (left[g]! - take[g]! > 0 && len[g]! <= room + EPS) return;
      for (let g = 0; g < len.length; g++) left[g] = left[g]! - take[g]!;
      visit(room);
      for (let g = 0; g < len.length; g++) left[g] = left[g]! + take[g]!;
      return;
    }
    const most = Math.min(left[i]!, Math.floor(room / len[i]! + EPS));
    for (let t = most; t >= 0; t--) {
      take[i] = t;
      choose(i + 1, room - t * len[i]!, left[i]! > t ? Math.min(shortestPassed, len[i]!) : shortestPassed);
    }
    take[i] = 0;
  };
  choose(first, cap - len[first]!, Infinity);
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
  const { lengths, counts: remaining } = distinctLengths(sizes);
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
  // The same list comes back often (a homeowner changing one room re-prices the others; a wall's
  // trim is counted for the price and again for the order list), and the answer depends on the list
  // alone, so it is kept, as sheet layouts are.
  if (cuts.length > MAX_MEMO_CUTS) return solveStockPieces(cuts, stockLength, kerf);
  const key = `${stockLength}|${kerf}|${cuts.join(',')}`;
  const known = solvedMemo.get(key);
  if (known) return { ...known };
  const solved = solveStockPieces(cuts, stockLength, kerf);
  if (solvedMemo.size >= MAX_SOLVED_MEMO) solvedMemo.clear();
  solvedMemo.set(key, solved);
  return { ...solved };
}

const solvedMemo = new Map<string, { count: number; exact: boolean }>();
// At most about 2,000 lists of up to 1,000 cuts: a few megabytes.
const MAX_SOLVED_MEMO = 2_000;
const MAX_MEMO_CUTS = 1_000;

/** Empties the memo of counted lists (for benchmarks that want cold timings). */
export function clearStockCuttingMemo(): void {
  solvedMemo.clear();
}

function solveStockPieces(cuts: number[], stockLength: number, kerf: number): { count: number; exact: boolean } {
  const sizes = cuts.map((c) => c + kerf);
  const cap = stockLength + kerf;
  if (cuts.length <= EXACT_LIMIT) {
    const { count, finished } = fewestOfShortList(sizes, cap);
    return { count, exact: finished };
  }
  // Beyond the exact search a count is an estimate, even where it is the optimum: called exact only
  // sometimes, it would lose its waste factor as a wall grew into such a case.
  // Cuts that no other cut fits beside (whole-length boards, mostly) take a stock piece each; what is
  // left is often short enough, or has few enough states, to be counted exactly.
  const shortest = Math.min(...sizes);
  const rest = sizes.filter((x) => x + shortest <= cap + EPS);
  const alone = sizes.length - rest.length;
  if (rest.length === 0) return { count: alone, exact: false };
  if (rest.length <= EXACT_LIMIT) {
    const { count, finished } = fewestOfShortList(rest, cap);
    if (finished) return { count: alone + count, exact: false };
  }
  const heuristic = Math.min(firstFitDecreasing(sizes, cap).length, sequentialPatterns(sizes, cap));
  if (heuristic <= strongLowerBound(sizes, cap)) return { count: heuristic, exact: false };
  const optimum = fewestByStates(rest, cap, STATE_LIMIT, STATE_STEPS);
  if (optimum !== null) return { count: alone + optimum, exact: false };
  return { count: fewestByFilling(sizes, cap, heuristic, LONG_LIST_NODES) ?? heuristic, exact: false };
}
