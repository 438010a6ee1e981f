export interface BoardRunResult {
  /** Boards in the run, including the last one. */
  count: number;
  /** Width the last board is ripped to; the full board width when the run comes out exactly. */
  lastWidth: number;
  /**
   * Space left at the far end, always 0 unless the run ends inside a gap (less than one gap wide):
   * no board can be ripped that thin, so the last full board stays and the sliver is hidden by the
   * corner or trim.
   */
  leftover: number;
}

// A millionth of an inch: below any saw's precision, above float noise.
const EPS = 1e-6;

/**
 * Boards laid across a run (a wall's length for vertical boards, its covered height for horizontal
 * ones) from one end, with `gap` between neighbours and none at the two ends.
 * Boards and gaps fill the run: (count − 1) × (boardWidth + gap) + lastWidth + leftover = runLength.
 */
export function boardRun(runLength: number, boardWidth: number, gap: number): BoardRunResult {
  if (!(Number.isFinite(runLength) && runLength > 0)) throw new RangeError('boardRun: runLength must be a positive number of inches');
  if (!(Number.isFinite(boardWidth) && boardWidth > 0)) throw new RangeError('boardRun: boardWidth must be a positive number of inches');
  if (!(Number.isFinite(gap) && gap >= 0)) throw new RangeError('boardRun: gap must be zero or a positive number of inches');
  const pitch = boardWidth + gap;
  // Full boards that fit with their gaps: n·w + (n − 1)·g ≤ run.
  const full = Math.floor((runLength + gap) / pitch + EPS);
  if (full === 0) return { count: 1, lastWidth: runLength, leftover: 0 };
  const rest = runLength - full * boardWidth - (full - 1) * gap;
  if (rest <= EPS) return { count: full, lastWidth: boardWidth, leftover: 0 };
  if (rest <= gap + EPS) return { count: full, lastWidth: boardWidth, leftover: rest };
  return { count: full + 1, lastWidth: rest - gap, leftover: 0 };
}

/** Start positions (from the starting end) and widths of every board in a run. */
export function boardPositions(runLength: number, boardWidth: number, gap: number): Array<{ start: number; width: number }> {
  const { count, lastWidth } = boardRun(runLength, boardWidth, gap);
  const out: Array<{ start: number; width: number }> = [];
  for (let i = 0; i < count; i++) {
    out.push({ start: i * (boardWidth + gap), width: i === count - 1 ? lastWidth : boardWidth });
  }
  return out;
}
