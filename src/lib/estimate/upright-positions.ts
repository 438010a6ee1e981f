/**
 * Where the uprights (battens, stiles) of one stretch of wall stand: the left edge of each, for
 * uprights `w` wide no more than `spacing` apart on centre. On a level stretch they are spread
 * evenly; on the stretch that holds a stair they are set out from the stair's foot (docs/sources.md §43).
 */

const EPS = 1e-9;

/** One upright at each end of [a, b] and the rest spread evenly between (one alone when the stretch is at most two wide). */
export function spreadEvenly(a: number, b: number, w: number, spacing: number): number[] {
  const run = b - a;
  const n = run <= 2 * w ? 1 : Math.ceil((run - w) / spacing - EPS) + 1;
  const pitch = n > 1 ? (run - w) / (n - 1) : 0;
  return Array.from({ length: n }, (_, i) => a + i * pitch);
}

/**
 * Uprights on a stretch [a, b] that holds a stair's whole run `run`, its foot at the stretch's `foot`
 * end. Over the stair they stand at the fixed pitch `spacing` from the foot (0, spacing, 2 × spacing …
 * while they start on the stair), so each keeps its place and its long point as the wall grows or
 * the stair gets more steps. The level rest, from the next pitch on, is spread evenly as on any
 * wall: those uprights are all one length, so spreading them changes no cut. Where the stretch ends
 * before that next pitch leaves room for an upright, one goes against the stretch's end if it clears
 * the last one on the stair; else the end is left as a stretch too narrow for another is.
 */
export function fromStairFoot(a: number, b: number, w: number, spacing: number, run: number, foot: 'left' | 'right'): number[] {
  const length = b - a;
  const rake = Math.min(run, length);
  // Distances from the foot to each upright's near edge.
  const fromFoot: number[] = [];
  const overStair = Math.max(1, Math.ceil(rake / spacing - EPS));
  for (let i = 0; i < overStair && i * spacing + w <= length + EPS; i++) fromFoot.push(i * spacing);
  const levelStart = overStair * spacing;
  if (length - levelStart >= w - EPS) {
    fromFoot.push(...spreadEvenly(levelStart, length, w, spacing));
  } else {
    const end = length - w;
    const last = fromFoot.at(-1);
    if (end >= -EPS && (last === undefined || end >= last + w - EPS)) fromFoot.push(Math.max(0, end));
  }
  return fromFoot.map((s) => (foot === 'left' ? a + s : b - s - w));
}
