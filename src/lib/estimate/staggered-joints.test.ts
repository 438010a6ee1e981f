import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleRateBook, takeoff, type ProjectInput } from './index.ts';
import { DEFAULT_STUD_SPACING, shortestJoinedPiece, staggeredRow, staggeredRows } from './staggered-joints.ts';

const rateBook = parseRateBook(sampleRateBook());

describe('staggeredRow: joints on studs, clear of the row below', () => {
  it('lays a 14 ft wall in 8 ft boards, studs 16 in on centre', () => {
    // Source: docs/sources.md §45 — studs 16 in on centre, the first at the wall's left end: 0, 16, … 160.
    // Computed here: row 1 runs to the farthest stud within 96 in, 96 (6 bays), then 168 − 96 = 72 in.
    // Row 2 may not joint at 96, so it stops one bay short, at 80, then 168 − 80 = 88 in. Row 3 is row 1 again.
    const [r1, r2, r3] = staggeredRows([[[0, 168]], [[0, 168]], [[0, 168]]], 96, 16).map((r) => r[0]!);
    expect(r1).toEqual({ pieces: [96, 72], joints: [96] });
    expect(r2).toEqual({ pieces: [80, 88], joints: [80] });
    expect(r3).toEqual({ pieces: [96, 72], joints: [96] });
    expect(DEFAULT_STUD_SPACING).toBe(16);
  });

  it('joins a row longer than two boards on studs too', () => {
    // Computed here: a 20 ft (240 in) row: 0 → 96 → 192 → 240; above it 0 → 80 → 176 → 240.
    expect(staggeredRow({ x0: 0, x1: 240, stock: 96 })).toEqual({ pieces: [96, 96, 48], joints: [96, 192] });
    expect(staggeredRow({ x0: 0, x1: 240, stock: 96, below: [96, 192] })).toEqual({ pieces: [80, 96, 64], joints: [80, 176] });
  });

  it('starts a stretch beside an opening off a stud and still joints on one', () => {
    // Computed here: a stretch from 40 in (a door's edge) to 200 in: the farthest stud ≤ 40 + 96 = 136 is 128.
    expect(staggeredRow({ x0: 40, x1: 200, stock: 96 })).toEqual({ pieces: [88, 72], joints: [128] });
    // A row that fits one board has no joint.
    expect(staggeredRow({ x0: 0, x1: 96, stock: 96 })).toEqual({ pieces: [96], joints: [] });
  });

  it('falls back to full lengths when no stud is in reach (stock shorter than two bays)', () => {
    // Computed here: 24 in stock, studs 24 in apart from 0: from 0 the only stud in [12, 24] is 24, a joint;
    // with a first stud at 30, none is in reach, so the piece is a full 24 in.
    expect(staggeredRow({ x0: 0, x1: 60, stock: 24, studSpacing: 24, firstStud: 30 }).pieces).toEqual([24, 24, 12]);
  });

  it('bounds the pieces for sizing', () => {
    // Computed here: max(96 / 2, 96 − 2 × 16) = 64; max(48 / 2, 48 − 2 × 16) = 24.
    expect(shortestJoinedPiece(96, 16)).toBe(64);
    expect(shortestJoinedPiece(48, 16)).toBe(24);
  });

  // Property (docs/sources.md §45; common practice, no source for the stagger): every joint on a stud,
  // no joint shared with the row below, every piece within the stock, the pieces add up to the row.
  fcTest.prop(
    [
      fc.record({
        length: fc.integer({ min: 12, max: 1200 }),
        spacing: fc.constantFrom(12, 16, 19.2, 24),
        bays: fc.integer({ min: 4, max: 10 }),
        extra: fc.integer({ min: 0, max: 11 }),
        rows: fc.integer({ min: 2, max: 12 }),
      }),
    ],
    { numRuns: 100, seed: 20261202 },
  )('rows of boards keep every joint on a stud and staggered', ({ length, spacing, bays, extra, rows }) => {
    // Stock of at least four bays (the rule's guarantee), up to 11 in more.
    const stock = bays * spacing + extra;
    const laid = staggeredRows(
      Array.from({ length: rows }, () => [[0, length] as const]),
      stock,
      spacing,
    ).map((r) => r[0]!);
    laid.forEach((row, i) => {
      expect(row.pieces.reduce((s, p) => s + p, 0)).toBeCloseTo(length, 6);
      for (const p of row.pieces) expect(p).toBeLessThanOrEqual(stock + 1e-6);
      for (const j of row.joints) expect(Math.abs(j / spacing - Math.round(j / spacing))).toBeLessThan(1e-6);
      if (i > 0) for (const j of row.joints) expect(laid[i - 1]!.joints.some((b) => Math.abs(b - j) < 1e-6)).toBe(false);
    });
  });
});

describe('horizontal shiplap joined on studs', () => {
  const job = (length: number, height: 'wainscot' | 'full' = 'wainscot'): ProjectInput => ({
    rooms: [
      {
        name: 'Den',
        ceilingHeight: 96,
        walls: [{ length }],
        treatment: { id: 'shiplap-horizontal', height, ...(height === 'wainscot' ? { wainscotHeight: 36 } : {}) },
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'site-measure',
  });

  it('a 12 ft wainscot wall in 8 ft milled shiplap: rows, pieces, joints and stock', () => {
    // Realistic job, worked by hand (invented demo prices; sizes docs/sources.md §1, studs §45):
    // Band: top of the 5-1/4 in baseboard to the 36 in wainscot = 30.75 in. 1x6 shiplap shows 5.125 in
    // with a 1/8 in reveal: 5 full rows take 5 × 5.25 = 26.25 in, the 6th is ripped to 4.5 in: 6 rows.
    // Studs at 0, 16, … 144. Rows 1, 3, 5: 96 + 48 in, joint at 96. Rows 2, 4, 6: 80 + 64 in, joint at 80.
    // Cuts: 3 × 96, 3 × 48, 3 × 80, 3 × 64 = 12 cuts, 864 in (72 ft). No two fit one 96 in board
    // (48 + 48 + 1/8 kerf = 96.125; 48 + 64 = 112), so 12 boards, exactly (12 cuts ≤ 20: exact search).
    // Bought: an exact layout gets no waste factor (and the demo has no defect allowance): 12.
    const t = takeoff(job(144), rateBook.catalogue);
    const boards = t.rooms[0]!.walls[0]!.pieces.filter((p) => p.role === 'board');
    expect(t.rooms[0]!.walls[0]!.boards!.count).toBe(6);
    const rows = [...new Set(boards.map((b) => b.y))].map((y) => boards.filter((b) => b.y === y).map((b) => b.width));
    expect(rows).toEqual([
      [96, 48],
      [80, 64],
      [96, 48],
      [80, 64],
      [96, 48],
      [80, 64],
    ]);
    const line = t.materials.find((m) => m.id === 'board:shiplap-1x6-8')!;
    // An exact layout: no waste on top, and the demo rate book has no defect allowance: 12 bought.
    expect(line).toMatchObject({ needed: 12, quantity: 12, cuts: 12 });
    expect(line.basis).toMatch(/exact layout so no waste is added/);
  });

  it('a 14 ft full-height wall: joints alternate 96 / 80 in, and it costs no less than a 12 ft one', () => {
    // Computed here: 168 in rows alternate 96 + 72 and 80 + 88 (see the 14 ft row test above).
    const t = takeoff(job(168, 'full'), rateBook.catalogue);
    const boards = t.rooms[0]!.walls[0]!.pieces.filter((p) => p.role === 'board');
    const firstTwo = [...new Set(boards.map((b) => b.y))].slice(0, 2).map((y) => boards.filter((b) => b.y === y).map((b) => b.width));
    expect(firstTwo).toEqual([
      [96, 72],
      [80, 88],
    ]);
    expect(estimate(job(168, 'full'), rateBook).price.totalCents).toBeGreaterThanOrEqual(estimate(job(144, 'full'), rateBook).price.totalCents);
  });

  // Property (common practice, no source): a longer or taller horizontal shiplap wall never costs less.
  const noMinimum = { ...rateBook, minimumJobCents: 0 };
  fcTest.prop(
    [
      fc.record({
        length: fc.integer({ min: 24, max: 480 }),
        more: fc.oneof(fc.integer({ min: 1, max: 20 }), fc.integer({ min: 1, max: 240 })),
        height: fc.constantFrom('wainscot' as const, 'full' as const),
        ceiling: fc.integer({ min: 84, max: 120 }),
      }),
    ],
    { numRuns: 100, seed: 20261202 },
  )('more horizontal shiplap never costs less', ({ length, more, height, ceiling }) => {
    const p = (l: number): ProjectInput => ({
      rooms: [{ name: 'Den', ceilingHeight: ceiling, walls: [{ length: l }], treatment: { id: 'shiplap-horizontal', height } }],
      builtBefore1978: 'no',
      measuredBy: 'site-measure',
    });
    expect(estimate(p(length + more), noMinimum).price.totalCents).toBeGreaterThanOrEqual(estimate(p(length), noMinimum).price.totalCents);
  });
});
