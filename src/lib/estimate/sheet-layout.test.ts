import { fc, test as fcTest } from '@fast-check/vitest';
import { packer } from 'guillotine-packer';
import { describe, expect, it } from 'vitest';
import { piecesPerSheet } from './sheet-layout.ts';

const SHEET = { width: 48, height: 96 };

/** The most pieces guillotine-packer (npm, MIT; an independent implementation) puts on one sheet. */
function referenceCount(sheet: { width: number; height: number }, piece: { width: number; height: number }, kerf: number, rotate = true): number {
  const bound = Math.floor((sheet.width * sheet.height) / (piece.width * piece.height));
  if (bound === 0) return 0;
  const fits = (w: number, h: number): boolean => w <= sheet.width && h <= sheet.height;
  if (!fits(piece.width, piece.height) && !(rotate && fits(piece.height, piece.width))) return 0;
  // The library checks the size before turning a piece, so hand it the orientation that fits.
  const [w, h] = fits(piece.width, piece.height) ? [piece.width, piece.height] : [piece.height, piece.width];
  const items = Array.from({ length: bound + 1 }, (_, i) => ({ name: `p${i}`, width: w, height: h }));
  const result = packer({ binWidth: sheet.width, binHeight: sheet.height, items }, { kerfSize: kerf, allowRotation: rotate });
  if (!result) return 0;
  return Math.max(0, ...result.map((bin) => bin.length));
}

describe('piecesPerSheet', () => {
  // Source: common practice, no source — a 4 × 8 ft sheet yields 25 strips 4-1/2 × 35 in when the layout mixes orientations.
  it('gets 25 strips 4-1/2 × 35 in from a 4 × 8 sheet by mixing orientations', () => {
    expect(piecesPerSheet(SHEET, { width: 4.5, height: 35 })).toBe(25);
    // Without turning pieces only the grid is possible: 10 across × 2 down.
    expect(piecesPerSheet(SHEET, { width: 4.5, height: 35 }, { rotate: false })).toBe(20);
  });

  // Source: docs/sources.md §9 [computed here] — strips from a 48 in width satisfy n·w + (n − 1)·k ≤ 48.
  it.each([
    [{ width: 6, height: 96 }, 0, 8],
    [{ width: 6, height: 96 }, 0.125, 7],
    [{ width: 6, height: 96 }, 3 / 32, 7],
    [{ width: 5.875, height: 96 }, 0.125, 8],
    [{ width: 12, height: 12 }, 0, 32],
    [{ width: 12, height: 12 }, 0.125, 21],
    [{ width: 11.875, height: 11.875 }, 0.125, 32],
  ])('cuts %o with kerf %d: %d pieces', (piece, kerf, expected) => {
    expect(piecesPerSheet(SHEET, piece, { kerf })).toBe(expected);
  });

  it('is zero when the piece does not fit and refuses nonsense sizes', () => {
    expect(piecesPerSheet(SHEET, { width: 50, height: 100 })).toBe(0);
    expect(() => piecesPerSheet(SHEET, { width: -1, height: 10 })).toThrow(/piece/);
    expect(() => piecesPerSheet({ width: 0, height: 10 }, { width: 1, height: 1 })).toThrow(/sheet/);
    expect(() => piecesPerSheet(SHEET, { width: 1, height: 1 }, { kerf: -0.1 })).toThrow(/kerf/);
  });

  // Source: guillotine-packer 1.0.2 (npm registry, MIT), an independent guillotine packing library — ours is never worse.
  it('is never worse than guillotine-packer on trade sizes', () => {
    for (const [w, h] of [
      [4.5, 35],
      [5.875, 90.75],
      [3.5, 26.5],
      [7.25, 30],
      [15, 40],
      [23.5, 31],
    ] as const) {
      for (const kerf of [0, 0.125]) {
        const ours = piecesPerSheet(SHEET, { width: w, height: h }, { kerf });
        expect(ours).toBeGreaterThanOrEqual(referenceCount(SHEET, { width: w, height: h }, kerf));
      }
    }
  });

  fcTest.prop(
    [
      fc.integer({ min: 24, max: 60 }),
      fc.integer({ min: 24, max: 120 }),
      fc.integer({ min: 3, max: 40 }),
      fc.integer({ min: 3, max: 60 }),
      fc.constantFrom(0, 0.125, 0.09375),
      fc.boolean(),
    ],
    { numRuns: 60 },
  )('random cases: never worse than guillotine-packer, never above the area bound', (W, H, w, h, kerf, rotate) => {
    const sheet = { width: W, height: H };
    const piece = { width: w, height: h };
    const ours = piecesPerSheet(sheet, piece, { kerf, rotate });
    // Source: guillotine-packer 1.0.2 (npm) as the independent reference.
    expect(ours).toBeGreaterThanOrEqual(referenceCount(sheet, piece, kerf, rotate));
    // Area bound with kerf: each piece takes at least (w + k)(h + k) of the (W + k)(H + k) grown sheet.
    expect(ours).toBeLessThanOrEqual(Math.floor(((W + kerf) * (H + kerf)) / ((w + kerf) * (h + kerf)) + 1e-9));
    // Never below the plain grid in either orientation.
    const grid = Math.floor((W + kerf) / (w + kerf)) * Math.floor((H + kerf) / (h + kerf));
    expect(ours).toBeGreaterThanOrEqual(grid);
  });
});
