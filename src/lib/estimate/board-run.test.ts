import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { boardPositions, boardRun } from './board-run.ts';

describe('boardRun', () => {
  // Source: docs/sources.md §12 [computed here] — 25·5.5 + 25·0.125 = 140.625 in, last board 3-3/8 in.
  it('rips the last 1x6 board to 3-3/8 in on a 12 ft wall with 1/8 in gaps', () => {
    expect(boardRun(144, 5.5, 0.125)).toEqual({ count: 26, lastWidth: 3.375, leftover: 0 });
  });

  it('keeps the full width when the run comes out exactly', () => {
    // 8 strips of 5-7/8 in with 7 gaps of 1/8 in = 47.875 in (docs/sources.md §9, computed here).
    expect(boardRun(47.875, 5.875, 0.125)).toEqual({ count: 8, lastWidth: 5.875, leftover: 0 });
  });

  it('leaves a sliver narrower than a gap at the end rather than ripping a board that thin', () => {
    const r = boardRun(5.5 + 0.0625, 5.5, 0.125);
    expect(r).toEqual({ count: 1, lastWidth: 5.5, leftover: 0.0625 });
  });

  it('refuses nonsense', () => {
    expect(() => boardRun(-1, 5.5, 0.125)).toThrow(/runLength/);
    expect(() => boardRun(100, 0, 0.125)).toThrow(/boardWidth/);
    expect(() => boardRun(100, 5.5, -1)).toThrow(/gap/);
  });

  // Property: boards and gaps exactly fill the run (common practice, no source: the layout rule itself).
  fcTest.prop([fc.double({ min: 1, max: 1200, noNaN: true }), fc.double({ min: 0.5, max: 12, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })])(
    'boards and gaps exactly fill the run',
    (run, width, gap) => {
      const r = boardRun(run, width, gap);
      expect(r.count).toBeGreaterThanOrEqual(1);
      expect(r.lastWidth).toBeGreaterThan(0);
      expect(r.lastWidth).toBeLessThanOrEqual(width + 1e-9);
      expect(r.leftover).toBeGreaterThanOrEqual(0);
      expect(r.leftover).toBeLessThanOrEqual(gap + 1e-6);
      expect((r.count - 1) * (width + gap) + r.lastWidth + r.leftover).toBeCloseTo(run, 6);
      const pos = boardPositions(run, width, gap);
      expect(pos).toHaveLength(r.count);
      expect(pos.at(-1)!.start + pos.at(-1)!.width + r.leftover).toBeCloseTo(run, 6);
    },
  );
});
