/**
 * A balanced run: boards (or sheets) laid so that both ends of the run get the same width, the
 * narrowest possible rip being as wide as it can be. Laid from one end, the last board takes
 * whatever is left, often a sliver; balanced, the waste is split between the two ends, the way a
 * finish carpenter lays out a feature wall (common practice, no source).
 *
 * With k full boards in the middle and two equal end boards of width e:
 *   2e + k·w + (k + 1)·g = run  →  e = (run − k·w − (k + 1)·g) / 2.
 * Taking the fewest middle boards for which e ≤ w gives the widest ends: e lies in ((w − g)/2, w].
 * That is the choice between centring a board and centring a joint: each step of k moves e by
 * (w + g)/2, so of the two the one whose ends are wider is kept. So the ends are never narrower
 * than (w − g)/2 (2-11/16 in for a 1x6 with 1/8 in gaps); a run no wider than one board is one
 * board ripped to the run. The owner's narrowest acceptable end (`minEndWidth`) is checked by the
 * takeoff, which says so when a board too narrow for it makes even balanced ends thinner.
 */
import { boardRun } from './board-run.ts';

const EPS = 1e-9;

export interface BalancedRun {
  count: number;
  /** Width of each of the two end boards (the same at both ends). */
  endWidth: number;
}

export function balancedRun(runLength: number, boardWidth: number, gap: number): BalancedRun {
  boardRun(runLength, boardWidth, gap); // the same argument checks as a run from one end
  if (runLength <= boardWidth + EPS) return { count: 1, endWidth: runLength };
  const pitch = boardWidth + gap;
  const middle = Math.max(0, Math.ceil((runLength - gap - 2 * boardWidth) / pitch - EPS));
  const endWidth = (runLength - middle * boardWidth - (middle + 1) * gap) / 2;
  return { count: middle + 2, endWidth };
}

/** Start positions and widths of every board in a balanced run, from the starting end. */
export function balancedPositions(runLength: number, boardWidth: number, gap: number): Array<{ start: number; width: number }> {
  return positionsOf(balancedRun(runLength, boardWidth, gap), boardWidth, gap);
}

/** The positions of a run `balancedRun` has already worked out. */
export function positionsOf(run: BalancedRun, boardWidth: number, gap: number): Array<{ start: number; width: number }> {
  const { count, endWidth } = run;
  if (count === 1) return [{ start: 0, width: endWidth }];
  const out: Array<{ start: number; width: number }> = [{ start: 0, width: endWidth }];
  let x = endWidth + gap;
  for (let i = 1; i < count - 1; i++) {
    out.push({ start: x, width: boardWidth });
    x += boardWidth + gap;
  }
  out.push({ start: x, width: endWidth });
  return out;
}
