import { describe, expect, it } from 'vitest';
import { parseRateBook, sampleRateBook, takeoff, type ProjectInput } from './index.ts';
import { stockPiecesSolved } from './stock-cutting.ts';
import { estimatedQuantity, exactQuantity, sheetQuantity } from './waste-rule.ts';

// Source: docs/sources.md §47 — an exact layout already counts its offcuts; only estimates get the waste factor.
const tenPercent = { waste: 0.1, defect: 0 };

describe('waste rule', () => {
  it('adds the waste factor only to estimates, the defect allowance to exact quantities', () => {
    // Computed here: ceil(12 × 1.0) = 12; ceil(12 × 1.02) = ceil(12.24) = 13; ceil(12 × 1.1) = ceil(13.2) = 14.
    expect(exactQuantity(12, tenPercent)).toBe(12);
    expect(exactQuantity(12, { waste: 0.1, defect: 0.02 })).toBe(13);
    expect(estimatedQuantity(12, tenPercent)).toBe(14);
    // An estimate never gets less than the defect allowance: ceil(10 × 1.2) = 12.
    expect(estimatedQuantity(10, { waste: 0.05, defect: 0.2 })).toBe(12);
  });

  it('sheets always keep the waste factor: their count adds per-size layouts', () => {
    // Computed here: 7 pieces at 3 a sheet = 2 whole sheets + 1/3: estimate 7/3 × 1.1 = 2.57 → 3, and
    // never below 2 + ceil(1/3) = 3 whole sheets: 3.
    expect(sheetQuantity([{ count: 7, perSheet: 3 }], tenPercent)).toMatchObject({ quantity: 3, exact: false, wholeSheets: 2, partSizes: 1 });
    // 6 at 3 and 5 at 1: 7 whole sheets, × 1.1 = 7.7 → 8.
    expect(
      sheetQuantity(
        [
          { count: 6, perSheet: 3 },
          { count: 5, perSheet: 1 },
        ],
        tenPercent,
      ),
    ).toMatchObject({ quantity: 8, exact: false });
  });

  it('sheets: two sizes sharing part-filled sheets are an estimate with waste', () => {
    // Computed here: 8 strips at 8 a sheet = 1 whole; 3 at 8 and 5 at 8 leave 3/8 + 5/8 = 1 sheet shared.
    // Estimate: (1 + 1) × 1.1 = 2.2 → 3. Never below the exact count of the same sheets: 1 + ceil(1) = 2.
    const c = sheetQuantity(
      [
        { count: 8, perSheet: 8 },
        { count: 3, perSheet: 8 },
        { count: 5, perSheet: 8 },
      ],
      tenPercent,
    );
    expect(c).toMatchObject({ quantity: 3, exact: false, wholeSheets: 1, partSizes: 2 });
    expect(c.mixedFraction).toBeCloseTo(1, 9);
  });

  it('stock lengths: exact up to the branch-and-bound limit, estimated beyond', () => {
    // Source: docs/sources.md §12 — cuts come from one stock when Σc + (n − 1)·kerf ≤ L.
    // Computed here: 20 cuts of 30 in from 96 in stock, three a length (90 + 2 × 1/8 ≤ 96): 7 lengths, exact.
    expect(stockPiecesSolved(Array(20).fill(30), 96, 0.125)).toEqual({ count: 7, exact: true });
    // 21 cuts: first fit decreasing answers (7 lengths, the optimum), but it is not proven, so an estimate.
    expect(stockPiecesSolved(Array(21).fill(30), 96, 0.125)).toEqual({ count: 7, exact: false });
  });

  it('beadboard wainscot: sheets keep the waste factor', () => {
    // Realistic job (invented demo prices): a 12 ft wall, beadboard to 36 in over a 5-1/4 in baseboard.
    // Computed here: band 36 − 5.25 = 30.75 in; 144 / 48 = 3 panels of 48 × 30.75 in; a 4 × 8 ft sheet
    // gives 3 (3 × 30.75 + 2 × 1/8 = 92.5 ≤ 96; docs/sources.md §9): 1 sheet, and with the demo's
    // 10 % waste ceil(1 × 1.1) = 2.
    const p: ProjectInput = {
      rooms: [{ name: 'Hall', ceilingHeight: 96, walls: [{ length: 144 }], treatment: { id: 'beadboard', height: 'wainscot', wainscotHeight: 36 } }],
      builtBefore1978: 'no',
      measuredBy: 'site-measure',
    };
    const rb = parseRateBook(sampleRateBook());
    const line = takeoff(p, rb.catalogue).materials.find((m) => m.id.startsWith('sheet:'))!;
    expect(line).toMatchObject({ needed: 1, quantity: 2, piecesPerSheet: 3 });
    expect(line.basis).toMatch(/\(estimated\), plus 10 % waste/);
  });

  it('an older rate book without a defect allowance parses, with 0', () => {
    const old = sampleRateBook();
    delete (old.catalogue as { defectAllowance?: number }).defectAllowance;
    expect(parseRateBook(old).catalogue.defectAllowance).toBe(0);
  });
});
