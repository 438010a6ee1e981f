import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rakedBandArea, rakedUpright, skirtLength, stairErrors, stairGeometry, stairNotes, stairSchema } from './stair-wall.ts';

// Hand-worked job: 12 treads of 10-1/2 in, risers 7-1/2 in, on a 150 in wall, board-and-batten wainscot
// 36 in above the nosing line, a 1x6 skirt board (5-1/2 in dressed, Source: docs/sources.md §42 — DOC PS 20),
// 1x3 battens (2-1/2 in dressed, same source).
const stair = stairSchema.parse({ steps: 12, rise: 7.5, run: 10.5 });
const g = stairGeometry(150, stair);

describe('stair wall geometry (hand-worked job)', () => {
  it('rake angle, run and climb', () => {
    // Source: docs/sources.md §40 — atan(7.5 / 10.5) = atan(0.714286) ≈ 35.54°; run 12 × 10.5 = 126 in; climb 12 × 7.5 = 90 in.
    expect((g.angle * 180) / Math.PI).toBeCloseTo(35.54, 2);
    expect(g.runLength).toBe(126);
    expect(g.climb).toBe(90);
    expect(g.rake).toEqual([
      { x: 0, y: 0 },
      { x: 126, y: 90 },
    ]);
    // Level beyond the stair, at the top of the climb.
    expect(g.nosingAt(140)).toBe(90);
    // From the right end the line is mirrored.
    const r = stairGeometry(150, { ...stair, startsAt: 'right' });
    expect(r.rake).toEqual([
      { x: 150, y: 0 },
      { x: 24, y: 90 },
    ]);
    expect(r.nosingAt(150 - 21)).toBeCloseTo(15, 9); // two treads in: 2 × 7.5
  });

  it('skirt board length along the rake', () => {
    // Source: docs/sources.md §40 — 12 × √(7.5² + 10.5²) = 12 × √166.5 = 12 × 12.9035 ≈ 154.84 in.
    expect(skirtLength(stair)).toBeCloseTo(154.84, 2);
  });

  it('band area of a raked wainscot is vertical height × horizontal length', () => {
    // Source: docs/sources.md §40 — parallelogram area = vertical height × horizontal length.
    // (36 − 5.5) × 150 = 30.5 × 150 = 4575 sq in ≈ 31.77 sq ft.
    expect(rakedBandArea(150, g, 5.5, { wainscot: 36 })).toBeCloseTo(4575, 6);
  });

  it('band area full height: level ceiling, raked bottom', () => {
    // (200 − 5.5) × 150 = 29175; under the nosing line: triangle 90 × 126 / 2 = 5670, level part 90 × 24 = 2160;
    // 29175 − 7830 = 21345 sq in.
    expect(rakedBandArea(150, g, 5.5, { ceiling: 200 })).toBeCloseTo(21345, 6);
  });

  it('battens are cut to the rake at the long point', () => {
    // Source: docs/sources.md §40 — the rake adds w × tan θ over a member's width: 2.5 × 7.5 / 10.5 ≈ 1.786 in.
    // On the nosing line itself (no skirt): 36 + 1.786 ≈ 37.786 in, two rake cuts.
    expect(rakedUpright(g, 30, 2.5, 0, { wainscot: 36 })).toEqual({ longPoint: expect.closeTo(37.786, 3), rakeCuts: 2 });
    // Standing on the skirt board: 30.5 + 1.786 ≈ 32.286 in.
    expect(rakedUpright(g, 30, 2.5, 5.5, { wainscot: 36 }).longPoint).toBeCloseTo(32.286, 3);
    // Full height under a 200 in ceiling, at x = 30: low point of the nosing 30 × 7.5/10.5 ≈ 21.429;
    // 200 − (21.429 + 5.5) ≈ 173.071 in, one rake cut.
    expect(rakedUpright(g, 30, 2.5, 5.5, { ceiling: 200 })).toEqual({ longPoint: expect.closeTo(173.071, 3), rakeCuts: 1 });
    // On the level part: square cuts only.
    expect(rakedUpright(g, 140, 2.5, 5.5, { wainscot: 36 })).toEqual({ longPoint: 30.5, rakeCuts: 0 });
  });
});

describe('stair wall checks', () => {
  it('a stair longer than the wall is refused, naming the wall', () => {
    const e = stairErrors('Stair wall', 100, stair, 'imperial', { skirt: 5.5, ceiling: 200, full: false, wainscot: 36 });
    expect(e['stair.steps']).toMatch(/^Stair wall: 12 steps/);
  });
  it('full height must leave band above the top of the stair', () => {
    // 90 + 5.5 + 12 = 107.5 in > 96 in ceiling.
    const e = stairErrors('Stair wall', 150, stair, 'imperial', { skirt: 5.5, ceiling: 96, full: true, wainscot: 0 });
    expect(e['stair.rise']).toMatch(/^Stair wall: the stair climbs/);
    expect(stairErrors('Stair wall', 150, stair, 'imperial', { skirt: 5.5, ceiling: 200, full: true, wainscot: 0 })).toEqual({});
  });
  it('code limits are notes, not refusals', () => {
    // Source: docs/sources.md §41 — IRC R311.7.5: riser ≤ 7-3/4 in, tread ≥ 10 in.
    expect(stairNotes('Stair wall', stair, 'imperial')).toEqual([]);
    expect(stairNotes('Stair wall', { ...stair, rise: 8, run: 9 }, 'imperial')).toHaveLength(2);
    expect(stairSchema.safeParse({ steps: 12, rise: 8, run: 9 }).success).toBe(true);
    expect(stairSchema.safeParse({ steps: 12, rise: 40, run: 9 }).success).toBe(false);
  });
});

describe('monotone in wall length and steps', () => {
  it('a longer wall or more steps never needs less skirt, fewer rake cuts or less wainscot area', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 15 }),
        fc.integer({ min: 0, max: 5 }),
        fc.integer({ min: 0, max: 120 }),
        fc.integer({ min: 1, max: 60 }),
        (steps, moreSteps, extra, more) => {
          const s = stairSchema.parse({ steps, rise: 7.5, run: 10.5 });
          const s2 = { ...s, steps: steps + moreSteps };
          const len = s2.steps * s2.run + extra;
          const cuts = (st: typeof s, L: number): number => {
            const gg = stairGeometry(L, st);
            let n = 0;
            for (let x = 0; x + 2.5 <= L; x += 16) n += rakedUpright(gg, x, 2.5, 5.5, { wainscot: 36 }).rakeCuts;
            return n;
          };
          expect(skirtLength(s2)).toBeGreaterThanOrEqual(skirtLength(s));
          expect(cuts(s2, len)).toBeGreaterThanOrEqual(cuts(s, len));
          expect(rakedBandArea(len + more, stairGeometry(len + more, s), 5.5, { wainscot: 36 })).toBeGreaterThanOrEqual(
            rakedBandArea(len, stairGeometry(len, s), 5.5, { wainscot: 36 }),
          );
        },
      ),
      { numRuns: 100, seed: 20261202 },
    );
  });
});
