import { describe, expect, it } from 'vitest';
import { boardRun } from './board-run.ts';
import { dressedSize } from './lumber.ts';

describe('dressed lumber sizes', () => {
  // Source: American Softwood Lumber Standard DOC PS 20, minimum dressed dry sizes, as reproduced by
  // engineeringtoolbox.com "Softwood Lumber - Standard Sizes" and sizes.com (docs/sources.md §1).
  it.each([
    ['1x2', 0.75, 1.5],
    ['1x3', 0.75, 2.5],
    ['1x4', 0.75, 3.5],
    ['1x6', 0.75, 5.5],
    ['1x8', 0.75, 7.25],
    ['1x10', 0.75, 9.25],
    ['1x12', 0.75, 11.25],
    ['2x4', 1.5, 3.5],
  ] as const)('a nominal %s is %d in × %d in', (nominal, thickness, width) => {
    expect(dressedSize(nominal)).toEqual({ thickness, width });
  });

  it('lays boards at the dressed width, never the nominal one', () => {
    // Source: docs/sources.md §12 [computed here] — 144 in of 1x6 (5.5 in) with a 1/8 in gap: 26 boards, the last 3-3/8 in.
    const run = boardRun(144, dressedSize('1x6').width, 0.125);
    expect(run).toEqual({ count: 26, lastWidth: 3.375, leftover: 0 });
    expect(boardRun(144, 6, 0.125).count).not.toBe(run.count);
  });

  it('refuses an unknown size with a message listing the known ones', () => {
    expect(() => dressedSize('1x5' as never)).toThrow(/expected one of 1x2/);
  });
});
