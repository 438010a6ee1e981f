/**
 * How many identical pieces one sheet yields with guillotine cuts (every cut runs edge to edge of
 * the part being cut, as on a table saw or track saw).
 *
 * Method: exact dynamic programme over "normal" cut positions (sums of piece sides), after
 * Beasley, "Algorithms for unconstrained two-dimensional guillotine cutting", JORS 36 (1985).
 * Kerf is handled by growing the sheet and the piece by one kerf each: a strip of n pieces uses
 * n·w + (n − 1)·k ≤ L exactly when n·(w + k) ≤ L + k, and every cut then costs nothing.
 */

export interface Rect {
  width: number;
  height: number;
}

export interface SheetLayoutOptions {
  /** Material lost at each cut, inches (default 0). */
  kerf?: number;
  /** Whether pieces may turn 90° (default true); layouts may then mix orientations. */
  rotate?: boolean;
}

const EPS = 1e-7;
// Above this many DP steps the search switches to block layouts (only absurdly small pieces get here).
const MAX_WORK = 4e7;
const MAX_MEMO = 5000;
const memo = new Map<string, number>();

function checkRect(r: Rect, what: string): void {
  if (!r || !(Number.isFinite(r.width) && r.width > 0 && Number.isFinite(r.height) && r.height > 0)) {
    throw new RangeError(`piecesPerSheet: ${what} width and height must be positive numbers of inches`);
  }
}

/** Every sum a·p + b·q that does not exceed `limit`, sorted, near-duplicates merged. */
function normalPoints(p: number, q: number, limit: number): number[] {
  const out: number[] = [];
  for (let a = 0; a * p <= limit + EPS; a++) {
    for (let b = 0; a * p + b * q <= limit + EPS; b++) {
      if (a + b > 0) out.push(a * p + b * q);
    }
  }
  out.sort((x, y) => x - y);
  const merged: number[] = [];
  for (const v of out) if (merged.length === 0 || v - merged[merged.length - 1]! > EPS) merged.push(v);
  return merged;
}

const fit = (space: number, piece: number): number => Math.floor(space / piece + EPS);

/** Best of the simple layouts: one orientation, or two blocks side by side / one above the other. */
function blockLayouts(W: number, H: number, w: number, h: number): number {
  let best = Math.max(fit(W, w) * fit(H, h), fit(W, h) * fit(H, w));
  for (let a = 0; a * w <= W + EPS; a++) {
    const rest = W - a * w;
    best = Math.max(best, a * fit(H, h) + fit(rest, h) * fit(H, w));
  }
  for (let b = 0; b * h <= H + EPS; b++) {
    const rest = H - b * h;
    best = Math.max(best, b * fit(W, w) + fit(rest, w) * fit(W, h));
  }
  return best;
}

function solve(W: number, H: number, w: number, h: number): number {
  const xs = normalPoints(w, h, W);
  const ys = normalPoints(w, h, H);
  const nx = xs.length;
  const ny = ys.length;
  if (nx === 0 || ny === 0) return 0;
  if (nx * ny * (nx + ny) > MAX_WORK) return blockLayouts(W, H, w, h);

  // index of the largest normal point ≤ v, or −1
  const floorIndex = (arr: number[], v: number): number => {
    let lo = 0;
    let hi = arr.length - 1;
    let ans = -1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      if (arr[mid]! <= v + EPS) {
        ans = mid;
        lo = mid + 1;
      } else hi = mid - 1;
    }
    return ans;
  };
  // For each pair (i, cut a): the remaining width xs[i] − xs[a], reduced to a normal point.
  const restX: Int32Array[] = xs.map((x) => Int32Array.from(xs, (a) => floorIndex(xs, x - a)));
  const restY: Int32Array[] = ys.map((y) => Int32Array.from(ys, (b) => floorIndex(ys, y - b)));
  const pieceArea = w * h;
  const f = new Int32Array(nx * ny);
  for (let i = 0; i < nx; i++) {
    const x = xs[i]!;
    for (let j = 0; j < ny; j++) {
      const y = ys[j]!;
      const bound = Math.floor((x * y) / pieceArea + EPS);
      let best = Math.max(fit(x, w) * fit(y, h), fit(x, h) * fit(y, w));
      // Vertical cuts: a piece of width xs[a] on the left, the rest on the right (symmetry: a ≤ half).
      for (let a = 0; a < i && best < bound && xs[a]! <= x / 2 + EPS; a++) {
        const r = restX[i]![a]!;
        if (r < 0) continue;
        const v = f[a * ny + j]! + f[r * ny + j]!;
        if (v > best) best = v;
      }
      for (let b = 0; b < j && best < bound && ys[b]! <= y / 2 + EPS; b++) {
        const r = restY[j]![b]!;
        if (r < 0) continue;
        const v = f[i * ny + b]! + f[i * ny + r]!;
        if (v > best) best = v;
      }
      f[i * ny + j] = best;
    }
  }
  return f[nx * ny - 1]!;
}

/**
 * The most pieces a guillotine cutting layout gets from one sheet.
 * `rotate` (default true) lets pieces turn 90°, and layouts may mix orientations; `kerf` (default 0)
 * is lost at each cut. Results are memoised per sheet, piece, kerf and rotation.
 */
export function piecesPerSheet(sheet: Rect, piece: Rect, opts: SheetLayoutOptions = {}): number {
  checkRect(sheet, 'sheet');
  checkRect(piece, 'piece');
  const kerf = opts.kerf ?? 0;
  if (!(Number.isFinite(kerf) && kerf >= 0)) throw new RangeError('piecesPerSheet: kerf must be zero or a positive number of inches');
  const rotate = opts.rotate ?? true;
  const key = `${sheet.width}|${sheet.height}|${piece.width}|${piece.height}|${kerf}|${rotate ? 1 : 0}`;
  const cached = memo.get(key);
  if (cached !== undefined) return cached;

  const W = sheet.width + kerf;
  const H = sheet.height + kerf;
  const w = piece.width + kerf;
  const h = piece.height + kerf;
  let result: number;
  if (!rotate || Math.abs(w - h) < EPS) {
    // One orientation only: a guillotine layout of identical pieces can do no better than the grid.
    result = fit(W, w) * fit(H, h);
  } else {
    result = solve(W, H, w, h);
  }
  if (memo.size >= MAX_MEMO) memo.clear();
  memo.set(key, result);
  return result;
}

/** Empties the memo (for benchmarks that want cold timings). */
export function clearSheetLayoutMemo(): void {
  memo.clear();
}
