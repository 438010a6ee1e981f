import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleRateBook, type ProjectInput } from './index.ts';
import { scarfOverlap, stockCutFor } from './stock-lengths.ts';

const eightFoot = [{ length: 96, priceCents: 700 }];

describe('stockCutFor', () => {
  // Buy the shortest length that holds the cut: common practice, no source.
  it('takes a cut from the shortest length that holds it', () => {
    const lengths = [...eightFoot, { length: 144, priceCents: 1100 }, { length: 192, priceCents: 1500 }];
    expect(stockCutFor(lengths, 90, 0.5)).toEqual({ stockLength: 96, pieces: [90], joints: 0 });
    expect(stockCutFor(lengths, 96, 0.5)).toEqual({ stockLength: 96, pieces: [96], joints: 0 });
    expect(stockCutFor(lengths, 111.375, 0.5)).toEqual({ stockLength: 144, pieces: [111.375], joints: 0 });
    expect(stockCutFor(lengths, 150, 0.5)).toEqual({ stockLength: 192, pieces: [150], joints: 0 });
  });

  // Source: This Old House, "Splicing Molding" — a splice is a scarf joint of two 45° bevels; a 45° bevel
  // through a 1/2 in moulding runs 1/2 in along it (tan 45° = 1), so the pieces overlap 1/2 in (computed here).
  it('joins a cut longer than every length, with a scarf overlap of the moulding thickness', () => {
    expect(scarfOverlap(0.5)).toBe(0.5);
    // 111.375 in from 96 in stock: two pieces of (111.375 + 0.5) / 2 = 55.9375 in.
    expect(stockCutFor(eightFoot, 111.375, 0.5)).toEqual({ stockLength: 96, pieces: [55.9375, 55.9375], joints: 1 });
    // 200 in: two pieces would be 100.25 in, too long; three of (200 + 2 × 0.5) / 3 = 67 in.
    expect(stockCutFor(eightFoot, 200, 0.5)).toEqual({ stockLength: 96, pieces: [67, 67, 67], joints: 2 });
  });

  fcTest.prop([fc.double({ min: 1, max: 2000, noNaN: true }), fc.constantFrom(24, 96, 144, 240), fc.double({ min: 0.125, max: 2, noNaN: true })])(
    'every piece fits the stock, and the pieces less their overlaps make the run',
    (cut, stock, thickness) => {
      const c = stockCutFor([{ length: stock, priceCents: 1 }], cut, thickness);
      for (const p of c.pieces) expect(p).toBeLessThanOrEqual(stock + 1e-9);
      expect(c.pieces).toHaveLength(c.joints + 1);
      const total = c.pieces.reduce((s, p) => s + p, 0) - c.joints * Math.min(thickness, stock / 2);
      expect(total).toBeCloseTo(cut, 6);
    },
  );
});

describe('picture-frame moulding on a tall full-height wall', () => {
  // Ceiling 210 in, 5-1/4 in baseboard, 4 in margins, two rows 4 in apart: each frame is
  // (210 − 5.25 − 8 − 4) / 2 = 96.375 in tall, longer than the 96 in moulding (computed here).
  const tallWall = (ceilingHeight: number): ProjectInput => ({
    rooms: [{ name: 'Stair hall', ceilingHeight, walls: [{ length: 180 }], treatment: { id: 'picture-frame', height: 'full' } }],
    builtBefore1978: 'no',
    measuredBy: 'homeowner-tape',
  });

  it('joins the frame sides that are longer than the moulding and says so', () => {
    const e = estimate(tallWall(210), sampleRateBook());
    const wall = e.takeoff.rooms[0]!.walls[0]!;
    // 172 in between the margins: round((172 + 4) / (30 + 4)) = 5 frames a row, 2 rows.
    expect(wall.frames).toMatchObject({ count: 10, height: 96.375 });
    const moulding = e.takeoff.materials.find((m) => m.id === 'moulding:frame-moulding')!;
    // Per frame: two tops and bottoms, and two sides each joined from two pieces.
    expect(moulding.cuts).toBe(10 * 6);
    expect(e.takeoff.notes.join(' ')).toMatch(/longer than the longest moulding \(8'\), so they are joined: 20 scarf joints/);
  });

  it('answers for the tallest ceiling the form allows', () => {
    const e = estimate(tallWall(240), sampleRateBook());
    expect(e.takeoff.rooms[0]!.walls[0]!.frames!.height).toBe(111.375);
    expect(e.price.totalCents).toBeGreaterThan(0);
  });

  it('prices long sides from a longer length when the rate book lists one', () => {
    const rb = sampleRateBook();
    rb.catalogue.mouldings.find((m) => m.id === 'frame-moulding')!.longerLengths = [{ length: 144, priceCents: 1100 }];
    const e = estimate(tallWall(240), rb);
    const short = e.takeoff.materials.find((m) => m.id === 'moulding:frame-moulding')!;
    const long = e.takeoff.materials.find((m) => m.id === 'moulding:frame-moulding@144')!;
    expect(short.cuts).toBe(20);
    expect(long).toMatchObject({ cuts: 20, stockLength: 144, unitCents: 1100, label: "Panel moulding, 8 ft, in 12' lengths" });
    expect(e.takeoff.notes.join(' ')).not.toMatch(/scarf/);
  });

  it('refuses a longer length that is not longer', () => {
    const rb = sampleRateBook() as any;
    rb.catalogue.mouldings[2].longerLengths = [{ length: 96, priceCents: 1100 }];
    expect(() => parseRateBook(rb)).toThrow(
      expect.objectContaining({ fields: { 'rateBook.catalogue.mouldings.2.longerLengths.0.length': 'A longer length must be longer than the stock length.' } }),
    );
  });
});
