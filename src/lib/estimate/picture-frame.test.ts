import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleRateBook, type ProjectInput } from './index.ts';

// A realistic picture-frame job, worked by hand: one 12 ft wall of a sitting room with a 36 in
// picture-frame wainscot, demo rate book (invented prices; physical sizes are real conventions).
const rateBook = parseRateBook(sampleRateBook());
const job: ProjectInput = {
  rooms: [
    {
      name: 'Sitting room',
      ceilingHeight: 96,
      walls: [{ label: 'Fireplace wall', length: 144 }],
      treatment: { id: 'picture-frame', height: 'wainscot', wainscotHeight: 36 },
    },
  ],
  builtBefore1978: 'no',
  measuredBy: 'site-measure',
};

describe('picture-frame wainscot on a 12 ft wall', () => {
  const e = estimate(job, rateBook);
  const wall = e.takeoff.rooms[0]!.walls[0]!;

  it('lays four 30 in frames centred in the wall', () => {
    // Band: top of the 5-1/4 in demo baseboard to 36 in = 30.75 in; 144 × 30.75 / 144 = 30.75 sq ft.
    expect(wall.netSqFt).toBeCloseTo(30.75, 9);
    // Frames keep a 4 in margin from baseboard, cap rail and wall ends: they span 9.25 to 32 in high
    // (22.75 in) and a stretch of 144 − 2 × 4 = 136 in. At the 30 in target with 4 in between,
    // ⌊(136 + 4) / (30 + 4)⌋ = 4 frames take 4 × 30 + 3 × 4 = 132 in, 2 in more margin each side.
    expect(wall.frames).toEqual({ count: 4, width: 30, height: 22.75 });
    const frames = wall.pieces.filter((p) => p.role === 'frame');
    expect(frames.map((f) => f.x)).toEqual([6, 40, 74, 108]);
  });

  it('cuts the frame moulding from five 8 ft lengths, an exact layout with no waste added', () => {
    // Source: docs/sources.md §12 — a 45° miter's long point equals the frame's outside size, so each
    // frame is 2 × 30 + 2 × 22.75 in: 16 cuts, 8 of 30 and 8 of 22.75 in, 422 in in all.
    // Lower bound ⌈422 / 96⌉ = 5 lengths. Five do it (1/8 in kerf between cuts, docs/sources.md §12):
    //   30+30+30 (90.25), 30+30+30 (90.25), 30+30+22.75 (83), 4 × 22.75 (91.375), 3 × 22.75 (68.5).
    // 16 cuts is inside the exact search, so no waste factor on top (docs/sources.md §47): 5 bought.
    const line = e.takeoff.materials.find((m) => m.id === 'moulding:frame-moulding')!;
    expect(line).toMatchObject({ cuts: 16, needed: 5, quantity: 5, stockLength: 96 });
    expect(line.basis).toMatch(/exact layout/);
  });

  it('runs the cap rail in two equal cuts with an inch at each end for fitting', () => {
    // Demo trim end allowance 1 in: 144 in will not come from one 96 in length (94 in usable), so two
    // cuts of 144 / 2 + 2 × 1 = 74 in, which cannot share a length (148 > 96): 2 lengths.
    expect(wall.capRailFeet).toBeCloseTo(12, 9);
    const cap = e.takeoff.materials.find((m) => m.id === 'moulding:cap-rail')!;
    expect(cap).toMatchObject({ cuts: 2, quantity: 2 });
  });
});

// Frames under a window: where the frames' band rises past a sill, the frames below the window are
// laid in the space under it (shorter), not dropped. Demo rate book without its minimum job, so a
// small wall's own price shows. The wainscot height is the default, a third of the ceiling
// (docs/sources.md §8), rounded to the inch.
describe('picture-frame wainscot under a window sill', () => {
  const noMinimum = { ...rateBook, minimumJobCents: 0 };
  const wallAt = (ceilingHeight: number, window: { width?: number; height?: number; sillHeight: number }) =>
    estimate(
      {
        rooms: [
          {
            name: 'Study',
            ceilingHeight,
            walls: [{ label: 'Window wall', length: 60, outlets: 0, openings: [{ kind: 'window', ...window }] }],
            treatment: { id: 'picture-frame', height: 'wainscot' },
          },
        ],
        builtBefore1978: 'no',
        measuredBy: 'site-measure',
      },
      noMinimum,
    );

  // Common practice, no source: a bigger wall never costs less (docs/sources.md §50).
  it('costs no less when the ceiling rises from 114 to 116 in and the band passes a 34 in sill', () => {
    const window = { sillHeight: 34 };
    expect(wallAt(116, window).price.totalCents).toBeGreaterThanOrEqual(wallAt(114, window).price.totalCents);
  });

  it('costs no less when the ceiling rises from 84 to 86 in past a 41 × 24 in window at 24 in', () => {
    const window = { width: 41, height: 24, sillHeight: 24 };
    expect(wallAt(86, window).price.totalCents).toBeGreaterThanOrEqual(wallAt(84, window).price.totalCents);
  });

  it('costs no less when a given wainscot rises from 24 to 25 in past a 44 × 24 in window at 20 in', () => {
    const at = (wainscotHeight: number) =>
      estimate(
        {
          rooms: [
            {
              name: 'Study',
              ceilingHeight: 96,
              walls: [{ length: 60, outlets: 0, openings: [{ kind: 'window', width: 44, height: 24, sillHeight: 20 }] }],
              treatment: { id: 'picture-frame', height: 'wainscot', wainscotHeight },
            },
          ],
          builtBefore1978: 'no',
          measuredBy: 'site-measure',
        },
        noMinimum,
      ).price.totalCents;
    expect(at(25)).toBeGreaterThanOrEqual(at(24));
  });

  it('lays a shorter frame under the sill and a full one beside the window', () => {
    // Worked by hand. Ceiling 116 in: wainscot top round(116 / 3) = 39 in; frames from 5.25 + 4 =
    // 9.25 in to 39 − 4 = 35 in (25.75 in tall). The counted 36 × 60 in window is set 3 in from the
    // left end (geometry.ts) with 2-1/4 in casings: it blocks 0.75 to 41.25 in, sill at 34 in.
    // Under it: 4 in margin below the sill, so frames from 9.25 to 30 in (20.75 in tall), across
    // 4 (the wall-end margin) to 41.25 in = 37.25 in: one 30 in frame centred, at 7.625 in.
    // Beside it: 41.25 + 4 = 45.25 to 60 − 4 = 56 in, 10.75 in wide, one frame the full 25.75 in.
    const wall = wallAt(116, { sillHeight: 34 }).takeoff.rooms[0]!.walls[0]!;
    const frames = wall.pieces.filter((p) => p.role === 'frame').map((p) => [p.x, p.y, p.width, p.height]);
    expect(frames).toEqual([
      [7.625, 9.25, 30, 20.75],
      [45.25, 9.25, 10.75, 25.75],
    ]);
    expect(wall.frames?.count).toBe(2);
  });
});
