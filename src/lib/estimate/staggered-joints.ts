/**
 * Horizontal boards longer than the stock are joined, and each butt joint must land on a stud (the
 * board ends are nailed there) and be staggered from row to row, so no joint sits directly above the
 * one in the row below. Studs stand at firstStud, firstStud + s, firstStud + 2s … (16 in on centre
 * by default: docs/sources.md §45).
 *
 * Rule (computed here): from the row's left end, each piece runs to the farthest stud within one
 * stock length that is not a joint of the row below; the last piece runs to the row's right end.
 * With the same row length every other row then starts one stud bay shorter, so joints alternate.
 */

const EPS = 1e-6;

/** Common on-centre stud spacing, inches: docs/sources.md §45 (IRC R602.3(5); common framing). */
export const DEFAULT_STUD_SPACING = 16;

export interface StaggeredRow {
  /** Piece lengths from left to right; they add up to x1 − x0. */
  pieces: number[];
  /** Where the pieces meet (x from the wall's left end), each on a stud. */
  joints: number[];
}

export interface RowSpec {
  /** The row's left and right ends, inches from the wall's left end. */
  x0: number;
  x1: number;
  /** Longest piece one stock length gives. */
  stock: number;
  studSpacing?: number;
  /** x of the first stud (default 0, the wall's left end). */
  firstStud?: number;
  /** Joints of the row below, which this row keeps clear of. */
  below?: readonly number[];
}

/**
 * The pieces of one row with every joint on a stud and none where the row below has one. A joint is
 * only put at a stud at least half a stock length from the piece's start, so no piece but the last is
 * a short offcut (common practice, no source). Where no stud lies in that reach (stock shorter than two
 * stud bays), the piece is a full stock length and its joint falls between studs; where every stud in
 * reach is a joint below, the farthest is used (it cannot happen when the stock is at least four bays
 * long: the reach then holds three studs, and the row below's joints are half a stock length apart).
 */
export function staggeredRow(spec: RowSpec): StaggeredRow {
  const { x0, x1, stock } = spec;
  const s = spec.studSpacing ?? DEFAULT_STUD_SPACING;
  const first = spec.firstStud ?? 0;
  const below = spec.below ?? [];
  if (!(stock > 0 && s > 0)) throw new RangeError('staggeredRow: stock length and stud spacing must be positive');
  const isBelow = (x: number): boolean => below.some((b) => Math.abs(b - x) < EPS);
  const pieces: number[] = [];
  const joints: number[] = [];
  let x = x0;
  while (x1 - x > stock + EPS) {
    // Studs in [x + stock/2, x + stock], farthest first.
    let joint: number | undefined;
    let farthest: number | undefined;
    for (let k = Math.floor((x + stock - first) / s + EPS); first + k * s >= x + stock / 2 - EPS; k--) {
      const at = first + k * s;
      farthest ??= at;
      if (!isBelow(at)) {
        joint = at;
        break;
      }
    }
    const next = joint ?? farthest ?? x + stock;
    pieces.push(next - x);
    joints.push(next);
    x = next;
  }
  if (x1 - x > EPS) pieces.push(x1 - x);
  return { pieces, joints };
}

/**
 * The shortest piece `staggeredRow` cuts before a row's last one: the farthest stud in reach is less
 * than a bay short of a full length, the next one two bays, and no joint comes before half a length.
 * A bound for sizing (project-size.ts): a row of length L has at most ceil(L / this) pieces.
 */
export function shortestJoinedPiece(stock: number, studSpacing = DEFAULT_STUD_SPACING): number {
  return Math.max(stock / 2, stock - 2 * studSpacing);
}

/**
 * The rows of one course of boards, bottom to top: `rows[i]` lists the stretches [x0, x1] of row i
 * (openings break a row into several). Each row keeps clear of all the joints of the row below it.
 */
export function staggeredRows(
  rows: ReadonlyArray<ReadonlyArray<readonly [number, number]>>,
  stock: number,
  studSpacing = DEFAULT_STUD_SPACING,
  firstStud = 0,
): StaggeredRow[][] {
  let below: number[] = [];
  return rows.map((stretches) => {
    const laid = stretches.map(([x0, x1]) => staggeredRow({ x0, x1, stock, studSpacing, firstStud, below }));
    below = laid.flatMap((r) => r.joints);
    return laid;
  });
}
